// TanStack Query serves server data; its cache is persisted to localStorage so that what was
// seen online can be read offline (DESIGN.md §3).
import { QueryClient, onlineManager, type Query } from "@tanstack/react-query";
import { createSyncStoragePersister } from "@tanstack/query-sync-storage-persister";
import type { PersistQueryClientOptions } from "@tanstack/react-query-persist-client";
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

const persister = createSyncStoragePersister({
  storage: typeof window === "undefined" ? undefined : window.localStorage,
  key: "equipot.query-cache.v1",
  throttleTime: 500,
});

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
