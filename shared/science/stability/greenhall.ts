// Equivalent degrees of freedom of variances built from d-th differences of phase, by the
// algorithm of C. A. Greenhall and W. J. Riley, "Uncertainty of stability variances based on
// finite differences", Proc. 35th PTTI (2003), eqs. 7–10 and Tables 1–3 (the tables give the
// asymptotic coefficients used when the exact sum would need more than J_max terms).
// d = 2: Allan and modified Allan (filter F = 1); d = 3: Hadamard. Stride S = m overlapping, 1 not.
// Two choices of Equipot, both checked in the tests against the exact edf of Gaussian noise:
// - unmodified variances, α ≤ 0: the point-sampled phase form F = ∞ at every m (the paper takes
//   F = m while m(d + 1) ≤ J_max). Frequency averages over τ0 without dead time are point samples
//   of phase, for which F = ∞ is exact (white FM: to 1e-6), while F = m is up to 12 % off at small m;
// - white PM, unmodified: the exact covariance of independent phase samples (inverseWhitePm).

import { ScienceInputError } from "../errors";
import { requirePositiveInteger } from "../validate";

const J_MAX = 100;

/** Generalised autocovariance of power-law phase noise, eq. 7 (α of S_y ∝ f^α, −4 … 2). */
function sw(t: number, alpha: number): number {
  const a = Math.abs(t);
  switch (alpha) {
    case 2:
      return -a;
    case 1:
      return a === 0 ? 0 : t * t * Math.log(a);
    case 0:
      return a * a * a;
    case -1:
      return a === 0 ? 0 : t ** 4 * Math.log(a);
    case -2:
      return a ** 5;
    case -3:
      return a === 0 ? 0 : t ** 6 * Math.log(a);
    default:
      return a ** 7;
  }
}

/** Eq. 8: the phase averaged over 1/F of τ (F = ∞: no averaging). */
function sx(t: number, f: number, alpha: number): number {
  if (f === Infinity) return sw(t, alpha + 2);
  return f * f * (2 * sw(t, alpha) - sw(t - 1 / f, alpha) - sw(t + 1 / f, alpha));
}

const BINOMIAL_ROWS: Record<number, readonly number[]> = {
  1: [2, 1],
  2: [6, 4, 1],
  3: [20, 15, 6, 1],
};

/** Eq. 9: autocovariance of the d-th difference, Σ_k (−1)^k C(2d, d+k) sx(t + k). */
function sz(t: number, f: number, alpha: number, d: number): number {
  const c = BINOMIAL_ROWS[d] ?? [];
  let sum = (c[0] ?? 0) * sx(t, f, alpha);
  for (let k = 1; k <= d; k++) {
    const sign = k % 2 === 0 ? 1 : -1;
    sum += sign * (c[k] ?? 0) * (sx(t - k, f, alpha) + sx(t + k, f, alpha));
  }
  return sum;
}

/** Eq. 10, the basic sum. */
function basicSum(j: number, m: number, s: number, f: number, alpha: number, d: number): number {
  let sum = sz(0, f, alpha, d) ** 2 + (1 - j / m) * sz(j / s, f, alpha, d) ** 2;
  for (let k = 1; k < j; k++) sum += 2 * (1 - k / m) * sz(k / s, f, alpha, d) ** 2;
  return sum;
}

function exactInverse(j: number, m: number, s: number, f: number, alpha: number, d: number) {
  return basicSum(j, m, s, f, alpha, d) / (sz(0, f, alpha, d) ** 2 * m);
}

// Tables 1–3 of Greenhall & Riley (2003): rows α = 2 … −4, columns d = 1 … 3, pairs (a0, a1).
// Table 1 serves modified variances, Table 2 unmodified ones, Table 3 (b0, b1) flicker PM.
type Pair = readonly [number, number];
const NA: Pair = [NaN, NaN];
const TABLE_1: readonly (readonly Pair[])[] = [
  [
    [2 / 3, 1 / 3],
    [7 / 9, 1 / 2],
    [22 / 25, 2 / 3],
  ],
  [
    [0.84, 0.345],
    [0.997, 0.616],
    [1.141, 0.843],
  ],
  [
    [1.079, 0.368],
    [1.033, 0.607],
    [1.184, 0.848],
  ],
  [NA, [1.048, 0.534], [1.18, 0.816]],
  [NA, [1.302, 0.535], [1.175, 0.777]],
  [NA, NA, [1.194, 0.703]],
  [NA, NA, [1.489, 0.702]],
];
const TABLE_2: readonly (readonly Pair[])[] = [
  [
    [3 / 2, 1 / 2],
    [35 / 18, 1],
    [231 / 100, 3 / 2],
  ],
  [
    [78.6, 25.2],
    [790, 410],
    [9950, 6520],
  ],
  [
    [2 / 3, 1 / 6],
    [2 / 3, 1 / 3],
    [7 / 9, 1 / 2],
  ],
  [NA, [0.852, 0.375], [0.997, 0.617]],
  [NA, [1.079, 0.368], [1.033, 0.607]],
  [NA, NA, [1.053, 0.553]],
  [NA, NA, [1.302, 0.535]],
];
const TABLE_3: readonly Pair[] = [
  [6, 4],
  [15.23, 12],
  [47.8, 40],
];

function entry(table: readonly (readonly Pair[])[], alpha: number, d: number): Pair {
  return table[2 - alpha]?.[d - 1] ?? NA;
}

export interface GreenhallInput {
  /** Noise exponent α, an integer with α + 2d > 1. */
  readonly alpha: number;
  /** Order of the phase difference: 2 Allan, 3 Hadamard. */
  readonly d: number;
  /** Averaging factor. */
  readonly m: number;
  /** Modified (phase averaged over τ) or not. */
  readonly modified: boolean;
  /** Overlapping estimator (stride τ0) or not (stride τ). */
  readonly overlapping: boolean;
  /** Number of terms in the estimate (M in the paper). */
  readonly terms: number;
}

/** 1/edf by Greenhall & Riley (2003); white PM of unmodified variances is done exactly instead. */
function inverseEdf(g: GreenhallInput): number {
  const { alpha, d, m } = g;
  const s = g.overlapping ? m : 1;
  const bigM = g.terms;
  const j = Math.min(bigM, (d + 1) * s);
  const r = bigM / s;
  // At m = 1 the modified variance is the unmodified one (no phase averaging).
  if (g.modified && m > 1) {
    if (j <= J_MAX) return exactInverse(j, bigM, s, 1, alpha, d);
    if (r > d + 1) {
      const [a0, a1] = entry(TABLE_1, alpha, d);
      return (a0 - a1 / r) / r;
    }
    return exactInverse(J_MAX, J_MAX, J_MAX / r, 1, alpha, d);
  }
  if (alpha <= 0) {
    if (j <= J_MAX) return exactInverse(j, bigM, s, Infinity, alpha, d); // F = ∞, see above
    if (r > d + 1) {
      const [a0, a1] = entry(TABLE_2, alpha, d);
      return (a0 - a1 / r) / r;
    }
    return exactInverse(J_MAX, J_MAX, J_MAX / r, Infinity, alpha, d);
  }
  if (alpha === 1) return inverseFlickerPm(j, bigM, s, r, m, d);
  return inverseWhitePm(bigM, s, d);
}

function inverseFlickerPm(j: number, bigM: number, s: number, r: number, m: number, d: number) {
  if (j <= J_MAX) return exactInverse(j, bigM, s, m, 1, d);
  const [b0, b1] = TABLE_3[d - 1] ?? NA;
  const scale = (b0 + b1 * Math.log(m)) ** 2;
  if (r > d + 1) {
    const [a0, a1] = entry(TABLE_2, 1, d);
    return (a0 - a1 / r) / (scale * r);
  }
  return basicSum(J_MAX, J_MAX, J_MAX / r, J_MAX / r, 1, d) / (scale * J_MAX);
}

/**
 * White PM, unmodified: the phase samples are independent, so the terms' covariance is exact:
 * lag k·m samples gives (−1)^k C(2d, d+k). edf = 2E²/Var (SP 1065 §5.3.1 definition of edf).
 * Greenhall & Riley's case 4 is the large-M limit of this (Table 2, row α = 2).
 */
function inverseWhitePm(bigM: number, s: number, d: number): number {
  const c = BINOMIAL_ROWS[d] ?? [];
  const c0 = c[0] ?? 1;
  let sum = bigM * c0 * c0;
  for (let k = 1; k <= d; k++) {
    const pairs = bigM - k * s;
    if (pairs > 0) sum += 2 * pairs * (c[k] ?? 0) ** 2;
  }
  return sum / (bigM * bigM * c0 * c0);
}

/** α must be an integer from −2 … 2 (−4 … 2 for the Hadamard variance). */
export function requireAlpha(alpha: number, d: number): number {
  const min = d === 3 ? -4 : -2;
  if (!Number.isInteger(alpha) || alpha < min || alpha > 2) {
    throw new ScienceInputError(
      "alpha",
      `must be a whole number from ${min} to 2, got ${String(alpha)}`,
    );
  }
  return alpha;
}

/** Greenhall–Riley edf, kept within [1, terms] (the bounds of a sum of correlated χ²₁ terms). */
export function greenhallEdf(g: GreenhallInput): number {
  if (g.d !== 2 && g.d !== 3)
    throw new ScienceInputError("d", `must be 2 or 3, got ${String(g.d)}`);
  requireAlpha(g.alpha, g.d);
  requirePositiveInteger(g.m, "m");
  requirePositiveInteger(g.terms, "terms");
  const edf = 1 / inverseEdf(g);
  if (!Number.isFinite(edf)) return Math.max(1, g.terms);
  return Math.min(Math.max(edf, 1), g.terms);
}
