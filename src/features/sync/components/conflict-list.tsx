// Open conflicts of a campaign: the same field changed on two sides. A person picks the value
// to keep; the choice is a new change, sent like any other.
import { useState } from "react";
import type { LocalConflict } from "../../../db/database";
import { Button } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { fieldLabel, formatFieldValue } from "../describe-change";
import { useResolveConflict } from "../hooks/use-sync-data";

interface ConflictListProps {
  campaignId: string;
  conflicts: readonly LocalConflict[];
  names: ReadonlyMap<string, string>;
  /** The signed-in person, to tell their own device's value from another's. */
  userId: string;
  canResolve: boolean;
}

function ValueChoice(props: {
  title: string;
  shown: string;
  canResolve: boolean;
  busy: boolean;
  onKeep: () => void;
}) {
  return (
    <div className="flex flex-col gap-2 rounded-lg border-2 border-line p-3">
      <dt className="text-sm font-semibold text-muted">{props.title}</dt>
      <dd className="text-lg break-words tabular-nums">{props.shown}</dd>
      {props.canResolve && (
        <dd>
          <Button onClick={props.onKeep} disabled={props.busy} aria-label={`Keep ${props.shown}`}>
            Keep this value
          </Button>
        </dd>
      )}
    </div>
  );
}

function ConflictCard({
  conflict,
  siteName,
  userId,
  canResolve,
  campaignId,
}: {
  conflict: LocalConflict;
  siteName: string;
  userId: string;
  canResolve: boolean;
  campaignId: string;
}) {
  const resolve = useResolveConflict(campaignId);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<unknown>(null);
  const field = conflict.field;
  const keep = async (value: unknown) => {
    setBusy(true);
    setError(null);
    try {
      await resolve(conflict.id, value);
    } catch (caught) {
      setError(caught);
      setBusy(false);
    }
  };
  const clientTitle =
    conflict.openedBy === userId ? "Sent from your account" : "Sent from another device";
  return (
    <li className="rounded-xl border-2 border-attention bg-surface p-4">
      <h3 className="text-lg font-semibold">
        {siteName} · {fieldLabel(field)}
      </h3>
      <p className="text-sm text-muted">
        Before both changes: {formatFieldValue(field, conflict.baseValue)}
      </p>
      {error !== null && (
        <Notice tone="danger" title="Choice not saved" live className="mt-2">
          {messageOf(error)}
        </Notice>
      )}
      <dl className="mt-3 grid gap-3 md:grid-cols-2">
        <ValueChoice
          title="On the server"
          shown={formatFieldValue(field, conflict.serverValue)}
          canResolve={canResolve}
          busy={busy}
          onKeep={() => void keep(conflict.serverValue)}
        />
        <ValueChoice
          title={clientTitle}
          shown={formatFieldValue(field, conflict.clientValue)}
          canResolve={canResolve}
          busy={busy}
          onKeep={() => void keep(conflict.clientValue)}
        />
      </dl>
    </li>
  );
}

export function ConflictList({
  campaignId,
  conflicts,
  names,
  userId,
  canResolve,
}: ConflictListProps) {
  if (conflicts.length === 0) {
    return (
      <Notice title="No conflicts">Every change on this device agrees with the server.</Notice>
    );
  }
  return (
    <ul aria-label="Open conflicts" className="flex flex-col gap-4">
      {conflicts.map((conflict) => (
        <ConflictCard
          key={conflict.id}
          conflict={conflict}
          siteName={names.get(conflict.entityId) ?? "A site"}
          userId={userId}
          canResolve={canResolve}
          campaignId={campaignId}
        />
      ))}
    </ul>
  );
}
