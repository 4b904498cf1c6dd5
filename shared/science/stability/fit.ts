// White-FM level and flicker floor from the long-τ part of an Allan deviation curve.
// Model (IEEE Std 1139-2008, Allan variance of power-law noise): σ²_y(τ) = h0/(2τ) + 2 ln2·h−1,
// i.e. σ²(τ) = a/τ + b with σ(1 s) = √a and the flicker floor √b. Fitted to the variances by
// weighted least squares, weights edf/(2σ⁴) (the variance of a χ² variance estimate, SP 1065 §5.3).
// Use ADEV or overlapping ADEV points: MDEV has other coefficients.
import { ScienceInputError } from "../errors";
import { requireNonEmpty, requirePositive } from "../validate";

export interface FitPoint {
  readonly tau: number;
  readonly deviation: number;
  readonly edf?: number;
}

export interface WhiteFrequencyFit {
  /** White-FM σ_y at τ = 1 s, and its standard uncertainty. */
  readonly sigmaAt1s: number;
  readonly sigmaAt1sUncertainty: number;
  /** Flicker floor (fractional), or null when the data show none (not 2σ above zero). */
  readonly flickerFloor: number | null;
  readonly flickerFloorUncertainty: number | null;
  /** The τ range (s) and number of points used. */
  readonly fromTauS: number;
  readonly toTauS: number;
  readonly pointsUsed: number;
  readonly method: "weighted least squares on σ² = a/τ + b";
}

export interface FitOptions {
  /** Use points with τ ≥ this (s). Default: from where the log-log slope is first above −0.75. */
  readonly minTauS?: number;
}

function checkedPoints(points: readonly FitPoint[]): FitPoint[] {
  requireNonEmpty(points, "points");
  points.forEach((p, i) => {
    requirePositive(p.tau, `points[${i}].tau`);
    requirePositive(p.deviation, `points[${i}].deviation`);
    if (p.edf !== undefined) requirePositive(p.edf, `points[${i}].edf`);
  });
  return [...points].sort((a, b) => a.tau - b.tau);
}

const slope = (p: FitPoint, q: FitPoint) =>
  Math.log(q.deviation / p.deviation) / Math.log(q.tau / p.tau);

/** The long-τ part: drop the leading phase-noise region (slope ≈ −1) and any random-walk tail. */
function longTauPart(sorted: FitPoint[], options: FitOptions): FitPoint[] {
  let part: FitPoint[];
  if (options.minTauS !== undefined) {
    const min = requirePositive(options.minTauS, "minTauS");
    part = sorted.filter((p) => p.tau >= min);
  } else {
    let start = 0;
    while (start + 1 < sorted.length) {
      const [p, q] = [sorted[start], sorted[start + 1]];
      if (p === undefined || q === undefined || slope(p, q) > -0.75) break;
      start++;
    }
    part = sorted.slice(start);
  }
  let end = part.length;
  for (let i = 1; i < part.length; i++) {
    const [p, q] = [part[i - 1], part[i]];
    if (p !== undefined && q !== undefined && slope(p, q) > 0.25) {
      end = i;
      break;
    }
  }
  return part.slice(0, end);
}

interface Sums {
  sxx: number;
  sx1: number;
  s11: number;
  sxv: number;
  s1v: number;
}

/** Sums of the normal equations; weights from the model variance when given, else the observed. */
function weightedSums(points: FitPoint[], model?: (tau: number) => number): Sums {
  const s: Sums = { sxx: 0, sx1: 0, s11: 0, sxv: 0, s1v: 0 };
  for (const p of points) {
    const v = p.deviation ** 2;
    const ref = model !== undefined ? model(p.tau) : v;
    const w = (p.edf ?? 1) / (2 * ref * ref);
    const x = 1 / p.tau;
    s.sxx += w * x * x;
    s.sx1 += w * x;
    s.s11 += w;
    s.sxv += w * x * v;
    s.s1v += w * v;
  }
  return s;
}

interface Coefficients {
  a: number;
  b: number;
  varA: number;
  varB: number;
}

function solveTwo(s: Sums): Coefficients | null {
  const det = s.sxx * s.s11 - s.sx1 * s.sx1;
  if (!(det > 1e-12 * s.sxx * s.s11)) return null;
  return {
    a: (s.s11 * s.sxv - s.sx1 * s.s1v) / det,
    b: (s.sxx * s.s1v - s.sx1 * s.sxv) / det,
    varA: s.s11 / det,
    varB: s.sxx / det,
  };
}

interface Fit {
  a: number;
  varA: number;
  floor: Coefficients | null;
}

function fitOnce(used: FitPoint[], model?: (tau: number) => number): Fit {
  const s = weightedSums(used, model);
  const two = used.length >= 3 ? solveTwo(s) : null;
  const floor = two !== null && two.b > 2 * Math.sqrt(two.varB) && two.a > 0 ? two : null;
  if (floor !== null) return { a: floor.a, varA: floor.varA, floor };
  return { a: s.sxv / s.sxx, varA: 1 / s.sxx, floor: null };
}

/**
 * Fits σ²(τ) = a/τ (+ b when significant) to stability points. The weights are refined twice
 * from the fitted model (iteratively reweighted least squares), which removes the bias toward
 * low points that weights from the observed variances would give.
 */
export function fitWhiteFrequencyLevel(
  points: readonly FitPoint[],
  options: FitOptions = {},
): WhiteFrequencyFit {
  const used = longTauPart(checkedPoints(points), options);
  if (used.length === 0) throw new ScienceInputError("minTauS", "leaves no point to fit");
  let fit = fitOnce(used);
  for (let i = 0; i < 2 && fit.a > 0; i++) {
    const { a, floor } = fit;
    fit = fitOnce(used, (tau) => a / tau + (floor !== null ? floor.b : 0));
  }
  const { a, varA, floor } = fit;
  if (!(a > 0)) {
    throw new ScienceInputError(
      "points",
      "show no white frequency noise (σ² does not fall as 1/τ)",
    );
  }
  const sigmaAt1s = Math.sqrt(a);
  const first = used[0];
  const last = used[used.length - 1];
  return {
    sigmaAt1s,
    // σ(√a) = σ(a)/(2√a) to first order.
    sigmaAt1sUncertainty: Math.sqrt(varA) / (2 * sigmaAt1s),
    flickerFloor: floor !== null ? Math.sqrt(floor.b) : null,
    flickerFloorUncertainty:
      floor !== null ? Math.sqrt(floor.varB) / (2 * Math.sqrt(floor.b)) : null,
    fromTauS: first?.tau ?? 0,
    toTauS: last?.tau ?? 0,
    pointsUsed: used.length,
    method: "weighted least squares on σ² = a/τ + b",
  };
}
