// For a shared tablet: delete everything Equipot keeps for this person on this device, then sign
// out. With changes or files still waiting it says so and offers the rescue copy first.
import { useState } from "react";
import { signOut } from "../features/auth/api/sign-out";
import { waitingWords } from "../features/sync/components/sync-bar";
import { useDownloads } from "../features/sync/hooks/use-sync-data";
import { Button } from "../components/button";
import { Notice } from "../components/notice";
import { eraseLocalData } from "../db/recovery-store";
import { messageOf } from "../lib/api-error";
import { useLocalSync, useSyncStatus } from "../lib/sync-context";

export function ForgetDeviceControl() {
  const { db, scheduler } = useLocalSync();
  const waiting = waitingWords(useSyncStatus());
  const downloads = useDownloads();
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<unknown>(null);

  const erase = async () => {
    setBusy(true);
    setError(null);
    try {
      scheduler.stop();
      await eraseLocalData(db);
      await signOut();
    } catch (caught) {
      setError(caught);
      setBusy(false);
      scheduler.start();
    }
  };

  return (
    <section aria-labelledby="device-forget" className="flex flex-col gap-3">
      <h2 id="device-forget" className="text-xl font-semibold">
        Remove your data from this device
      </h2>
      <p>
        For a shared tablet: deletes the sites, photos, files and changes Equipot keeps for you
        here, then signs you out. The server keeps everything it has received.
      </p>
      {!asking && (
        <div>
          <Button tone="danger" onClick={() => setAsking(true)}>
            Remove my data…
          </Button>
        </div>
      )}
      {asking && (
        <div className="flex flex-col gap-3 rounded-lg border-2 border-danger bg-surface p-4">
          {waiting !== null && (
            <Notice tone="danger" title={`${waiting} not yet sent`}>
              The server does not have them. Removing the data loses them unless you download a copy
              first.
            </Notice>
          )}
          {error !== null && (
            <Notice tone="danger" title="Not removed" live>
              {messageOf(error)}
            </Notice>
          )}
          <div className="flex flex-wrap gap-3">
            {waiting !== null && (
              <Button tone="primary" onClick={() => void downloads.outbox()}>
                Download unsent changes
              </Button>
            )}
            <Button tone="danger" disabled={busy} onClick={() => void erase()}>
              {busy
                ? "Removing…"
                : waiting === null
                  ? "Yes, remove and sign out"
                  : "Remove anyway and sign out"}
            </Button>
            <Button onClick={() => setAsking(false)}>Keep my data</Button>
          </div>
        </div>
      )}
    </section>
  );
}
