// One instrument's stated figures: instability at 1 s, each systematic term and their total.
import { instrumentKindLabels, type InstrumentView } from "../../../../shared/schemas/instruments";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import { formatFractional } from "../lib/fractional";

export function InstrumentFigures({ instrument: i }: { instrument: InstrumentView }) {
  return (
    <div className="flex flex-col gap-4">
      <dl className="grid gap-3 rounded-xl border-2 border-line bg-surface p-4 tabular-nums sm:grid-cols-3">
        <div>
          <dt className="text-sm text-muted">Kind</dt>
          <dd className="font-semibold">{instrumentKindLabels[i.kind]}</dd>
        </div>
        <div>
          <dt className="text-sm text-muted">Instability at 1 s</dt>
          <dd className="font-semibold">{formatFractional(i.instabilityAt1s)}</dd>
        </div>
        <div>
          <dt className="text-sm text-muted">Systematic total (in quadrature)</dt>
          <dd className="font-semibold">{formatFractional(i.systematicTotal)}</dd>
        </div>
        {i.description !== "" && (
          <div className="sm:col-span-3">
            <dt className="text-sm text-muted">Description</dt>
            <dd>{i.description}</dd>
          </div>
        )}
        {i.notes !== "" && (
          <div className="sm:col-span-3">
            <dt className="text-sm text-muted">Notes</dt>
            <dd className="whitespace-pre-line">{i.notes}</dd>
          </div>
        )}
        <div className="sm:col-span-3">
          <dt className="text-sm text-muted">Last changed</dt>
          <dd>
            {formatUtc(i.updatedAt)}{" "}
            <span className="text-muted">({formatLocalBeside(i.updatedAt)})</span>
            {i.updatedByName !== null && ` by ${i.updatedByName}`} · version {i.version}
          </dd>
        </div>
      </dl>
      <div className="max-w-2xl overflow-x-auto rounded-xl border-2 border-line bg-surface">
        <table className="w-full border-collapse text-base">
          <caption className="px-3 pt-3 text-left text-lg font-semibold">
            Systematic uncertainty terms
          </caption>
          <thead className="text-sm">
            <tr className="border-b-2 border-line">
              <th scope="col" className="px-3 py-2 text-left font-semibold">
                Term
              </th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">
                Value <span className="block font-normal text-muted">fractional, 1σ</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {i.systematic.length === 0 && (
              <tr>
                <td colSpan={2} className="px-3 py-3 text-muted">
                  No systematic term stated.
                </td>
              </tr>
            )}
            {i.systematic.map((t) => (
              <tr key={t.name} className="border-b border-line">
                <th scope="row" className="px-3 py-2 text-left font-normal">
                  {t.name}
                </th>
                <td className="px-3 py-2 text-right tabular-nums">{formatFractional(t.value)}</td>
              </tr>
            ))}
          </tbody>
          {i.systematic.length > 0 && (
            <tfoot>
              <tr>
                <th scope="row" className="px-3 py-2 text-left font-semibold">
                  Total in quadrature
                </th>
                <td className="px-3 py-2 text-right font-semibold tabular-nums">
                  {formatFractional(i.systematicTotal)}
                </td>
              </tr>
            </tfoot>
          )}
        </table>
      </div>
    </div>
  );
}
