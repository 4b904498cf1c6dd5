// The sync state in a card, for the site board: what waits to be sent and the last sync.
import { StatusShape } from "../../../components/status-shape";
import { useSyncStatus } from "../../../lib/sync-context";
import { LastSync, waitingWords } from "./sync-bar";

export function SyncCard() {
  const status = useSyncStatus();
  const waiting = waitingWords(status);
  return (
    <section
      aria-label="Sync"
      className="flex flex-col gap-2 rounded-xl border-2 border-line bg-surface p-4"
    >
      <h2 className="text-sm font-semibold tracking-wide text-muted uppercase">Sync</h2>
      <p className="flex items-center gap-2 text-lg font-semibold">
        <StatusShape shape={waiting === null ? "disc" : "dots"} className="text-primary" />
        {waiting === null ? "Nothing waiting" : `${waiting} waiting`}
      </p>
      <p className="text-sm">
        <LastSync at={status.lastSuccessAt} />
      </p>
    </section>
  );
}
