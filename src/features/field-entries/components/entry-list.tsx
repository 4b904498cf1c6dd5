// Field entries as a list: what, which crate, the verdict against the crate's limits (shape and
// words), who wrote it down and when, and whether it has been sent yet.
import { Link } from "react-router-dom";
import type { CrateView } from "../../../../shared/schemas/crates";
import { fieldEntryKindLabels } from "../../../../shared/schemas/field-entries";
import type { LocalFieldEntry } from "../../../db/database";
import { PendingMark } from "../../../components/pending-mark";
import { StatusShape } from "../../../components/status-shape";
import { formatLocalBeside, formatUtc } from "../../../lib/format";

interface EntryListProps {
  label: string;
  entries: readonly LocalFieldEntry[];
  crates: readonly CrateView[];
  entryHref: (entryId: string) => string;
  empty: string;
}

export function EntryVerdict({ entry }: { entry: LocalFieldEntry }) {
  return entry.flags.exceeded ? (
    <span className="flex items-start gap-2 font-semibold text-danger-ink">
      <StatusShape shape="octagon" className="mt-0.5 text-danger" />
      <span>Limit exceeded: {entry.flags.summary}</span>
    </span>
  ) : (
    <span className="flex items-start gap-2">
      <StatusShape shape="disc" className="mt-0.5 text-primary" />
      <span>{entry.flags.summary}</span>
    </span>
  );
}

export function EntryList({ label, entries, crates, entryHref, empty }: EntryListProps) {
  if (entries.length === 0) return <p className="text-muted">{empty}</p>;
  const crateLabel = new Map(crates.map((c) => [c.id, c.label]));
  return (
    <ul aria-label={label} className="flex flex-col gap-2">
      {entries.map((entry) => (
        <li key={entry.id}>
          <Link
            to={entryHref(entry.id)}
            className="flex min-h-touch flex-col gap-1 rounded-lg border-2 border-line bg-surface p-3 text-ink no-underline hover:border-ink"
          >
            <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
              <span className="font-semibold">{fieldEntryKindLabels[entry.kind]}</span>
              {entry.crateId !== null && (
                <span className="rounded border border-line px-1.5 text-sm font-semibold">
                  {crateLabel.get(entry.crateId) ?? "Crate"}
                </span>
              )}
              <span className="text-sm text-muted tabular-nums">
                {formatUtc(entry.observedAt)} ({formatLocalBeside(entry.observedAt)})
                {entry.recordedByName !== null && ` · ${entry.recordedByName}`}
              </span>
              {entry.pending && <PendingMark />}
            </span>
            <EntryVerdict entry={entry} />
          </Link>
        </li>
      ))}
    </ul>
  );
}
