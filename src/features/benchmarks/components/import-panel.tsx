// Choose a benchmark file (CSV or GeoJSON, told apart by the extension) and import it; a refused
// file lists its problems by line (or feature), with nothing stored.
import { useState } from "react";
import { maxBenchmarkRows } from "../../../../shared/benchmark-import";
import { Button } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { StatusShape } from "../../../components/status-shape";
import { messageOf, refusedFileOf } from "../../../lib/api-error";
import { useImportBenchmarks } from "../api/import-benchmarks";
import {
  describeRowProblem,
  formatOfFileName,
  type BenchmarkFileFormat,
} from "../lib/benchmark-file";

/** The server checks every row; above this the JSON body limit would refuse it anyway. */
const maxFileBytes = 900_000;

interface Chosen {
  file: File;
  format: BenchmarkFileFormat | null;
}

function chosenProblem(chosen: Chosen | null): string | null {
  if (chosen === null) return null;
  if (chosen.format === null) return "Benchmark file: choose a .csv or .geojson file.";
  if (chosen.file.size > maxFileBytes)
    return `Benchmark file: at most ${Math.round(maxFileBytes / 1000)} kB can be imported at once.`;
  return null;
}

export function ImportPanel({ campaignId }: { campaignId: string }) {
  const [chosen, setChosen] = useState<Chosen | null>(null);
  const [update, setUpdate] = useState(false);
  const importing = useImportBenchmarks(campaignId);
  const problem = chosenProblem(chosen);
  const send = async () => {
    if (chosen === null || chosen.format === null || problem !== null) return;
    importing.mutate({
      format: chosen.format,
      fileName: chosen.file.name,
      content: await chosen.file.text(),
      onExisting: update ? "update" : "refuse",
    });
  };
  const refused = refusedFileOf(importing.error);
  const format = chosen?.format ?? "csv";
  return (
    <section aria-labelledby="benchmark-import-heading" className="flex flex-col gap-3">
      <h2 id="benchmark-import-heading" className="text-xl font-semibold">
        Import benchmarks
      </h2>
      <p className="max-w-prose text-sm text-muted">
        CSV with a header: code, latitude_deg, longitude_deg, height_m, height_sigma_mm (or
        height_sigma_m), height_system, and optionally description, datum, source — comma or
        semicolon separated (with semicolons a decimal comma is read). Or a GeoJSON
        FeatureCollection of Points [longitude, latitude] with the same properties. Up to{" "}
        {maxBenchmarkRows.toLocaleString("en")} benchmarks; one bad row and nothing is imported.
      </p>
      <div className="flex flex-wrap items-end gap-4">
        <div className="flex flex-col gap-1">
          <label htmlFor="benchmark-file" className="font-semibold">
            Benchmark file
          </label>
          <input
            id="benchmark-file"
            type="file"
            accept=".csv,.geojson,.json,text/csv,application/geo+json,application/json"
            className="min-h-touch"
            aria-invalid={problem !== null}
            aria-describedby={problem !== null ? "benchmark-file-error" : undefined}
            onChange={(e) => {
              const file = e.target.files?.[0] ?? null;
              setChosen(file === null ? null : { file, format: formatOfFileName(file.name) });
              importing.reset();
            }}
          />
        </div>
        <label className="flex min-h-touch items-center gap-3">
          <input
            type="checkbox"
            className="h-6 w-6"
            checked={update}
            onChange={(e) => setUpdate(e.target.checked)}
          />
          Update existing codes
        </label>
        <Button
          tone="primary"
          disabled={chosen === null || problem !== null || importing.isPending}
          onClick={() => void send()}
        >
          {importing.isPending ? "Importing…" : "Import"}
        </Button>
      </div>
      {problem !== null && (
        <p
          id="benchmark-file-error"
          className="flex items-start gap-2 font-semibold text-danger-ink"
        >
          <StatusShape shape="octagon" className="mt-0.5 text-danger" />
          <span>{problem}</span>
        </p>
      )}
      {importing.isSuccess && (
        <Notice tone="info" title="Imported" live>
          {importing.data.created} {importing.data.created === 1 ? "benchmark" : "benchmarks"} added
          {importing.data.updated > 0 && `, ${importing.data.updated} updated`}.
        </Notice>
      )}
      {refused !== null && (
        <Notice tone="danger" title="File refused" live>
          <p>{refused.message}</p>
          <ul aria-label="Problems by line" className="mt-1 list-disc pl-6 tabular-nums">
            {refused.rows.map((r) => (
              <li key={`${r.row}-${r.field}-${r.message}`}>{describeRowProblem(format, r)}</li>
            ))}
          </ul>
        </Notice>
      )}
      {importing.isError && refused === null && (
        <Notice tone="danger" title="Not imported" live>
          {messageOf(importing.error)}
        </Notice>
      )}
    </section>
  );
}
