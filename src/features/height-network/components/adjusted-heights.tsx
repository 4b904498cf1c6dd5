import type { AdjustmentView } from "../../../../shared/schemas/height-network";
import { formatHeight4M, formatMm } from "../lib/format";

const cell = "px-2 py-2 text-right tabular-nums";

export function AdjustedHeights({ points }: { points: AdjustmentView["points"] }) {
  return (
    <div className="overflow-x-auto rounded-xl border-2 border-line bg-surface">
      <table className="w-full border-collapse text-base">
        <caption className="sr-only">Adjusted heights</caption>
        <thead>
          <tr className="border-b-2 border-line text-sm">
            <th scope="col" className="px-2 py-2 text-left font-semibold">
              Mark
            </th>
            <th scope="col" className="px-2 py-2 text-right font-semibold">
              Height <span className="block font-normal text-muted">m</span>
            </th>
            <th scope="col" className="px-2 py-2 text-right font-semibold">
              σ <span className="block font-normal text-muted">mm</span>
            </th>
            <th scope="col" className="px-2 py-2 text-left font-semibold">
              Kind
            </th>
          </tr>
        </thead>
        <tbody>
          {points.map((p) => (
            <tr key={p.mark} className="border-b border-line">
              <th scope="row" className="px-2 py-2 text-left font-semibold">
                {p.mark}
              </th>
              <td className={cell}>{formatHeight4M(p.heightM)}</td>
              <td className={cell}>
                {p.fixed ? (
                  <>
                    fixed
                    {p.benchmarkSigmaM !== null && (
                      <span className="block text-xs text-muted">
                        published ±{formatMm(p.benchmarkSigmaM)}
                      </span>
                    )}
                  </>
                ) : (
                  formatMm(p.sigmaM, 2)
                )}
              </td>
              <td className="px-2 py-2 text-left">{p.fixed ? "Benchmark (fixed)" : "Adjusted"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
