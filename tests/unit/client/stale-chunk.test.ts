// A page chunk of an older version that can no longer be fetched: one reload, never a loop.
// The browsers' wordings of a failed dynamic import are recalled from memory (Chromium, Firefox,
// Safari), and Chromium's is checked for real by the e2e run whenever a chunk goes missing.
import { describe, expect, it } from "vitest";
import {
  isStaleChunkError,
  reloadForStaleChunk,
  shouldReloadForStaleChunk,
} from "../../../src/lib/stale-chunk";

const memory = () => {
  const items = new Map<string, string>();
  return {
    getItem: (k: string) => items.get(k) ?? null,
    setItem: (k: string, v: string) => void items.set(k, v),
  };
};

describe("stale page chunks", () => {
  it.each([
    "Failed to fetch dynamically imported module: http://127.0.0.1:8080/assets/map-route-Ab12.js",
    "error loading dynamically imported module: http://127.0.0.1:8080/assets/map-route-Ab12.js",
    "Importing a module script failed.",
  ])("recognises %s", (message) => {
    expect(isStaleChunkError(new TypeError(message))).toBe(true);
  });

  it("leaves every other error alone", () => {
    expect(isStaleChunkError(new Error("Network request failed"))).toBe(false);
    expect(isStaleChunkError(new TypeError("Failed to fetch"))).toBe(false);
    expect(isStaleChunkError(undefined)).toBe(false);
  });

  it("reloads once, and shows the error if the chunk is still missing within a minute", () => {
    const storage = memory();
    const error = new TypeError("Failed to fetch dynamically imported module: /assets/x.js");
    const t0 = 1_000_000;
    let reloads = 0;
    expect(shouldReloadForStaleChunk(error, storage, t0)).toBe(true);
    reloadForStaleChunk(storage, () => reloads++, t0);
    expect(reloads).toBe(1);
    // After the reload the same failure: a real outage, not an update. No second reload.
    expect(shouldReloadForStaleChunk(error, storage, t0 + 5_000)).toBe(false);
    // A later update, another minute on, may reload again.
    expect(shouldReloadForStaleChunk(error, storage, t0 + 61_000)).toBe(true);
  });
});
