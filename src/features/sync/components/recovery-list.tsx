// Changes and files the server refused (a role without the right, a value out of bounds, a file
// of the wrong kind), kept whole on this device so nothing typed or taken in the field is lost.
// They can be saved as files; a person lets them go only after a second tap.
import { useState } from "react";
import type { LocalFile, RecoveryEntry } from "../../../db/database";
import { Button } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { formatBytes } from "../../../lib/device-storage";
import { downloadBlob } from "../../../lib/download";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import { changeKindLabels, subjectOf } from "../describe-change";
import { useDownloads, useRecoveryActions } from "../hooks/use-sync-data";

interface RecoveryListProps {
  campaignId: string;
  entries: readonly RecoveryEntry[];
  files: readonly LocalFile[];
  names: ReadonlyMap<string, string>;
}

/** "Remove from this device…", then "Yes, remove" / "Keep": a gloved tap never drops anything. */
function LetGo({ what, onConfirm }: { what: string; onConfirm: () => Promise<void> }) {
  const [asking, setAsking] = useState(false);
  if (!asking)
    return (
      <Button tone="quiet" onClick={() => setAsking(true)}>
        Remove from this device…
      </Button>
    );
  return (
    <div className="flex flex-wrap items-center gap-2">
      <span className="font-semibold">Remove {what} for good? Save it first if you need it.</span>
      <Button tone="danger" onClick={() => void onConfirm()}>
        Yes, remove
      </Button>
      <Button onClick={() => setAsking(false)}>Keep</Button>
    </div>
  );
}

export function RecoveryList({ campaignId, entries, files, names }: RecoveryListProps) {
  const downloads = useDownloads();
  const actions = useRecoveryActions(campaignId);
  if (entries.length === 0 && files.length === 0) {
    return (
      <Notice title="Nothing kept">The server has refused none of this device’s changes.</Notice>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      {entries.length > 0 && (
        <div>
          <Button onClick={() => void downloads.recovery(campaignId)}>Download as JSON</Button>
        </div>
      )}
      <ul aria-label="Refused changes" className="flex flex-col gap-3">
        {entries.map((entry) => (
          <li
            key={entry.id ?? entry.mutationId}
            className="flex flex-col gap-1 rounded-xl border-2 border-danger bg-surface p-4"
          >
            <p className="font-semibold">
              {changeKindLabels[entry.name]}: {subjectOf(entry.args, names)}
            </p>
            <p>Refused: {entry.reason}</p>
            <p className="text-sm text-muted tabular-nums">
              Noted {formatUtc(entry.at)} · {formatLocalBeside(entry.at)}
            </p>
            {entry.id !== undefined && (
              <LetGo what="this change" onConfirm={() => actions.dismiss(entry.id ?? 0)} />
            )}
          </li>
        ))}
        {files.map((file) => (
          <li
            key={file.key}
            className="flex flex-col gap-1 rounded-xl border-2 border-danger bg-surface p-4"
          >
            <p className="font-semibold">
              File: {file.name || "unnamed"} ({formatBytes(file.sizeBytes)})
            </p>
            <p>Refused: {file.refusal}</p>
            <div className="flex flex-wrap gap-2">
              <Button
                onClick={() =>
                  downloadBlob(
                    file.name || "file",
                    new Blob([file.bytes], { type: file.contentType }),
                  )
                }
              >
                Save the file
              </Button>
              <LetGo what="this file" onConfirm={() => actions.forgetFile(file.sha256)} />
            </div>
          </li>
        ))}
      </ul>
    </div>
  );
}
