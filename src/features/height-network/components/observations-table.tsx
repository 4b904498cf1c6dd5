// The network as it stands: field-book sections and imported ties, each with its σ (its own, or
// from σ per √km when it has none).
import type { NetworkObservationView } from "../api/get-observations";
import { formatDeltaM, formatKm, formatMm } from "../lib/format";

const cell = "px-2 py-2 text-right tabular-nums";

interface Props {
  observations: readonly NetworkObservationView[];
  sigmaPerSqrtKmMm: number;
}

export function ObservationsTable({ observations, sigmaPerSqrtKmMm }: Props) {
  return (
    <div className="overflow-x-auto rounded-xl border-2 border-line bg-surface">
      <table className="w-full border-collapse text-base">
        <caption className="sr-only">Observations of the network</caption>
        <thead>
          <tr className="border-b-2 border-line text-sm">
            <th scope="col" className="px-2 py-2 text-left font-semibold">
              From → to
            </th>
            <th scope="col" className="px-2 py-2 text-left font-semibold">
              Source
            </th>
            <th scope="col" className="px-2 py-2 text-right font-semibold">
              ΔH <span className="block font-normal text-muted">m</span>
            </th>
            <th scope="col" className="px-2 py-2 text-right font-semibold">
              Length <span className="block font-normal text-muted">km</span>
            </th>
            <th scope="col" className="px-2 py-2 text-right font-semibold">
              σ <span className="block font-normal text-muted">mm</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {observations.length === 0 && (
            <tr>
              <td colSpan={5} className="px-3 py-3 text-muted">
                No observation yet: close a field-book section or import height ties.
              </td>
            </tr>
          )}
          {observations.map((o) => (
            <tr key={o.sourceId} className="border-b border-line">
              <th scope="row" className="px-2 py-2 text-left font-semibold">
                {o.fromMark} → {o.toMark}
              </th>
              <td className="px-2 py-2 text-left">
                {o.source === "field-book" ? "Field book" : `Imported: ${o.origin}`}
              </td>
              <td className={cell}>{formatDeltaM(o.deltaM)}</td>
              <td className={cell}>{formatKm(o.lengthKm)}</td>
              <td className={cell}>
                {o.sigmaM !== null ? (
                  formatMm(o.sigmaM, 2)
                ) : (
                  <>
                    {formatMm((sigmaPerSqrtKmMm / 1000) * Math.sqrt(o.lengthKm), 2)}
                    <span className="block text-xs text-muted">from length</span>
                  </>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
