// A page's code that can no longer be loaded: after an update in another tab, the new service
// worker has removed the old version's files, so this tab (still on the old version) cannot fetch
// the page it asks for. One reload brings the tab onto the new version; a second failure within a
// minute is shown as an error instead, so a real outage never turns into a reload loop.

const reloadedKey = "equipot.stale-chunk-reload";
const window_ms = 60_000;

/** Chromium, Firefox and Safari word a failed dynamic import differently. */
export function isStaleChunkError(error: unknown): boolean {
  const message = error instanceof Error ? error.message : String(error ?? "");
  return /Failed to fetch dynamically imported module|error loading dynamically imported module|Importing a module script failed/i.test(
    message,
  );
}

/** Whether this error is a stale page chunk and no such reload happened in the last minute. */
export function shouldReloadForStaleChunk(
  error: unknown,
  storage: Pick<Storage, "getItem"> = sessionStorage,
  now: number = Date.now(),
): boolean {
  if (!isStaleChunkError(error)) return false;
  return now - Number(storage.getItem(reloadedKey) ?? 0) >= window_ms;
}

/** Notes the reload (so a second failure is shown, not reloaded) and reloads. */
export function reloadForStaleChunk(
  storage: Pick<Storage, "setItem"> = sessionStorage,
  reload: () => void = () => window.location.reload(),
  now: number = Date.now(),
): void {
  storage.setItem(reloadedKey, String(now));
  reload();
}
