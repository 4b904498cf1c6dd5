// Seeded comparison series for tests: white FM around a mean, one sample per second, as CSV text
// and as the exact numbers that text reads back to.

/** mulberry32, a small seeded PRNG: the same series on every run. */
export function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface SeriesSpec {
  startUnixS: number;
  count: number;
  seed: number;
  mean?: number;
  sigmaAt1s?: number;
  /** Sample indices left out (a gap in the file). */
  skip?: (i: number) => boolean;
}

/** Times (Unix s) and values exactly as the CSV below prints them (6 digits after the point). */
export function whiteFmSeries(spec: SeriesSpec): { times: Float64Array; values: Float64Array } {
  const { startUnixS, count, seed, mean = 1e-16, sigmaAt1s = 1e-15, skip } = spec;
  const next = prng(seed);
  const times: number[] = [];
  const values: number[] = [];
  for (let i = 0; i < count; i++) {
    // Box–Muller: a standard normal from two uniforms.
    const g = Math.sqrt(-2 * Math.log(1 - next())) * Math.cos(2 * Math.PI * next());
    if (skip?.(i)) continue;
    times.push(startUnixS + i);
    values.push(Number((mean + sigmaAt1s * g).toExponential(6)));
  }
  return { times: Float64Array.from(times), values: Float64Array.from(values) };
}

export function seriesCsv(series: { times: Float64Array; values: Float64Array }): string {
  const lines = ["time,value"];
  for (let i = 0; i < series.times.length; i++) {
    const t = new Date((series.times[i] ?? 0) * 1000).toISOString();
    lines.push(`${t},${(series.values[i] ?? 0).toExponential(6)}`);
  }
  return lines.join("\n") + "\n";
}
