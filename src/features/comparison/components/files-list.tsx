// The run's uploaded files; removing one asks for a second tap.
import { useState } from "react";
import { Button } from "../../../components/button";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import type { ComparisonFileView } from "../../../../shared/schemas/comparison";

interface FilesListProps {
  files: readonly ComparisonFileView[];
  canRemove: boolean;
  removing: boolean;
  onRemove: (fileId: string) => void;
}

function When({ iso }: { iso: string }) {
  return (
    <>
      {formatUtc(iso)} <span className="text-muted">({formatLocalBeside(iso)})</span>
    </>
  );
}

export function FilesList({ files, canRemove, removing, onRemove }: FilesListProps) {
  const [armed, setArmed] = useState<string | null>(null);
  if (files.length === 0) return <p className="text-muted">No files uploaded yet.</p>;
  return (
    <ul aria-label="Series files" className="flex flex-col gap-3">
      {files.map((f) => (
        <li
          key={f.id}
          className="flex flex-col gap-1 rounded-xl border-2 border-line bg-surface p-3 tabular-nums"
        >
          <p className="font-semibold break-all">{f.fileName}</p>
          <p className="text-sm">
            {f.rowCount.toLocaleString("en")} rows, {f.validCount.toLocaleString("en")} valid · τ0{" "}
            {f.tau0S} s · {f.gaps.count} gaps · {f.valueKind}
          </p>
          <p className="text-sm">
            <When iso={f.firstAt} /> to <When iso={f.lastAt} />
          </p>
          <p className="text-sm text-muted">Uploaded by {f.uploadedByName ?? "—"}</p>
          {canRemove && (
            <div>
              <Button
                tone={armed === f.id ? "danger" : "quiet"}
                disabled={removing}
                onClick={() => {
                  if (armed === f.id) onRemove(f.id);
                  else setArmed(f.id);
                }}
              >
                {armed === f.id ? "Tap again to remove" : "Remove file"}
              </Button>
            </div>
          )}
        </li>
      ))}
    </ul>
  );
}
