// The campaign's benchmarks: code and description, position, published height ± σ, height system
// and datum, source. On phones each row stacks into a card.
import type { BenchmarkView } from "../../../../shared/schemas/benchmarks";
import { Button } from "../../../components/button";
import { formatLatitude, formatLongitude } from "../../../lib/format";
import { formatPublishedHeightM, formatSigmaMm } from "../lib/format";

const head = "px-3 py-2 font-semibold";
const cell = "px-3 py-3 max-sm:py-1";

interface Props {
  benchmarks: readonly BenchmarkView[];
  /** Opens a benchmark's edit form, or null when the person may not edit. */
  onEdit: ((benchmark: BenchmarkView) => void) | null;
}

function Row({ b, onEdit }: { b: BenchmarkView; onEdit: Props["onEdit"] }) {
  return (
    <tr className="border-t border-line align-top max-sm:flex max-sm:flex-wrap max-sm:gap-x-4 max-sm:py-2">
      <th scope="row" className={`${cell} text-left font-normal max-sm:w-full`}>
        <span className="block text-lg font-semibold">{b.code}</span>
        {b.description !== "" && (
          <span className="block max-w-xs text-sm text-muted">{b.description}</span>
        )}
      </th>
      <td className={`${cell} text-right whitespace-nowrap tabular-nums max-sm:text-left`}>
        {formatLatitude(b.latitudeDeg)}
        <br />
        {formatLongitude(b.longitudeDeg)}
      </td>
      <td className={`${cell} text-right whitespace-nowrap tabular-nums max-sm:text-left`}>
        <span className="block font-semibold">{formatPublishedHeightM(b.heightM)}</span>
        <span className="block text-sm">± {formatSigmaMm(b.heightSigmaM)}</span>
      </td>
      <td className={`${cell} text-left`}>
        <span className="block">{b.heightSystem}</span>
        {b.datum !== "" && <span className="block text-sm text-muted">{b.datum}</span>}
      </td>
      <td className={`${cell} text-left text-sm`}>{b.source === "" ? "—" : b.source}</td>
      {onEdit !== null && (
        <td className="px-3 py-2 text-right max-sm:ml-auto">
          <Button aria-label={`Edit ${b.code}`} onClick={() => onEdit(b)}>
            Edit
          </Button>
        </td>
      )}
    </tr>
  );
}

export function BenchmarkTable({ benchmarks, onEdit }: Props) {
  return (
    <div className="overflow-x-auto rounded-xl border-2 border-line bg-surface">
      <table className="w-full border-collapse text-base max-sm:block">
        <caption className="sr-only">Benchmarks of this campaign</caption>
        <thead className="bg-sunken text-sm max-sm:sr-only">
          <tr>
            <th scope="col" className={`${head} text-left`}>
              Code
            </th>
            <th scope="col" className={`${head} text-right`}>
              Position
            </th>
            <th scope="col" className={`${head} text-right`}>
              <span className="whitespace-nowrap">Published height</span>
              <span className="block font-normal text-muted">m, ± σ in mm</span>
            </th>
            <th scope="col" className={`${head} text-left`}>
              Height system / datum
            </th>
            <th scope="col" className={`${head} text-left`}>
              Source
            </th>
            {onEdit !== null && (
              <th scope="col" className={head}>
                <span className="sr-only">Actions</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody className="max-sm:block">
          {benchmarks.length === 0 && (
            <tr>
              <td colSpan={onEdit === null ? 5 : 6} className="px-3 py-3 text-muted">
                {onEdit === null
                  ? "No benchmark in this campaign yet."
                  : "No benchmark yet: add one or import a file."}
              </td>
            </tr>
          )}
          {benchmarks.map((b) => (
            <Row key={b.id} b={b} onEdit={onEdit} />
          ))}
        </tbody>
      </table>
    </div>
  );
}
