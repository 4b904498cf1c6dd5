// Weighted least-squares adjustment of a levelling network tied to fixed benchmarks
// (observation equations, Ghilani & Wolf, "Adjustment Computations", 4th ed., ch. 12):
// v = A·x̂ − l, x̂ = (AᵀWA)⁻¹AᵀWl, W = diag(1/σ²). The global test compares vᵀWv with χ²(dof)
// (two-sided); residuals are standardised as w_i = v_i/√(Qvv)_ii, Baarda's data snooping.
import chisquareQuantile from "@stdlib/stats-base-dists-chisquare-quantile";
import { ScienceInputError } from "../errors";
import { requirePositive, requireRange } from "../validate";
import { readNetwork, type FixedPoint, type LevellingObservation, type Network } from "./network";
import { invertNormal } from "./normal";

export interface AdjustmentInput {
  readonly fixed: readonly FixedPoint[];
  readonly observations: readonly LevellingObservation[];
}

export interface AdjustmentOptions {
  /** σ per √km for observations given by length only, m (default 1 mm/√km). */
  readonly sigmaPerSqrtKmM?: number;
  /** Significance of the global test (default 0.05). */
  readonly significance?: number;
  /** |w| above this flags a blunder (default 3.29, α0 = 0.001 two-sided: common practice). */
  readonly criticalStandardized?: number;
  /** Require redundancy for the global test (default true); false allows dof = 0 without tests. */
  readonly test?: boolean;
}

export interface AdjustedHeight {
  readonly point: string;
  readonly heightM: number;
  /** A-posteriori standard deviation ŝ0·√Qxx (a priori when dof = 0), m; 0 for fixed points. */
  readonly sigmaM: number;
  readonly sigmaAPrioriM: number;
  readonly fixed: boolean;
}

export interface AdjustmentResidual {
  readonly index: number;
  readonly from: string;
  readonly to: string;
  /** Adjusted minus observed, m. */
  readonly residualM: number;
  /** w = v/√Qvv with the a-priori σ; 0 where the observation has no redundancy. */
  readonly standardized: number;
  /** Redundancy number r = Qvv/σ², in [0, 1]. */
  readonly redundancy: number;
}

export interface GlobalTest {
  readonly passed: boolean;
  /** vᵀWv, compared with the χ²(dof) quantiles at significance/2 and 1 − significance/2. */
  readonly statistic: number;
  readonly lower: number;
  readonly upper: number;
  readonly significance: number;
}

export interface AdjustmentResult {
  readonly heights: readonly AdjustedHeight[];
  readonly residuals: readonly AdjustmentResidual[];
  /** A-posteriori standard deviation of unit weight √(vᵀWv/dof); null when dof = 0. */
  readonly sigma0: number | null;
  readonly dof: number;
  readonly globalTest: GlobalTest | null;
  readonly suspect: AdjustmentResidual | null;
}

/** Approximate heights along a spanning tree from the fixed points, so the unknowns are small. */
function approximateHeights(
  net: Network,
  obs: readonly LevellingObservation[],
): Map<string, number> {
  const known = new Map(net.fixed);
  for (let grew = true; grew;) {
    grew = false;
    for (const o of obs) {
      const hf = known.get(o.from);
      const ht = known.get(o.to);
      if (hf !== undefined && ht === undefined) known.set(o.to, hf + o.deltaM);
      else if (ht !== undefined && hf === undefined) known.set(o.from, ht - o.deltaM);
      else continue;
      grew = true;
    }
  }
  return known;
}

interface Solution {
  readonly corrections: Float64Array;
  readonly cofactor: Float64Array;
  readonly reduced: Float64Array;
}

/** Builds and solves the normal equations for corrections to the approximate heights. */
function solve(
  net: Network,
  obs: readonly LevellingObservation[],
  h0: Map<string, number>,
): Solution {
  const u = net.unknowns.length;
  const normal = new Float64Array(u * u);
  const rhs = new Float64Array(u);
  const reduced = new Float64Array(obs.length);
  obs.forEach((o, i) => {
    const w = 1 / (net.sigmasM[i] ?? 1) ** 2;
    const l = o.deltaM - ((h0.get(o.to) ?? 0) - (h0.get(o.from) ?? 0));
    reduced[i] = l;
    const a = net.index.get(o.from);
    const b = net.index.get(o.to);
    if (b !== undefined) {
      normal[b * u + b] = (normal[b * u + b] ?? 0) + w;
      rhs[b] = (rhs[b] ?? 0) + w * l;
    }
    if (a !== undefined) {
      normal[a * u + a] = (normal[a * u + a] ?? 0) + w;
      rhs[a] = (rhs[a] ?? 0) - w * l;
    }
    if (a !== undefined && b !== undefined) {
      normal[a * u + b] = (normal[a * u + b] ?? 0) - w;
      normal[b * u + a] = (normal[b * u + a] ?? 0) - w;
    }
  });
  const cofactor = u > 0 ? invertNormal(normal, u) : new Float64Array(0);
  const corrections = new Float64Array(u);
  for (let i = 0; i < u; i++) {
    let s = 0;
    for (let j = 0; j < u; j++) s += (cofactor[i * u + j] ?? 0) * (rhs[j] ?? 0);
    corrections[i] = s;
  }
  return { corrections, cofactor, reduced };
}

function residualsOf(
  net: Network,
  obs: readonly LevellingObservation[],
  s: Solution,
): AdjustmentResidual[] {
  const u = net.unknowns.length;
  const q = (i: number | undefined, j: number | undefined) =>
    i === undefined || j === undefined ? 0 : (s.cofactor[i * u + j] ?? 0);
  return obs.map((o, i) => {
    const a = net.index.get(o.from);
    const b = net.index.get(o.to);
    const dx =
      (b === undefined ? 0 : (s.corrections[b] ?? 0)) -
      (a === undefined ? 0 : (s.corrections[a] ?? 0));
    const residualM = dx - (s.reduced[i] ?? 0);
    const sigma = net.sigmasM[i] ?? 1;
    // (A Qxx Aᵀ)_ii for a row with +1 at b and −1 at a.
    const qll = q(b, b) + q(a, a) - 2 * q(a, b);
    const qvv = Math.max(sigma * sigma - qll, 0);
    const redundancy = Math.min(qvv / (sigma * sigma), 1);
    const standardized = redundancy > 1e-10 ? residualM / Math.sqrt(qvv) : 0;
    return { index: i, from: o.from, to: o.to, residualM, standardized, redundancy };
  });
}

function globalTestOf(statistic: number, dof: number, significance: number): GlobalTest {
  const lower = chisquareQuantile(significance / 2, dof);
  const upper = chisquareQuantile(1 - significance / 2, dof);
  return {
    passed: statistic >= lower && statistic <= upper,
    statistic,
    lower,
    upper,
    significance,
  };
}

function suspectOf(residuals: AdjustmentResidual[], test: GlobalTest, critical: number) {
  let worst: AdjustmentResidual | null = null;
  for (const r of residuals) {
    if (
      r.redundancy > 1e-10 &&
      (worst === null || Math.abs(r.standardized) > Math.abs(worst.standardized))
    )
      worst = r;
  }
  if (worst === null) return null;
  return Math.abs(worst.standardized) > critical || test.statistic > test.upper ? worst : null;
}

function heightsOf(
  net: Network,
  h0: Map<string, number>,
  s: Solution,
  scale: number,
): AdjustedHeight[] {
  const u = net.unknowns.length;
  const fixed = [...net.fixed].map(([point, heightM]) => ({
    point,
    heightM,
    sigmaM: 0,
    sigmaAPrioriM: 0,
    fixed: true,
  }));
  const free = net.unknowns.map((point, i) => {
    const apriori = Math.sqrt(Math.max(s.cofactor[i * u + i] ?? 0, 0));
    const heightM = (h0.get(point) ?? 0) + (s.corrections[i] ?? 0);
    return { point, heightM, sigmaM: apriori * scale, sigmaAPrioriM: apriori, fixed: false };
  });
  return [...fixed, ...free];
}

export function adjustLevellingNetwork(
  input: AdjustmentInput,
  options: AdjustmentOptions = {},
): AdjustmentResult {
  const significance = requireRange(options.significance ?? 0.05, "significance", 1e-6, 0.5);
  const critical = requirePositive(options.criticalStandardized ?? 3.29, "criticalStandardized");
  const net = readNetwork(input.fixed, input.observations, options.sigmaPerSqrtKmM ?? 0.001);
  const obs = input.observations;
  const dof = obs.length - net.unknowns.length;
  const wantTest = options.test ?? true;
  if (dof === 0 && wantTest) {
    throw new ScienceInputError(
      "observations",
      "the network has no redundancy (0 degrees of freedom): the global test and blunder detection need at least one more observation; pass { test: false } to adjust without them",
    );
  }
  const h0 = approximateHeights(net, obs);
  const solution = solve(net, obs, h0);
  const residuals = residualsOf(net, obs, solution);
  const vtpv = residuals.reduce((s, r) => s + (r.residualM / (net.sigmasM[r.index] ?? 1)) ** 2, 0);
  const sigma0 = dof > 0 ? Math.sqrt(vtpv / dof) : null;
  const globalTest = dof > 0 ? globalTestOf(vtpv, dof, significance) : null;
  return {
    heights: heightsOf(net, h0, solution, sigma0 ?? 1),
    residuals,
    sigma0,
    dof,
    globalTest,
    suspect: globalTest === null ? null : suspectOf(residuals, globalTest, critical),
  };
}
