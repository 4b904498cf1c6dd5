// Choose a tie file (CSV: from, to, dh_m, length_km, sigma_mm optional) and import it; a refused
// file lists its problems by line, with nothing stored.
import { useState } from "react";
import { Button } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { messageOf, refusedFileOf } from "../../../lib/api-error";
import { useImportTies } from "../api/import-ties";

/** The server checks every row; above this the JSON body limit would refuse it anyway. */
const maxFileBytes = 900_000;

export function ImportPanel({ campaignId }: { campaignId: string }) {
  const [file, setFile] = useState<File | null>(null);
  const [tooLarge, setTooLarge] = useState(false);
  const importing = useImportTies(campaignId);
  const send = async () => {
    if (file === null) return;
    importing.mutate({ fileName: file.name, content: await file.text() });
  };
  const refused = refusedFileOf(importing.error);
  return (
    <section aria-labelledby="import-heading" className="flex flex-col gap-3">
      <h2 id="import-heading" className="text-xl font-semibold">
        Import height ties
      </h2>
      <p className="text-sm text-muted">
        CSV with a header: from, to, dh_m, length_km and optionally sigma_mm (comma or semicolon;
        with semicolons a decimal comma is read).
      </p>
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor="tie-file" className="font-semibold">
            Tie file
          </label>
          <input
            id="tie-file"
            type="file"
            accept=".csv,text/csv,text/plain"
            className="min-h-touch"
            onChange={(e) => {
              const chosen = e.target.files?.[0] ?? null;
              setTooLarge(chosen !== null && chosen.size > maxFileBytes);
              setFile(chosen);
              importing.reset();
            }}
          />
        </div>
        <Button
          tone="primary"
          disabled={file === null || tooLarge || importing.isPending}
          onClick={() => void send()}
        >
          {importing.isPending ? "Importing…" : "Import"}
        </Button>
      </div>
      {tooLarge && (
        <Notice tone="danger" title="File too large">
          A tie file may be at most {Math.round(maxFileBytes / 1000)} kB.
        </Notice>
      )}
      {importing.isSuccess && (
        <Notice tone="info" title="Imported" live>
          {importing.data.length} height {importing.data.length === 1 ? "tie" : "ties"} added to the
          network.
        </Notice>
      )}
      {refused !== null && (
        <Notice tone="danger" title="File refused" live>
          <p>{refused.message}</p>
          <ul aria-label="Problems by line" className="mt-1 list-disc pl-6 tabular-nums">
            {refused.rows.map((r) => (
              <li key={`${r.row}-${r.field}-${r.message}`}>
                Line {r.row}, {r.field}: {r.message}
              </li>
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
