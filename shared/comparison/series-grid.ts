// The regular grid under a series: the sample interval τ0, gaps (a step of more than 1.5 τ0 leaves
// round(Δt/τ0) − 1 samples missing), and the grid itself with NaN where no valid sample is. Each
// sample's grid index is the previous one plus round(Δt/τ0), so slow drift of a time stamp never
// accumulates into a false gap. Two samples less than half an interval apart share one slot:
// that is an error of the row, not something to average away.
import { comparisonLimits, type GapsSummary, type GapView } from "../schemas/comparison";
import { isoFromUnixS } from "./series-time";

/** Intervals looked at for τ0. */
export const TAU0_INTERVALS = 1000;

/** The median of the first intervals, rounded to 6 significant digits (time-stamp jitter). */
export function medianInterval(times: ArrayLike<number>, count = TAU0_INTERVALS): number | null {
  const n = Math.min(times.length - 1, count);
  if (n < 1) return null;
  const d = new Float64Array(n);
  for (let i = 0; i < n; i++) d[i] = (times[i + 1] ?? NaN) - (times[i] ?? NaN);
  d.sort();
  const mid = n >> 1;
  const median = n % 2 === 1 ? (d[mid] ?? NaN) : ((d[mid - 1] ?? NaN) + (d[mid] ?? NaN)) / 2;
  return Number(median.toPrecision(6));
}

/** Two τ0 agree when within 0.1 % (time stamps are written to finite precision). */
export function sameInterval(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-3 * Math.max(a, b);
}

/** Grid steps from one sample to the next: ≥ 1, or 0 when they fall into one interval. */
export function gridStep(deltaS: number, tau0S: number): number {
  if (deltaS < 0.5 * tau0S) return 0;
  if (deltaS <= 1.5 * tau0S) return 1;
  return Math.round(deltaS / tau0S);
}

export interface GapCollector {
  /** Records a gap of `missing` samples between fromT and toT (Unix seconds). */
  add(fromT: number, toT: number, missing: number): void;
  summary(): GapsSummary;
}

export function createGapCollector(): GapCollector {
  const list: GapView[] = [];
  let count = 0;
  let missingSamples = 0;
  return {
    add(fromT, toT, missing) {
      count++;
      missingSamples += missing;
      if (list.length < comparisonLimits.gapsListed) {
        list.push({ fromAt: isoFromUnixS(fromT), toAt: isoFromUnixS(toT), missing });
      }
    },
    summary: () => ({ count, missingSamples, list: [...list] }),
  };
}

/** Follows a series sample by sample at a known τ0: grid index, gaps, too-close samples. */
export interface GapTracker {
  /** The sample's grid index, or null when it is within half an interval of the previous one. */
  next(t: number): number | null;
  /** Grid points from the first sample to the last. */
  readonly length: number;
  readonly gaps: GapCollector;
}

export function createGapTracker(tau0S: number): GapTracker {
  const gaps = createGapCollector();
  let lastT: number | null = null;
  let index = -1;
  return {
    next(t) {
      if (lastT === null) {
        lastT = t;
        index = 0;
        return 0;
      }
      const step = gridStep(t - lastT, tau0S);
      if (step === 0) return null;
      if (step > 1) gaps.add(lastT, t, step - 1);
      lastT = t;
      index += step;
      return index;
    },
    get length() {
      return index + 1;
    },
    gaps,
  };
}

export interface SeriesGrid {
  /** Unix seconds of grid point 0. */
  readonly t0: number;
  readonly tau0S: number;
  /** Fractional frequency per grid point; NaN where missing or flagged invalid. */
  readonly values: Float64Array;
  readonly gaps: GapsSummary;
}

export interface SeriesChunk {
  readonly times: ArrayLike<number>;
  readonly values: ArrayLike<number>;
}

/**
 * The grid of chunks given in time order (a run's files, each in chunks). Two passes over the
 * times: the first finds the grid's length, the second fills it. O(N) time, one Float64Array.
 */
export function buildSeriesGrid(chunks: readonly SeriesChunk[], tau0S: number): SeriesGrid {
  const sizing = createGapTracker(tau0S);
  let t0: number | null = null;
  for (const c of chunks) {
    for (let i = 0; i < c.times.length; i++) {
      const t = c.times[i] ?? NaN;
      t0 ??= t;
      if (sizing.next(t) === null) {
        throw new RangeError(`two samples fall within one interval near ${isoFromUnixS(t)}`);
      }
    }
  }
  if (t0 === null) throw new RangeError("the series has no sample");
  const values = new Float64Array(sizing.length).fill(NaN);
  const filling = createGapTracker(tau0S);
  for (const c of chunks) {
    for (let i = 0; i < c.times.length; i++) {
      const at = filling.next(c.times[i] ?? NaN);
      if (at !== null) values[at] = c.values[i] ?? NaN;
    }
  }
  return { t0, tau0S, values, gaps: sizing.gaps.summary() };
}
