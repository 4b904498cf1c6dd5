// Residuals with the standardized residual w and the redundancy number; a flagged blunder has a
// shape and a word, and can be left out for the next adjustment.
import type { AdjustmentView } from "../../../../shared/schemas/height-network";
import { Button } from "../../../components/button";
import { StatusShape } from "../../../components/status-shape";
import { formatDeltaM, formatMm, formatNumber } from "../lib/format";

const cell = "px-2 py-2 text-right tabular-nums";

interface Props {
  observations: AdjustmentView["observations"];
  /** Null without levelling.adjust: no action. */
  onLeaveOut: ((sourceId: string) => void) | null;
  pending: boolean;
}

const head = (label: string, unit = "") => (
  <th scope="col" className="px-2 py-2 text-right font-semibold">
    {label}
    {unit !== "" && <span className="block font-normal text-muted">{unit}</span>}
  </th>
);

export function ResidualsTable({ observations, onLeaveOut, pending }: Props) {
  return (
    <div className="overflow-x-auto rounded-xl border-2 border-line bg-surface">
      <table className="w-full border-collapse text-base">
        <caption className="sr-only">Residuals</caption>
        <thead>
          <tr className="border-b-2 border-line text-sm">
            <th scope="col" className="px-2 py-2 text-left font-semibold">
              From → to
            </th>
            {head("ΔH observed", "m")}
            {head("σ", "mm")}
            {head("Residual", "mm")}
            {head("w", "standardized")}
            {head("Redundancy", "r")}
            <th scope="col" className="px-2 py-2 text-left font-semibold">
              Check
            </th>
            {onLeaveOut && (
              <th scope="col" className="px-2 py-2">
                <span className="sr-only">Action</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody>
          {observations.map((o) => (
            <tr
              key={o.sourceId}
              className={o.flagged ? "border-b border-line bg-danger-soft" : "border-b border-line"}
            >
              <th scope="row" className="px-2 py-2 text-left font-semibold">
                {o.fromMark} → {o.toMark}
                <span className="block text-xs font-normal text-muted">
                  {o.source === "field-book" ? "Field book" : "Imported"}
                </span>
              </th>
              <td className={cell}>{formatDeltaM(o.deltaM)}</td>
              <td className={cell}>{formatMm(o.sigmaM, 2)}</td>
              <td className={cell}>{formatMm(o.residualM, 2)}</td>
              <td className={cell}>{formatNumber(o.standardized, 2)}</td>
              <td className={cell}>{formatNumber(o.redundancy, 2)}</td>
              <td className="px-2 py-2 text-left">
                {o.flagged ? (
                  <span className="flex items-center gap-2 font-semibold text-danger-ink">
                    <StatusShape shape="octagon" className="text-danger" />
                    Suspect blunder
                  </span>
                ) : (
                  <span className="flex items-center gap-2">
                    <StatusShape shape="disc" className="text-primary" />
                    Fits
                  </span>
                )}
              </td>
              {onLeaveOut && (
                <td className="px-1 py-1 text-right">
                  <Button
                    className="px-3"
                    disabled={pending}
                    aria-label={`Leave out ${o.fromMark} → ${o.toMark} and adjust again`}
                    onClick={() => onLeaveOut(o.sourceId)}
                  >
                    Leave out and adjust again
                  </Button>
                </td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
