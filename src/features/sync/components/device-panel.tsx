// "This device": whether the browser keeps Equipot's data, how much space it uses, and a copy of
// the changes not yet sent.
import { Button } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { askPersistence, formatBytes, refreshEstimate } from "../../../lib/device-storage";
import { useDeviceStorage } from "../../../lib/use-device-storage";
import { useSyncStatus } from "../../../lib/sync-context";
import { useDownloads } from "../hooks/use-sync-data";
import { waitingWords } from "./sync-bar";

function Persistence({ persisted }: { persisted: boolean | null }) {
  if (persisted === true) {
    return (
      <Notice title="Kept on this device">
        The browser promised not to clear Equipot’s data on its own, even when space runs low.
      </Notice>
    );
  }
  return (
    <Notice
      tone="attention"
      title={persisted === null ? "Keeping not confirmed" : "Best effort only"}
    >
      The browser may clear Equipot’s data when the device runs low on space. Send changes often, or
      download a copy below.{" "}
      <Button tone="quiet" className="px-0" onClick={() => void askPersistence()}>
        Ask the browser again
      </Button>
    </Notice>
  );
}

function Quota({ usageB, quotaB }: { usageB: number | null; quotaB: number | null }) {
  if (usageB === null || quotaB === null || quotaB === 0) {
    return <p className="text-muted">This browser does not say how much space is used.</p>;
  }
  const share = usageB / quotaB;
  return (
    <div className="flex flex-col gap-1">
      <label className="flex flex-col gap-1">
        <span className="tabular-nums">
          {formatBytes(usageB)} used of {formatBytes(quotaB)} allowed (
          {(share * 100).toFixed(share < 0.01 ? 2 : 1)} %)
        </span>
        <meter className="h-4 w-full max-w-md" min={0} max={1} low={0.7} high={0.9} value={share} />
      </label>
    </div>
  );
}

export function DevicePanel() {
  const storage = useDeviceStorage();
  const status = useSyncStatus();
  const downloads = useDownloads();
  const waiting = waitingWords(status);
  return (
    <div className="flex max-w-3xl flex-col gap-6">
      <section aria-labelledby="device-storage" className="flex flex-col gap-3">
        <h2 id="device-storage" className="text-xl font-semibold">
          Storage
        </h2>
        <Persistence persisted={storage.persisted} />
        <Quota usageB={storage.usageB} quotaB={storage.quotaB} />
        <div>
          <Button onClick={() => void refreshEstimate()}>Measure again</Button>
        </div>
      </section>
      <section aria-labelledby="device-unsent" className="flex flex-col gap-3">
        <h2 id="device-unsent" className="text-xl font-semibold">
          Changes not yet sent
        </h2>
        <p>
          {waiting === null
            ? "None: the server has every change made on this device."
            : `${waiting} ${status.pending + status.pendingFiles === 1 ? "waits" : "wait"} on this device for the server.`}
        </p>
        <div>
          <Button disabled={waiting === null} onClick={() => void downloads.outbox()}>
            {status.pendingFiles > 0
              ? "Download unsent changes and files (ZIP)"
              : "Download unsent changes (JSON)"}
          </Button>
        </div>
      </section>
    </div>
  );
}
