// Changes the server refused (a role without the right, a value out of bounds), kept whole on
// this device so nothing typed in the field is lost. They can be saved as a file.
import type { RecoveryEntry } from "../../../db/database";
import { Button } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import { changeKindLabels, subjectOf } from "../describe-change";
import { useDownloads } from "../hooks/use-sync-data";

interface RecoveryListProps {
  campaignId: string;
  entries: readonly RecoveryEntry[];
  names: ReadonlyMap<string, string>;
}

export function RecoveryList({ campaignId, entries, names }: RecoveryListProps) {
  const downloads = useDownloads();
  if (entries.length === 0) {
    return (
      <Notice title="Nothing kept">The server has refused none of this device’s changes.</Notice>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <div>
        <Button onClick={() => void downloads.recovery(campaignId)}>Download as JSON</Button>
      </div>
      <ul aria-label="Refused changes" className="flex flex-col gap-3">
        {entries.map((entry) => (
          <li
            key={entry.id ?? entry.mutationId}
            className="rounded-xl border-2 border-danger bg-surface p-4"
          >
            <p className="font-semibold">
              {changeKindLabels[entry.name]}: {subjectOf(entry.args, names)}
            </p>
            <p>Refused: {entry.reason}</p>
            <p className="text-sm text-muted tabular-nums">
              Noted {formatUtc(entry.at)} · {formatLocalBeside(entry.at)}
            </p>
          </li>
        ))}
      </ul>
    </div>
  );
}
