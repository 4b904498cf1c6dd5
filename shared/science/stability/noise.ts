// Power-law noise identification by the lag-1 autocorrelation (W. J. Riley and C. A. Greenhall,
// "Power law noise identification using the lag 1 autocorrelation", Proc. 18th EFTF, 2004;
// NIST SP 1065 §5.6). Frequency data are averaged over m samples and the linear drift removed;
// r1 gives δ = r1/(1 + r1); while δ ≥ 0.25 the series is differenced (at most dmax times);
// then α = −2(δ + d), rounded to the nearest integer.
// Long series: r1 is taken over 16 384 averages in 64 blocks spread evenly over the whole series
// (standard error about 0.008, against ≥ 0.07 from each type's r1 to the nearest decision
// boundary), which keeps the identification O(1) per factor instead of O(N).
import { ScienceInputError } from "../errors";
import { requirePositive, requirePositiveInteger } from "../validate";
import { prepareSeries, type PreparedSeries } from "./prepare";
import { NOISE_TYPES, type NoiseType } from "./types";
import { lag1ByDifferences } from "./lag1";

/** Fewest averages the method is trusted with (Riley & Greenhall 2004). */
export const MIN_POINTS_FOR_NOISE_ID = 30;
/** Series longer than this are sampled (see above). */
export const MAX_NOISE_ID_PAIRS = 16_384;

export interface NoiseIdentification {
  readonly noise: NoiseType;
  /** Integer α used (clamped to the five types, −2 … 2). */
  readonly alpha: number;
  /** The unrounded estimate −2(δ + d). */
  readonly alphaEstimate: number;
  readonly method: "lag-1 autocorrelation";
  /** Lag-1 autocorrelation of the last differenced series, and the number of differences. */
  readonly lag1: number;
  readonly differences: number;
  /** Valid averages in the series, and lag-1 pairs the last r1 used. */
  readonly points: number;
  readonly pairs: number;
}

export function noiseTypeForAlpha(alpha: number): NoiseType {
  const found = NOISE_TYPES.find((t) => t.alpha === alpha);
  return found?.id ?? "white-fm";
}

/** Average of m samples from k·m on, or NaN when the window holds a missing sample. */
function average(p: PreparedSeries, m: number, k: number): number {
  const a = k * m;
  if (p.gaps !== null && (p.gaps[a + m] ?? 0) !== (p.gaps[a] ?? 0)) return NaN;
  return ((p.sums[a + m] ?? 0) - (p.sums[a] ?? 0)) / m;
}

function validAverages(p: PreparedSeries, m: number, length: number): number {
  if (p.gaps === null) return length;
  let n = 0;
  for (let k = 0; k < length; k++) if ((p.gaps[k * m + m] ?? 0) === (p.gaps[k * m] ?? 0)) n++;
  return n;
}

/** Sampled long series: this many blocks of consecutive averages, spread over the series. */
const BLOCKS = 64;

/** r1 at each number of differences d = 0 … dmax, for the averages at factor m. */
function lag1ByOrder(p: PreparedSeries, m: number, length: number, dmax: number) {
  const rows = length <= MAX_NOISE_ID_PAIRS ? 1 : BLOCKS;
  const width = rows === 1 ? length : MAX_NOISE_ID_PAIRS / BLOCKS;
  const starts = new Int32Array(rows);
  const values = new Float64Array(rows * width);
  for (let r = 0; r < rows; r++) {
    // Evenly spread blocks; read in order, so the memory is walked forward.
    const k = rows === 1 ? 0 : Math.floor((r * (length - width)) / (rows - 1));
    starts[r] = k;
    for (let j = 0; j < width; j++) values[r * width + j] = average(p, m, k + j);
  }
  return lag1ByDifferences(starts, values, width, dmax);
}

/** Identification at factor m, or null when fewer than 30 valid averages are available. */
export function identifyPrepared(
  p: PreparedSeries,
  m: number,
  dmax = 2,
): NoiseIdentification | null {
  const length = Math.floor(p.n / m);
  const points = validAverages(p, m, length);
  if (points < MIN_POINTS_FOR_NOISE_ID) return null;
  const byOrder = lag1ByOrder(p, m, length, dmax);
  for (let d = 0; d <= dmax; d++) {
    const { r1, pairs } = byOrder[d] ?? { r1: 0, pairs: 0 };
    const delta = r1 > -1 + 1e-12 ? r1 / (1 + r1) : -Infinity;
    if (delta < 0.25 || d >= dmax) {
      const estimate = Math.min(Math.max(-2 * (delta + d), -1e3), 1e3);
      const alpha = Math.min(2, Math.max(-2, Math.round(estimate)));
      const noise = noiseTypeForAlpha(alpha);
      return {
        noise,
        alpha,
        alphaEstimate: estimate,
        method: "lag-1 autocorrelation",
        lag1: r1,
        differences: d,
        points,
        pairs,
      };
    }
  }
  return null;
}

/** Noise type of fractional-frequency samples y (or phase with fromPhase) at one factor. */
export function identifyNoise(
  y: ArrayLike<number>,
  tau0: number,
  factor: number,
  options: { readonly fromPhase?: boolean } = {},
): NoiseIdentification {
  requirePositive(tau0, "tau0");
  requirePositiveInteger(factor, "factor");
  const p = prepareSeries(y, tau0, options.fromPhase ?? false);
  const found = identifyPrepared(p, factor);
  if (found === null) {
    throw new ScienceInputError(
      "factor",
      `leaves fewer than ${MIN_POINTS_FOR_NOISE_ID} valid averages of ${factor} samples ` +
        `(the series has ${p.n - p.missing} valid samples)`,
    );
  }
  return found;
}
