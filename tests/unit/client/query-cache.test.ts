// The persisted query cache: what a tablet read online must still be there after it sleeps,
// reloads or closes the tab offline.
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { memoryStorage } from "../../helpers/memory-storage";

const cacheKey = "equipot.query-cache.v1";

type Listener = () => void;
let storage: Storage;
let windowListeners: Map<string, Listener>;
let documentListeners: Map<string, Listener>;
let visibility: "visible" | "hidden";

function installBrowser(limitChars?: number) {
  storage = memoryStorage(limitChars);
  windowListeners = new Map();
  documentListeners = new Map();
  visibility = "visible";
  vi.stubGlobal("localStorage", storage);
  vi.stubGlobal("window", {
    localStorage: storage,
    addEventListener: (type: string, fn: Listener) => windowListeners.set(type, fn),
    removeEventListener: () => undefined,
  });
  vi.stubGlobal("document", {
    addEventListener: (type: string, fn: Listener) => documentListeners.set(type, fn),
    get visibilityState() {
      return visibility;
    },
  });
  vi.stubGlobal("navigator", { onLine: true });
}

function storedQueryHashes(): string[] {
  const raw = storage.getItem(cacheKey);
  if (raw === null) return [];
  const parsed = JSON.parse(raw) as { clientState: { queries: { queryHash: string }[] } };
  return parsed.clientState.queries.map((q) => q.queryHash);
}

beforeEach(() => {
  vi.resetModules();
  // TanStack's online manager is one per process and removes the last test's window listeners.
  installBrowser();
});

afterEach(() => vi.unstubAllGlobals());

describe("saving the query cache at once", () => {
  test("leaving the page writes a just-fetched result without waiting for the throttle", async () => {
    const { queryClient, markCacheRestored } = await import("../../../src/lib/query-client");
    markCacheRestored();
    queryClient.setQueryData(["comparison-runs", "list", "c1"], [{ id: "r1" }]);
    // The throttled save has not run yet; the page goes away now.
    expect(storage.getItem(cacheKey)).toBeNull();
    windowListeners.get("pagehide")?.();
    expect(storedQueryHashes()).toEqual(['["comparison-runs","list","c1"]']);
  });

  test("the tablet going to sleep (page hidden) writes too; becoming visible does not", async () => {
    const { queryClient, markCacheRestored } = await import("../../../src/lib/query-client");
    markCacheRestored();
    queryClient.setQueryData(["benchmarks", "list", "c1"], []);
    documentListeners.get("visibilitychange")?.();
    expect(storage.getItem(cacheKey)).toBeNull();
    visibility = "hidden";
    documentListeners.get("visibilitychange")?.();
    expect(storedQueryHashes()).toEqual(['["benchmarks","list","c1"]']);
  });

  test("before the stored cache is read back, leaving the page keeps what is stored", async () => {
    storage.setItem(cacheKey, JSON.stringify({ kept: true }));
    await import("../../../src/lib/query-client");
    windowListeners.get("pagehide")?.();
    expect(storage.getItem(cacheKey)).toBe(JSON.stringify({ kept: true }));
  });

  test("a query marked not to persist is left out", async () => {
    const { queryClient, saveQueryCacheNow, markCacheRestored } =
      await import("../../../src/lib/query-client");
    markCacheRestored();
    queryClient.setQueryData(["a"], 1);
    queryClient
      .getQueryCache()
      .build(queryClient, { queryKey: ["health"], meta: { persist: false } });
    queryClient.setQueryData(["health"], { ok: true });
    await saveQueryCacheNow();
    expect(storedQueryHashes()).toEqual(['["a"]']);
  });
});

describe("a full store", () => {
  test("drops the oldest reads until the rest fits, rather than saving nothing", async () => {
    const { QueryClient } = await import("@tanstack/react-query");
    const { writeCacheNow } = await import("../../../src/lib/query-client");
    const { dehydrate } = await import("@tanstack/react-query");
    const client = new QueryClient();
    const big = "x".repeat(400);
    client.setQueryData(["oldest"], big, { updatedAt: 1_000 });
    client.setQueryData(["middle"], big, { updatedAt: 2_000 });
    client.setQueryData(["newest"], big, { updatedAt: 3_000 });
    const persisted = { buster: "b", timestamp: 0, clientState: dehydrate(client) };
    const twoQueriesChars = JSON.stringify({
      ...persisted,
      clientState: { ...persisted.clientState, queries: persisted.clientState.queries.slice(1) },
    }).length;
    // Room for two queries but not three.
    const target = memoryStorage(twoQueriesChars + 10);
    writeCacheNow(target, persisted);
    const stored = JSON.parse(target.getItem(cacheKey) ?? "null") as {
      clientState: { queries: { queryHash: string }[] };
    };
    expect(stored.clientState.queries.map((q) => q.queryHash).sort()).toEqual([
      '["middle"]',
      '["newest"]',
    ]);
  });

  test("with no room at all, nothing is written and nothing throws", async () => {
    const { QueryClient, dehydrate } = await import("@tanstack/react-query");
    const { writeCacheNow } = await import("../../../src/lib/query-client");
    const client = new QueryClient();
    client.setQueryData(["a"], "value");
    const target = memoryStorage(10);
    expect(() =>
      writeCacheNow(target, { buster: "b", timestamp: 0, clientState: dehydrate(client) }),
    ).not.toThrow();
    expect(target.getItem(cacheKey)).toBeNull();
  });
});
