// One pass of preparation shared by every statistic: the mean-removed running sum of frequency
// (phase divided by τ0) and, when there are gaps, a running count of missing samples, so each term
// of each statistic costs O(1) and a term spanning a gap is found in O(1). Memory: the running
// sum (8 bytes per sample); the gap counts only when there are gaps; a copy of the input only when
// it is not already a Float64Array; for phase input the frequency it gives.
import { ScienceInputError } from "../errors";
import { requirePositive } from "../validate";
import { scanSamples } from "./phase";

export interface PreparedSeries {
  readonly input: "frequency" | "phase";
  /** Samples given and missing among them. */
  readonly samples: number;
  readonly inputMissing: number;
  /** Frequency samples n and how many are missing. */
  readonly n: number;
  readonly missing: number;
  readonly tau0: number;
  /** sums[k] = Σ_{i<k} (y_i − ȳ), a missing y counted as 0; length n + 1. */
  readonly sums: Float64Array;
  /** gaps[k] = number of missing y_i with i < k; null when nothing is missing. */
  readonly gaps: Int32Array | null;
}

function toFrequency(x: Float64Array, tau0: number): Float64Array {
  const y = new Float64Array(Math.max(x.length - 1, 0));
  for (let i = 0; i < y.length; i++) y[i] = ((x[i + 1] ?? NaN) - (x[i] ?? NaN)) / tau0;
  return y;
}

function frequencyScan(data: ArrayLike<number>, tau0: number, fromPhase: boolean) {
  const raw = scanSamples(data, fromPhase ? "x" : "y");
  if (!fromPhase) return { raw, y: raw.values, missing: raw.missing, total: raw.total };
  const y = toFrequency(raw.values, tau0);
  let missing = 0;
  let total = 0;
  for (const v of y) {
    if (v !== v) missing++;
    else total += v;
  }
  return { raw, y, missing, total };
}

function runningSums(y: Float64Array, mean: number, gaps: Int32Array | null): Float64Array {
  const sums = new Float64Array(y.length + 1);
  let acc = 0;
  if (gaps === null) {
    for (let i = 0; i < y.length; i++) {
      acc += (y[i] ?? 0) - mean;
      sums[i + 1] = acc;
    }
    return sums;
  }
  let holes = 0;
  for (let i = 0; i < y.length; i++) {
    const v = y[i] ?? 0;
    if (v !== v) holes++;
    else acc += v - mean;
    sums[i + 1] = acc;
    gaps[i + 1] = holes;
  }
  return sums;
}

export function prepareSeries(
  data: ArrayLike<number>,
  tau0: number,
  fromPhase = false,
): PreparedSeries {
  requirePositive(tau0, "tau0");
  const { raw, y, missing, total } = frequencyScan(data, tau0, fromPhase);
  if (y.length - missing < 2) {
    throw new ScienceInputError(fromPhase ? "x" : "y", "needs at least 2 valid frequency samples");
  }
  const gaps = missing > 0 ? new Int32Array(y.length + 1) : null;
  const sums = runningSums(y, total / (y.length - missing), gaps);
  return {
    input: fromPhase ? "phase" : "frequency",
    samples: raw.values.length,
    inputMissing: raw.missing,
    n: y.length,
    missing,
    tau0,
    sums,
    gaps,
  };
}
