// Pieces of the import screen: the progress bar, the errors by line and the preview table.
import { Notice } from "../../../components/notice";
import type { LineError, Readings } from "../parse/parse-csv";

export interface ImportProgress {
  label: string;
  /** 0 … 1, or null while the amount is unknown (saving in one transaction). */
  fraction: number | null;
}

export function ImportProgressBar({ progress }: { progress: ImportProgress }) {
  const percent = progress.fraction === null ? null : Math.round(progress.fraction * 100);
  return (
    <div className="flex flex-col gap-1" role="status">
      <label className="font-semibold" htmlFor="import-progress">
        {progress.label}
        {percent !== null && <span className="tabular-nums"> {percent} %</span>}
      </label>
      <progress
        id="import-progress"
        className="h-4 w-full"
        max={1}
        {...(progress.fraction === null ? {} : { value: progress.fraction })}
      />
    </div>
  );
}

export const shownErrors = 20;
const count = new Intl.NumberFormat("en-GB");

export function ImportErrors({
  errors,
  errorCount,
}: {
  errors: readonly LineError[];
  errorCount: number;
}) {
  const more = errorCount - Math.min(errors.length, shownErrors);
  return (
    <Notice tone="danger" title="Nothing was imported" live>
      <p>
        {errorCount === 1
          ? "The file has a problem. Correct the file or the mapping and pick it again."
          : `The file has ${count.format(errorCount)} problems. Correct the file or the mapping and pick it again.`}
      </p>
      <ul aria-label="Problems in the file" className="mt-2 list-disc pl-5 tabular-nums">
        {errors.slice(0, shownErrors).map((e, i) => (
          <li key={i}>{e.text}</li>
        ))}
      </ul>
      {more > 0 && <p className="mt-2">… and {count.format(more)} more.</p>}
    </Notice>
  );
}

const number = (v: number | null, digits: number) => (v === null ? "—" : v.toFixed(digits));
const utc = (iso: string) => `${iso.slice(0, 10)} ${iso.slice(11, 19)}`;

const cell = "border-b border-line px-3 py-2 text-right tabular-nums";
const timeCell = "border-b border-line px-3 py-2 text-left tabular-nums";
const head = "border-b-2 border-ink px-3 py-2 text-right font-semibold";
const timeHead = "border-b-2 border-ink px-3 py-2 text-left font-semibold";

/** The first rows as they will be saved: UTC times and Equipot's units (°C, %, g, ms). */
export function ImportPreview({ readings, rows = 10 }: { readings: Readings; rows?: number }) {
  return (
    <div className="overflow-x-auto">
      <table className="min-w-full border-collapse">
        <caption className="mb-2 text-left font-semibold">
          First {rows} readings, as they will be saved
        </caption>
        <thead>
          {readings.kind === "temperatures" ? (
            <tr>
              <th className={timeHead}>Time (UTC)</th>
              <th className={head}>Temperature (°C)</th>
              <th className={head}>Relative humidity (%)</th>
            </tr>
          ) : (
            <tr>
              <th className={timeHead}>Time (UTC)</th>
              <th className={head}>Peak x (g)</th>
              <th className={head}>Peak y (g)</th>
              <th className={head}>Peak z (g)</th>
              <th className={head}>Duration (ms)</th>
            </tr>
          )}
        </thead>
        <tbody>
          {readings.kind === "temperatures"
            ? readings.samples.slice(0, rows).map((s) => (
                <tr key={s.at}>
                  <td className={timeCell}>{utc(s.at)}</td>
                  <td className={cell}>{number(s.celsius, 2)}</td>
                  <td className={cell}>{number(s.humidityPct, 1)}</td>
                </tr>
              ))
            : readings.events.slice(0, rows).map((e, i) => (
                <tr key={`${e.at}-${i}`}>
                  <td className={timeCell}>{utc(e.at)}</td>
                  <td className={cell}>{number(e.xG, 2)}</td>
                  <td className={cell}>{number(e.yG, 2)}</td>
                  <td className={cell}>{number(e.zG, 2)}</td>
                  <td className={cell}>{number(e.durationMs, 1)}</td>
                </tr>
              ))}
        </tbody>
      </table>
    </div>
  );
}
