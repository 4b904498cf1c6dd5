// Heap figures after a full collection. gc is exposed at run time (node --expose-gc is not needed),
// so `node --import tsx bench/sync.ts` works as it is.
import { setFlagsFromString } from "node:v8";
import { runInNewContext } from "node:vm";

setFlagsFromString("--expose-gc");
const collect = runInNewContext("gc") as () => void;

export const MiB = 2 ** 20;

/** Live heap in bytes: two full collections, so garbage with finalisers is gone too. */
export function liveHeap(): number {
  collect();
  collect();
  return process.memoryUsage().heapUsed;
}

/** The live heap once a closed database has let go (fake-indexeddb closes on a later tick). */
export async function settledHeap(): Promise<number> {
  await new Promise((resolve) => setTimeout(resolve, 200));
  return liveHeap();
}

export interface Peak {
  heapUsed: number;
  rss: number;
}

/** Samples heap and RSS every few ms until stopped; returns the highest seen. */
export function samplePeak(everyMs = 5): () => Peak {
  const peak: Peak = { heapUsed: 0, rss: 0 };
  const sample = () => {
    const m = process.memoryUsage();
    peak.heapUsed = Math.max(peak.heapUsed, m.heapUsed);
    peak.rss = Math.max(peak.rss, m.rss);
  };
  sample();
  const timer = setInterval(sample, everyMs);
  return () => {
    clearInterval(timer);
    sample();
    return peak;
  };
}
