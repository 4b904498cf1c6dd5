// One run of the field book: the current setups with their running reduction, each warning on a
// line under its setup, and a button to correct a setup.
import { Fragment } from "react";
import type { SetupWarning } from "../../../../shared/levelling-book";
import type { RunningReduction, RunningRow } from "../../../../shared/science/levelling/running";
import type { LocalLevellingSetup } from "../../../db/database";
import { Button } from "../../../components/button";
import { StatusShape } from "../../../components/status-shape";
import { formatDistanceM, formatReadingM, formatSignedDistanceM, formatSignedM } from "../format";

const headers = [
  ["No.", ""],
  ["BS", "m"],
  ["FS", "m"],
  ["BS dist", "m"],
  ["FS dist", "m"],
  ["Rise", "m"],
  ["Fall", "m"],
  ["ΔH cum.", "m"],
  ["Imbalance", "m"],
] as const;

const cell = "px-2 py-2 text-right tabular-nums";

/** A level setup (ΔH = 0) is written as a rise of 0, as in a paper book. */
export const riseText = (row: RunningRow | undefined) =>
  row?.deltaM != null && row.deltaM >= 0 ? formatReadingM(row.deltaM) : "";
export const fallText = (row: RunningRow | undefined) =>
  row?.deltaM != null && row.deltaM < 0 ? formatReadingM(-row.deltaM) : "";

export function WarningLines({ warnings }: { warnings: readonly SetupWarning[] }) {
  return (
    <ul className="flex flex-col gap-1">
      {warnings.map((w) => (
        <li key={`${w.field ?? "setup"}:${w.message}`} className="flex items-start gap-2">
          <StatusShape shape="triangle" className="mt-0.5 text-attention" />
          <span className="font-semibold text-attention-ink">Warning: {w.message}</span>
        </li>
      ))}
    </ul>
  );
}

interface RunTableProps {
  caption: string;
  setups: readonly LocalLevellingSetup[];
  reduction: RunningReduction;
  warnings: readonly SetupWarning[];
  /** Numbers with more than one entry: the latest counts, the earlier stay in the record. */
  corrected: ReadonlySet<number>;
  onCorrect: ((setup: LocalLevellingSetup) => void) | null;
}

export function RunTable(props: RunTableProps) {
  const { caption, setups, reduction, warnings, corrected, onCorrect } = props;
  const columns = headers.length + (onCorrect ? 1 : 0);
  return (
    <div className="overflow-x-auto rounded-xl border-2 border-line bg-surface">
      <table className="w-full border-collapse text-base">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b-2 border-line text-sm">
            {headers.map(([label, unit]) => (
              <th key={label} scope="col" className="px-2 py-2 text-right font-semibold">
                {label}
                {unit !== "" && <span className="block font-normal text-muted">{unit}</span>}
              </th>
            ))}
            {onCorrect && (
              <th scope="col" className="px-2 py-2">
                <span className="sr-only">Correction</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody>
          {setups.length === 0 && (
            <tr>
              <td colSpan={columns} className="px-3 py-3 text-muted">
                No setup in this run yet.
              </td>
            </tr>
          )}
          {setups.map((s, i) => {
            const row = reduction.rows[i];
            const own = warnings.filter((w) => w.setupId === s.id);
            return (
              <Fragment key={s.id}>
                <tr className={own.length > 0 ? "" : "border-b border-line"}>
                  <th scope="row" className={cell}>
                    {s.number}
                    {corrected.has(s.number) && (
                      <span className="block text-xs font-normal text-muted">corrected</span>
                    )}
                  </th>
                  <td className={cell}>{formatReadingM(s.backsightM)}</td>
                  <td className={cell}>{formatReadingM(s.foresightM)}</td>
                  <td className={cell}>{formatDistanceM(s.backsightDistanceM)}</td>
                  <td className={cell}>{formatDistanceM(s.foresightDistanceM)}</td>
                  <td className={cell}>{riseText(row)}</td>
                  <td className={cell}>{fallText(row)}</td>
                  <td className={cell}>{row ? formatSignedM(row.cumulativeM) : ""}</td>
                  <td className={cell}>{row ? formatSignedDistanceM(row.imbalanceM) : ""}</td>
                  {onCorrect && (
                    <td className="px-1 py-1 text-right">
                      <Button
                        className="px-3"
                        aria-label={`Correct setup ${s.number}`}
                        onClick={() => onCorrect(s)}
                      >
                        Correct
                      </Button>
                    </td>
                  )}
                </tr>
                {own.length > 0 && (
                  <tr className="border-b border-line bg-attention-soft">
                    <td colSpan={columns} className="px-3 py-2">
                      <span className="sr-only">Setup {s.number}: </span>
                      <WarningLines warnings={own} />
                    </td>
                  </tr>
                )}
              </Fragment>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
