// The campaign's clocks and links: name, kind, stated instability at 1 s and systematic total.
import { Link } from "react-router-dom";
import { instrumentKindLabels, type InstrumentView } from "../../../../shared/schemas/instruments";
import { formatFractional } from "../lib/fractional";

const head = "px-3 py-2 font-semibold";
const number = "px-3 py-3 text-right whitespace-nowrap tabular-nums";

interface Props {
  instruments: readonly InstrumentView[];
  hrefOf: (instrumentId: string) => string;
  emptyText: string;
}

export function InstrumentList({ instruments, hrefOf, emptyText }: Props) {
  return (
    <div className="overflow-x-auto rounded-xl border-2 border-line bg-surface">
      <table className="w-full border-collapse text-base">
        <caption className="sr-only">Clocks and links of this campaign</caption>
        <thead className="bg-sunken text-sm">
          <tr>
            <th scope="col" className={`${head} text-left`}>
              Name
            </th>
            <th scope="col" className={`${head} text-left`}>
              Kind
            </th>
            <th scope="col" className={`${head} text-right`}>
              Instability at 1 s <span className="block font-normal text-muted">fractional</span>
            </th>
            <th scope="col" className={`${head} text-right`}>
              Systematic total <span className="block font-normal text-muted">in quadrature</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {instruments.length === 0 && (
            <tr>
              <td colSpan={4} className="px-3 py-3 text-muted">
                {emptyText}
              </td>
            </tr>
          )}
          {instruments.map((i) => (
            <tr key={i.id} className="border-t border-line align-top">
              <th scope="row" className="px-3 py-0 text-left font-normal">
                <Link
                  to={hrefOf(i.id)}
                  className="inline-flex min-h-touch items-center text-lg font-semibold"
                >
                  {i.name}
                </Link>
                {i.description !== "" && (
                  <span className="block pb-2 text-sm text-muted">{i.description}</span>
                )}
              </th>
              <td className="px-3 py-3 text-left">{instrumentKindLabels[i.kind]}</td>
              <td className={number}>{formatFractional(i.instabilityAt1s)}</td>
              <td className={number}>
                {formatFractional(i.systematicTotal)}
                <span className="block text-sm text-muted">
                  {i.systematic.length} {i.systematic.length === 1 ? "term" : "terms"}
                </span>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
