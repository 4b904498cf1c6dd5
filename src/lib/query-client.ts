// TanStack Query serves server data; its cache is persisted to localStorage so that what was
// seen online can be read offline (DESIGN.md §3).
import { QueryClient, onlineManager, type Query } from "@tanstack/react-query";
import { createSyncStoragePersister } from "@tanstack/query-sync-storage-persister";
import {
  persistQueryClientSave,
  removeOldestQuery,
  type PersistQueryClientOptions,
  type PersistedClient,
  type Persister,
} from "@tanstack/react-query-persist-client";
import { ApiError } from "./api-error";
import { onUserDataReset } from "./session";

const dayMs = 24 * 60 * 60 * 1000;
/** Field crews can be offline for weeks: keep cached reads that long. */
const cacheMaxAgeMs = 42 * dayMs;

function shouldRetry(failureCount: number, error: unknown): boolean {
  // A 4xx answer will not change by asking again; network trouble may.
  if (error instanceof ApiError && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      // Never collect unused queries during a visit: what was seen must stay for the persister.
      // (A finite gcTime above 2^31 ms, about 24.8 days, overflows setTimeout and would collect
      // at once.)
      queries: { gcTime: Infinity, staleTime: 30_000, retry: shouldRetry },
      // Fail at once with "no connection" rather than waiting silently; the form keeps its input.
      mutations: { networkMode: "always", retry: false },
    },
  });
}

export const queryClient = createQueryClient();

const cacheKey = "equipot.query-cache.v1";
const storage = typeof window === "undefined" ? undefined : window.localStorage;

const persister = createSyncStoragePersister({
  storage,
  key: cacheKey,
  throttleTime: 500,
  // A full store must not stop every later save: drop the oldest reads until it fits.
  retry: removeOldestQuery,
});

/** Writes at once (no throttle), for the moment the page goes away. */
export function writeCacheNow(target: Storage, client: PersistedClient): void {
  let next: PersistedClient | undefined = client;
  let errorCount = 0;
  while (next !== undefined) {
    try {
      target.setItem(cacheKey, JSON.stringify(next));
      return;
    } catch (error) {
      errorCount += 1;
      next = removeOldestQuery({
        persistedClient: next,
        error: error instanceof Error ? error : new Error(String(error)),
        errorCount,
      });
    }
  }
}

export const persistOptions: Omit<PersistQueryClientOptions, "queryClient"> = {
  persister,
  maxAge: cacheMaxAgeMs,
  // Change when a cached response's shape changes, so an old cache is dropped, not misread.
  buster: "equipot-cache-1",
  dehydrateOptions: {
    shouldDehydrateQuery: (query: Query) =>
      query.state.status === "success" && query.meta?.persist !== false,
  },
};

let restored = false;
/** Called once the stored cache has been read back (or dropped); saves may run from then on. */
export function markCacheRestored(): void {
  restored = true;
}

/**
 * Saves the cache now. The throttled save runs on a timer that never fires once the page is
 * hidden or unloaded, so a result fetched just before the tablet sleeps, closes the tab or
 * reloads offline would otherwise be lost.
 */
export function saveQueryCacheNow(client: QueryClient = queryClient): Promise<void> {
  // Before the stored cache is read back, the live cache is empty: saving it would erase it.
  if (storage === undefined || !restored) return Promise.resolve();
  const immediate: Persister = {
    persistClient: (persisted) => writeCacheNow(storage, persisted),
    restoreClient: () => undefined,
    removeClient: () => undefined,
  };
  return persistQueryClientSave({
    queryClient: client,
    persister: immediate,
    buster: persistOptions.buster,
    dehydrateOptions: persistOptions.dehydrateOptions,
  });
}

if (typeof window !== "undefined") {
  window.addEventListener("pagehide", () => void saveQueryCacheNow());
  document.addEventListener("visibilitychange", () => {
    if (document.visibilityState === "hidden") void saveQueryCacheNow();
  });
}

// TanStack's own online flag starts as "online"; follow the browser's flag from the first moment.
onlineManager.setEventListener((setOnline) => {
  if (typeof window === "undefined") return undefined;
  const update = () => setOnline(navigator.onLine);
  update();
  window.addEventListener("online", update);
  window.addEventListener("offline", update);
  return () => {
    window.removeEventListener("online", update);
    window.removeEventListener("offline", update);
  };
});

onUserDataReset(() => {
  queryClient.clear();
  void persister.removeClient();
});
