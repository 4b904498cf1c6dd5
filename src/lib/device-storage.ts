// Whether the browser promised to keep this site's storage, and how much of the quota is used.
// Plain TypeScript with subscribe/snapshot, read in React with useSyncExternalStore.
export interface DeviceStorage {
  /** null: not known yet, or the browser cannot say. */
  persisted: boolean | null;
  usageB: number | null;
  quotaB: number | null;
}

type Listener = () => void;
const listeners = new Set<Listener>();
let snapshot: DeviceStorage = { persisted: null, usageB: null, quotaB: null };
let asked = false;

function set(patch: Partial<DeviceStorage>) {
  snapshot = { ...snapshot, ...patch };
  for (const listener of listeners) listener();
}

export const getDeviceStorage = (): DeviceStorage => snapshot;

export function subscribeDeviceStorage(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

function manager(): StorageManager | undefined {
  return typeof navigator === "undefined" ? undefined : navigator.storage;
}

export async function refreshEstimate(): Promise<void> {
  const storage = manager();
  if (storage?.estimate === undefined) return;
  try {
    const { usage, quota } = await storage.estimate();
    set({ usageB: usage ?? null, quotaB: quota ?? null });
  } catch {
    // Not available in this browser: the panel says so.
  }
}

/** Asks once per page life (after sign-in) that the browser keep the data; remembers the answer. */
export async function askPersistence(): Promise<void> {
  const storage = manager();
  if (storage?.persisted === undefined) return;
  try {
    let persisted = await storage.persisted();
    if (!persisted && !asked && storage.persist !== undefined) {
      asked = true;
      persisted = await storage.persist();
    }
    set({ persisted });
  } catch {
    set({ persisted: false });
  }
}

const units = ["B", "kB", "MB", "GB", "TB"] as const;

/** "12.3 MB" (powers of 1000, as browsers report quotas). */
export function formatBytes(bytes: number): string {
  let value = bytes;
  let unit = 0;
  while (value >= 1000 && unit < units.length - 1) {
    value /= 1000;
    unit += 1;
  }
  return `${unit === 0 ? value : value.toFixed(1)} ${units[unit]}`;
}
