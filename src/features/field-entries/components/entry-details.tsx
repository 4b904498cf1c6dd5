// One field entry in full: every reading it holds, with units.
import { fieldEntryKindLabels } from "../../../../shared/schemas/field-entries";
import { dewPointVerdict } from "../../../../shared/field-entries";
import type { CrateView } from "../../../../shared/schemas/crates";
import type { LocalFieldEntry } from "../../../db/database";
import { PendingMark } from "../../../components/pending-mark";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import { EntryVerdict } from "./entry-list";

const num = (v: number | null, unit: string) => (v === null ? "—" : `${v} ${unit}`);

function Readings({ entry }: { entry: LocalFieldEntry }) {
  const { data } = entry;
  switch (data.kind) {
    case "shock-indicator":
      return (
        <Facts
          rows={[
            ["Rating", `${data.ratingG} g`],
            ["State", data.tripped ? "Tripped" : "Not tripped"],
            ["Where", data.indicatorLabel || "—"],
          ]}
        />
      );
    case "shock-log":
      return (
        <table className="w-full max-w-2xl text-left tabular-nums">
          <caption className="mb-2 text-left text-muted">
            {data.events.length} events{data.loggerModel && ` · ${data.loggerModel}`}
            {data.import &&
              ` · from ${data.import.fileName} (part ${data.import.part} of ${data.import.parts})`}
          </caption>
          <thead>
            <tr className="border-b-2 border-line">
              <th className="py-1 pr-3">Time (UTC)</th>
              <th className="pr-3">x</th>
              <th className="pr-3">y</th>
              <th className="pr-3">z</th>
              <th>Duration</th>
            </tr>
          </thead>
          <tbody>
            {data.events.slice(0, 200).map((e, i) => (
              <tr key={i} className="border-b border-line">
                <td className="py-1 pr-3">{formatUtc(e.at)}</td>
                <td className="pr-3">{num(e.xG, "g")}</td>
                <td className="pr-3">{num(e.yG, "g")}</td>
                <td className="pr-3">{num(e.zG, "g")}</td>
                <td>{num(e.durationMs, "ms")}</td>
              </tr>
            ))}
          </tbody>
        </table>
      );
    case "temperatures":
      return (
        <Facts
          rows={[
            ["Readings", String(data.samples.length)],
            ["Source", data.source === "logger" ? `Logger ${data.loggerModel}`.trim() : "Typed in"],
            [
              "File",
              data.import
                ? `${data.import.fileName} (part ${data.import.part} of ${data.import.parts})`
                : "—",
            ],
          ]}
        />
      );
    case "dew-point": {
      const verdict = dewPointVerdict(data);
      return (
        <Facts
          rows={[
            ["Room", `${data.roomTemperatureC} °C, ${data.roomHumidityPct} % RH`],
            ["Dew point", `${verdict.dewPointC.toFixed(1)} °C (Magnus formula)`],
            [
              "Surface",
              `${data.surfaceTemperatureC} °C (needs ${verdict.requiredSurfaceC.toFixed(1)} °C)`,
            ],
            ["Reason to open anyway", data.overrideReason || "—"],
          ]}
        />
      );
    }
    case "observation":
      return <p className="max-w-2xl whitespace-pre-wrap">{data.text}</p>;
  }
}

function Facts({ rows }: { rows: [string, string][] }) {
  return (
    <dl className="grid max-w-2xl grid-cols-[auto_1fr] gap-x-6 gap-y-1 tabular-nums">
      {rows.map(([term, value]) => (
        <div key={term} className="contents">
          <dt className="font-semibold">{term}</dt>
          <dd>{value}</dd>
        </div>
      ))}
    </dl>
  );
}

export function EntryDetails({
  entry,
  crate,
}: {
  entry: LocalFieldEntry;
  crate: CrateView | null;
}) {
  return (
    <section aria-label={fieldEntryKindLabels[entry.kind]} className="flex flex-col gap-3">
      <p className="flex flex-wrap items-center gap-3 text-muted tabular-nums">
        <span>
          {formatUtc(entry.observedAt)} ({formatLocalBeside(entry.observedAt)})
        </span>
        {crate && <span className="font-semibold text-ink">Crate {crate.label}</span>}
        {entry.recordedByName !== null && <span>Written down by {entry.recordedByName}</span>}
        {entry.pending && <PendingMark />}
      </p>
      <EntryVerdict entry={entry} />
      <Readings entry={entry} />
      {entry.note !== "" && <p className="max-w-2xl">Note: {entry.note}</p>}
    </section>
  );
}
