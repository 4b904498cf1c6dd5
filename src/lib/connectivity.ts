// Whether the browser has a network and whether the Equipot server answered the last call.
// Plain TypeScript with a subscribe/snapshot pair so React reads it with useSyncExternalStore.
export type Connectivity = "online" | "offline" | "unreachable";

type Listener = () => void;
const listeners = new Set<Listener>();
let browserOnline = typeof navigator === "undefined" ? true : navigator.onLine;
let serverReachable = true;

function notify(): void {
  for (const listener of listeners) listener();
}

export function getConnectivity(): Connectivity {
  if (!browserOnline) return "offline";
  return serverReachable ? "online" : "unreachable";
}

export function subscribeConnectivity(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Called by the API client after every call: a thrown fetch means the server is out of reach. */
export function reportReachable(reachable: boolean): void {
  if (reachable === serverReachable) return;
  serverReachable = reachable;
  notify();
}

function setBrowserOnline(online: boolean): void {
  browserOnline = online;
  // Coming back online: assume the server is there until a call says otherwise.
  if (online) serverReachable = true;
  notify();
}

if (typeof window !== "undefined") {
  window.addEventListener("online", () => setBrowserOnline(true));
  window.addEventListener("offline", () => setBrowserOnline(false));
}
