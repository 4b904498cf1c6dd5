// Phase (time error) x in seconds and fractional frequency y: y_i = (x_{i+1} − x_i)/τ0 and
// x_i = τ0·Σ_{k<i} y_k (NIST SP 1065 (Riley 2008) §4 and §5.2). NaN marks a missing sample.
import { ScienceInputError } from "../errors";
import { requireNonEmpty, requirePositive } from "../validate";

export interface SampleScan {
  /** The samples as a Float64Array: the input itself when it already is one (read only). */
  readonly values: Float64Array;
  readonly missing: number;
  /** Sum of the valid samples. */
  readonly total: number;
}

/**
 * Checks samples in one pass: numbers only, NaN marks a missing sample, ±Infinity is refused.
 * A Float64Array is used as it is (never written); anything else is copied once.
 */
export function scanSamples(data: ArrayLike<number>, field: string): SampleScan {
  requireNonEmpty(data, field);
  if (!(data instanceof Float64Array)) {
    for (let i = 0; i < data.length; i++) {
      if (typeof data[i] !== "number") {
        throw new ScienceInputError(
          `${field}[${i}]`,
          "must be a number, or NaN to mark a missing sample",
        );
      }
    }
  }
  const values = data instanceof Float64Array ? data : Float64Array.from(data);
  const { missing, total, infiniteAt } = tally(values);
  if (infiniteAt >= 0)
    throw new ScienceInputError(
      `${field}[${infiniteAt}]`,
      "must be a finite number, or NaN to mark a missing sample",
    );
  return { values, missing, total };
}

/**
 * The hot loop on its own: numbers and a typed array only, so V8 optimises it once and keeps it
 * (inside scanSamples the object literal after the loop made it deoptimise on every call).
 */
function tally(values: Float64Array): { missing: number; total: number; infiniteAt: number } {
  // The common case first: a finite plain sum means no NaN and no ±Infinity among the samples
  // (either would make the sum NaN or infinite), with the same additions in the same order.
  let sum = 0;
  for (let i = 0; i < values.length; i++) sum += values[i] ?? 0;
  if (Number.isFinite(sum)) return { missing: 0, total: sum, infiniteAt: -1 };
  let missing = 0;
  let total = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i] ?? 0;
    if (v !== v) missing++;
    else if (v === Infinity || v === -Infinity) return { missing, total, infiniteAt: i };
    else total += v;
  }
  return { missing, total, infiniteAt: -1 };
}

export function readSamples(data: ArrayLike<number>, field: string): Float64Array {
  return scanSamples(data, field).values;
}

/** Frequency from phase: N phase points give N − 1 frequency samples; a missing point spoils two. */
export function phaseToFrequency(x: ArrayLike<number>, tau0: number): Float64Array {
  requirePositive(tau0, "tau0");
  const phase = readSamples(x, "x");
  if (phase.length < 2) throw new ScienceInputError("x", "needs at least 2 phase points");
  const y = new Float64Array(phase.length - 1);
  for (let i = 0; i < y.length; i++) y[i] = ((phase[i + 1] ?? NaN) - (phase[i] ?? NaN)) / tau0;
  return y;
}

/**
 * Phase from frequency, starting at x0 (s). Phase cannot be integrated across a missing frequency
 * sample without inventing it, so a series with gaps is refused: analyse it as frequency data.
 */
export function frequencyToPhase(y: ArrayLike<number>, tau0: number, x0 = 0): Float64Array {
  requirePositive(tau0, "tau0");
  const freq = readSamples(y, "y");
  if (!Number.isFinite(x0)) throw new ScienceInputError("x0", "must be a finite number");
  const x = new Float64Array(freq.length + 1);
  x[0] = x0;
  let acc = x0;
  for (let i = 0; i < freq.length; i++) {
    const v = freq[i] ?? NaN;
    if (Number.isNaN(v)) {
      throw new ScienceInputError(
        `y[${i}]`,
        "is missing: phase cannot be integrated across a gap; analyse the frequency data instead",
      );
    }
    acc += v * tau0;
    x[i + 1] = acc;
  }
  return x;
}

export interface SampleSummary {
  readonly count: number;
  readonly missing: number;
  readonly mean: number;
  /** Sample standard deviation (n − 1), 0 for a single sample. */
  readonly standardDeviation: number;
}

/** Count, missing, mean and sample standard deviation of a series (two-pass, for accuracy). */
export function summarizeSamples(y: ArrayLike<number>): SampleSummary {
  const v = readSamples(y, "y");
  let count = 0;
  let sum = 0;
  for (const value of v) {
    if (!Number.isNaN(value)) {
      count++;
      sum += value;
    }
  }
  if (count === 0) throw new ScienceInputError("y", "has no valid sample (all are missing)");
  const mean = sum / count;
  let ss = 0;
  for (const value of v) if (!Number.isNaN(value)) ss += (value - mean) ** 2;
  const standardDeviation = count > 1 ? Math.sqrt(ss / (count - 1)) : 0;
  return { count, missing: v.length - count, mean, standardDeviation };
}
