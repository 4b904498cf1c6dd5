// The instrument's revisions, newest first: when (UTC and local), who, and what changed from what.
import type { InstrumentRevisionView } from "../../../../shared/schemas/instruments";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import { describeRevisions, type FieldChange } from "../lib/revisions";

const actionWords: Record<InstrumentRevisionView["action"], string> = {
  create: "Created",
  update: "Changed",
  delete: "Deleted",
};

function Change({ change }: { change: FieldChange }) {
  return (
    <li>
      <span className="font-semibold">{change.label}</span>
      {change.before !== null && change.after !== null && (
        <>
          : <span className="tabular-nums">{change.before}</span> →{" "}
          <span className="tabular-nums">{change.after}</span>
        </>
      )}
      {change.before === null && change.after !== null && (
        <>
          : <span className="tabular-nums">{change.after}</span>
        </>
      )}
    </li>
  );
}

export function InstrumentHistory({ revisions }: { revisions: readonly InstrumentRevisionView[] }) {
  const lines = describeRevisions(revisions).reverse();
  if (lines.length === 0) return <p className="text-muted">No revision recorded.</p>;
  return (
    <ol aria-label="Revisions" className="flex flex-col gap-3">
      {lines.map(({ revision: r, changes }) => (
        <li key={`${r.version}-${r.at}`} className="rounded-xl border-2 border-line bg-surface p-3">
          <p className="font-semibold">
            {actionWords[r.action]} · version {r.version}
          </p>
          <p className="text-sm tabular-nums">
            {formatUtc(r.at)} <span className="text-muted">({formatLocalBeside(r.at)})</span> by{" "}
            {r.byName ?? "someone no longer in the campaign"}
          </p>
          {r.action === "update" && changes.length === 0 && (
            <p className="text-sm text-muted">Saved without a change.</p>
          )}
          {changes.length > 0 && (
            <ul
              aria-label={r.action === "create" ? "Stated at creation" : "What changed"}
              className="mt-1 list-disc pl-6 text-sm"
            >
              {changes.map((c) => (
                <Change key={c.field} change={c} />
              ))}
            </ul>
          )}
        </li>
      ))}
    </ol>
  );
}
