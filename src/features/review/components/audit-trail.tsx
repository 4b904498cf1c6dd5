// A record's audit trail: every change with who, when, from which device, and what it changed.
import type { AuditEventView } from "../../../../shared/schemas/reviews";
import { formatUtc } from "../../../lib/format";

const entityWords: Record<string, string> = {
  checklistRun: "checklist",
  checklistResult: "item result",
  fieldEntry: "entry",
  levellingSection: "section",
  levellingSetup: "setup",
  leg: "leg",
  handover: "handover",
  attachment: "file",
};

const actionWords: Record<string, string> = {
  create: "added",
  delete: "removed",
  "sign-off": "signed off",
  close: "closed",
  depart: "departed",
  arrive: "arrived",
  cancel: "cancelled",
  "review.approved": "approved",
  "review.sentBack": "sent back",
  "review.reopened": "reopened",
};

const asRecord = (value: unknown): Record<string, unknown> =>
  value !== null && typeof value === "object" ? (value as Record<string, unknown>) : {};

/** The fields whose value differs between before and after (all of after for a new record). */
export function changedFields(before: unknown, after: unknown): string[] {
  const a = asRecord(before);
  const b = asRecord(after);
  return [...new Set([...Object.keys(a), ...Object.keys(b)])].filter(
    (key) => JSON.stringify(a[key] ?? null) !== JSON.stringify(b[key] ?? null),
  );
}

const json = (value: unknown) => (value === null ? "—" : JSON.stringify(value, null, 2));

export function AuditTrail({ events }: { events: AuditEventView[] }) {
  if (events.length === 0) return <p className="text-muted">No changes recorded.</p>;
  return (
    <ol className="flex flex-col gap-2" aria-label="Audit trail">
      {events.map((event) => {
        // A new record changes every field: name them only for edits.
        const fields = event.before === null ? [] : changedFields(event.before, event.after);
        return (
          <li key={event.id} className="rounded-lg border border-line p-3">
            <p>
              <span className="font-semibold">
                {entityWords[event.entity] ?? event.entity}{" "}
                {actionWords[event.action] ?? event.action}
              </span>{" "}
              by {event.userName ?? "someone no longer known"} · {formatUtc(event.at)}
              {event.clientId !== null && (
                <span className="text-muted">
                  {" "}
                  · device {event.deviceLabel || event.clientId.slice(0, 8)}
                </span>
              )}
            </p>
            {fields.length > 0 && <p className="text-sm text-muted">Fields: {fields.join(", ")}</p>}
            <details className="mt-1">
              <summary className="cursor-pointer text-sm">Before and after</summary>
              <div className="mt-2 grid gap-2 sm:grid-cols-2">
                <pre className="overflow-x-auto rounded bg-sunken p-2 text-xs">
                  {json(event.before)}
                </pre>
                <pre className="overflow-x-auto rounded bg-sunken p-2 text-xs">
                  {json(event.after)}
                </pre>
              </div>
            </details>
          </li>
        );
      })}
    </ol>
  );
}
