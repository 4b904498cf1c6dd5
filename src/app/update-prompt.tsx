import { useRegisterSW } from "virtual:pwa-register/react";
import { Button } from "../components/button";

/**
 * Registers the service worker. A new version waits until the person reloads, so nothing typed
 * is lost to an automatic reload.
 */
export function UpdatePrompt() {
  const {
    needRefresh: [needRefresh, setNeedRefresh],
    updateServiceWorker,
  } = useRegisterSW();

  if (!needRefresh) return null;
  return (
    <div
      role="status"
      className="flex flex-wrap items-center justify-between gap-3 border-b-2 border-ink bg-primary-soft px-4 py-2"
    >
      <p className="font-semibold">A new version of Equipot is ready.</p>
      <div className="flex gap-3">
        <Button tone="primary" onClick={() => void updateServiceWorker(true)}>
          Reload now
        </Button>
        <Button tone="quiet" onClick={() => setNeedRefresh(false)}>
          Later
        </Button>
      </div>
    </div>
  );
}
