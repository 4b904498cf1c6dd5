// Sign-out that never leaves unsent changes behind unnoticed: with changes waiting it warns and
// offers a download of them first. They also stay on this device for the next sign-in.
import { useId, useState } from "react";
import { useSignOut } from "../features/auth/api/sign-out";
import { waitingWords } from "../features/sync/components/sync-bar";
import { useDownloads } from "../features/sync/hooks/use-sync-data";
import { Button } from "../components/button";
import { StatusShape } from "../components/status-shape";
import { useSyncStatus } from "../lib/sync-context";

export function SignOutControl() {
  const signOut = useSignOut();
  const waiting = waitingWords(useSyncStatus());
  const downloads = useDownloads();
  const [asking, setAsking] = useState(false);
  const titleId = useId();

  const start = () => (waiting !== null ? setAsking(true) : signOut.mutate());
  return (
    <div className="relative">
      <Button tone="secondary" onClick={start} disabled={signOut.isPending}>
        {signOut.isPending ? "Signing out…" : "Sign out"}
      </Button>
      {asking && (
        <div
          role="dialog"
          aria-labelledby={titleId}
          onKeyDown={(event) => {
            if (event.key === "Escape") setAsking(false);
          }}
          className="absolute right-0 z-30 mt-2 flex w-96 max-w-[calc(100vw-2rem)] flex-col gap-3 rounded-lg border-2 border-attention bg-surface p-4 shadow-lg"
        >
          <p id={titleId} className="flex items-center gap-2 text-lg font-semibold">
            <StatusShape shape="triangle" className="text-attention" />
            {waiting} not yet sent
          </p>
          <p>
            The server does not have them yet. They stay on this device and are sent when you sign
            in here again, but if the browser’s data is cleared they are gone. Download a copy
            first.
          </p>
          <Button tone="primary" autoFocus onClick={() => void downloads.outbox()}>
            Download unsent changes
          </Button>
          <Button tone="danger" onClick={() => signOut.mutate()}>
            Sign out anyway
          </Button>
          <Button tone="quiet" onClick={() => setAsking(false)}>
            Stay signed in
          </Button>
        </div>
      )}
    </div>
  );
}
