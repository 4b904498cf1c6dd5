// The sync status on every signed-in page: what waits to be sent, the last successful sync,
// progress while sending, "Sync now", and failures in the crew's words.
import type { ReactNode } from "react";
import { Button } from "../../../components/button";
import { StatusShape, type StatusShapeName } from "../../../components/status-shape";
import { cx } from "../../../lib/cx";
import { formatBytes } from "../../../lib/device-storage";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import { useLocalSync, useSyncStatus } from "../../../lib/sync-context";
import type { SyncStatus } from "../../../sync/engine";

const dayMs = 24 * 60 * 60 * 1000;

export const isOldPending = (status: SyncStatus, nowMs = Date.now()) =>
  status.oldestPendingAt !== null && nowMs - Date.parse(status.oldestPendingAt) > dayMs;

export const changesWord = (count: number) => (count === 1 ? "1 change" : `${count} changes`);
export const filesWord = (count: number) =>
  count === 1 ? "1 photo or file" : `${count} photos or files`;

/** "3 changes and 1 photo or file", or null when nothing waits. */
export function waitingWords(status: Pick<SyncStatus, "pending" | "pendingFiles">): string | null {
  const parts = [
    status.pending > 0 ? changesWord(status.pending) : null,
    status.pendingFiles > 0 ? filesWord(status.pendingFiles) : null,
  ].filter((part): part is string => part !== null);
  return parts.length === 0 ? null : parts.join(" and ");
}

// The words change only when the count does, so a routine check every 30 s is not announced.
function summaryOf(status: SyncStatus): { word: string; shape: StatusShapeName } {
  const waiting = waitingWords(status);
  if (waiting === null && status.lastSuccessAt === null)
    return { word: "Nothing to send yet", shape: "dots" };
  if (waiting === null)
    return { word: "All changes sent", shape: status.running ? "dots" : "disc" };
  return { word: `${waiting} not yet sent`, shape: "dots" };
}

export function LastSync({ at }: { at: string | null }) {
  if (at === null) return <span className="text-muted">Not yet synced on this device</span>;
  return (
    <span className="tabular-nums">
      Last sync {formatUtc(at)} <span className="text-muted">· {formatLocalBeside(at)}</span>
    </span>
  );
}

function Progress({ progress }: { progress: SyncStatus["progress"] }) {
  if (progress === null) return null;
  const words =
    progress.phase === "files"
      ? `Sending photos and files: ${formatBytes(progress.done)} of ${formatBytes(progress.total)}`
      : `Sending ${progress.done} of ${changesWord(progress.total)}`;
  return (
    <label className="flex items-center gap-2 text-sm tabular-nums">
      {words}
      <progress className="h-3 w-32" max={progress.total} value={progress.done} />
    </label>
  );
}

/** The alert under the bar: the last failure in plain words, and changes that waited too long. */
export function Problem({ status }: { status: SyncStatus }) {
  const old = isOldPending(status);
  if (status.error === null && !old) return null;
  const offline = status.error?.kind === "offline";
  const lines: ReactNode[] = [];
  if (status.error !== null) lines.push(<span key="error">{status.error.message}</span>);
  if (old && status.oldestPendingAt !== null) {
    lines.push(
      <span key="old">
        Changes have waited on this device since {formatUtc(status.oldestPendingAt)} (
        {formatLocalBeside(status.oldestPendingAt)}). Connect to send them, or download a copy under
        “This device”.
      </span>,
    );
  }
  const attention = offline || status.error === null;
  return (
    <div
      role="alert"
      className={cx(
        "flex items-start gap-2 border-t-2 px-4 py-2 md:px-6",
        attention
          ? "border-attention bg-attention-soft text-attention-ink"
          : "border-danger bg-danger-soft text-danger-ink",
      )}
    >
      <StatusShape shape={attention ? "triangle" : "octagon"} className="mt-0.5" />
      <p className="flex flex-col gap-1">{lines}</p>
    </div>
  );
}

interface SyncBarProps {
  /** The "This device" page, for storage and exports. */
  deviceLink: ReactNode;
}

export function SyncBar({ deviceLink }: SyncBarProps) {
  const status = useSyncStatus();
  const { scheduler } = useLocalSync();
  const summary = summaryOf(status);
  const old = isOldPending(status);
  return (
    <section aria-label="Sync" className="border-b-2 border-line bg-sunken">
      <div className="mx-auto flex max-w-page flex-wrap items-center gap-x-5 gap-y-1 px-4 py-1 md:px-6">
        <p
          role="status"
          aria-live="polite"
          className={cx(
            "inline-flex items-center gap-2 font-semibold",
            old &&
              "rounded-full border-2 border-attention bg-attention-soft px-3 text-attention-ink",
          )}
        >
          <StatusShape
            shape={old ? "triangle" : summary.shape}
            className={status.running ? "animate-spin motion-reduce:animate-none" : undefined}
          />
          {summary.word}
        </p>
        <p className="text-sm">
          <LastSync at={status.lastSuccessAt} />
        </p>
        <Progress progress={status.running ? status.progress : null} />
        <div className="ml-auto flex items-center gap-2">
          {deviceLink}
          <Button onClick={() => void scheduler.runNow()} disabled={status.running}>
            Sync now
          </Button>
        </div>
      </div>
      <Problem status={status} />
    </section>
  );
}
