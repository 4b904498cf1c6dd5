// Checks a levelling network and numbers its unknown points; finds points that no chain of
// observations joins to a fixed point (their heights would be undetermined).
import { ScienceInputError } from "../errors";
import { requireFinite, requireName, requireNonEmpty, requirePositive } from "../validate";

export interface FixedPoint {
  readonly point: string;
  readonly heightM: number;
}

export interface LevellingObservation {
  readonly from: string;
  readonly to: string;
  /** Observed height difference to − from, m. */
  readonly deltaM: number;
  /** Standard deviation, m. Weight 1/σ². */
  readonly sigmaM?: number;
  /** Section length, km. Without sigmaM, σ = sigmaPerSqrtKmM·√length (weight ∝ 1/length). */
  readonly lengthKm?: number;
}

export interface Network {
  readonly fixed: ReadonlyMap<string, number>;
  /** Unknown points, in the order of the unknowns. */
  readonly unknowns: readonly string[];
  readonly index: ReadonlyMap<string, number>;
  /** A-priori σ of each observation, m. */
  readonly sigmasM: Float64Array;
}

function readFixed(fixed: readonly FixedPoint[]): Map<string, number> {
  requireNonEmpty(fixed, "fixed");
  const map = new Map<string, number>();
  fixed.forEach((f, i) => {
    requireName(f.point, `fixed[${i}].point`);
    requireFinite(f.heightM, `fixed[${i}].heightM`);
    if (map.has(f.point))
      throw new ScienceInputError(`fixed[${i}].point`, `${f.point} is fixed twice`);
    map.set(f.point, f.heightM);
  });
  return map;
}

// Plausible standard deviations of a levelled height difference: 1 nm … 1 km. The bounds also
// keep the weights 1/σ² far from overflow.
const SIGMA_MIN_M = 1e-9;
const SIGMA_MAX_M = 1e3;

function sigmaOf(o: LevellingObservation, i: number, perSqrtKm: number): number {
  const field = `observations[${i}]`;
  let sigma: number;
  if (o.sigmaM !== undefined) sigma = requirePositive(o.sigmaM, `${field}.sigmaM`);
  else if (o.lengthKm !== undefined) {
    sigma = perSqrtKm * Math.sqrt(requirePositive(o.lengthKm, `${field}.lengthKm`));
  } else throw new ScienceInputError(field, "needs sigmaM or lengthKm to be weighted");
  if (sigma < SIGMA_MIN_M || sigma > SIGMA_MAX_M) {
    throw new ScienceInputError(
      field,
      `σ = ${sigma} m is outside ${SIGMA_MIN_M} … ${SIGMA_MAX_M} m`,
    );
  }
  return sigma;
}

function checkObservation(o: LevellingObservation, i: number): void {
  requireName(o.from, `observations[${i}].from`);
  requireName(o.to, `observations[${i}].to`);
  requireFinite(o.deltaM, `observations[${i}].deltaM`);
  if (o.from === o.to)
    throw new ScienceInputError(`observations[${i}]`, `goes from ${o.from} to itself`);
}

/** Union–find root with path halving. */
function root(parent: Map<string, string>, p: string): string {
  let q = p;
  for (let up = parent.get(q); up !== undefined && up !== q; up = parent.get(q)) {
    const grand = parent.get(up) ?? up;
    parent.set(q, grand);
    q = grand;
  }
  return q;
}

function requireConnected(
  fixed: Map<string, number>,
  obs: readonly LevellingObservation[],
  points: string[],
) {
  const parent = new Map<string, string>();
  for (const p of [...fixed.keys(), ...points]) parent.set(p, p);
  const anchor = "\u0000fixed";
  parent.set(anchor, anchor);
  for (const p of fixed.keys()) parent.set(root(parent, p), root(parent, anchor));
  for (const o of obs) parent.set(root(parent, o.from), root(parent, o.to));
  const tied = root(parent, anchor);
  const loose = points.filter((p) => root(parent, p) !== tied);
  if (loose.length > 0) {
    throw new ScienceInputError(
      "observations",
      `no chain of observations joins ${loose.slice(0, 5).join(", ")}${loose.length > 5 ? ", …" : ""} to a fixed point`,
    );
  }
}

export function readNetwork(
  fixedPoints: readonly FixedPoint[],
  observations: readonly LevellingObservation[],
  sigmaPerSqrtKmM: number,
): Network {
  const fixed = readFixed(fixedPoints);
  requireNonEmpty(observations, "observations");
  requirePositive(sigmaPerSqrtKmM, "sigmaPerSqrtKmM");
  const index = new Map<string, number>();
  const unknowns: string[] = [];
  const sigmasM = new Float64Array(observations.length);
  observations.forEach((o, i) => {
    checkObservation(o, i);
    sigmasM[i] = sigmaOf(o, i, sigmaPerSqrtKmM);
    for (const p of [o.from, o.to]) {
      if (!fixed.has(p) && !index.has(p)) {
        index.set(p, unknowns.length);
        unknowns.push(p);
      }
    }
  });
  requireConnected(fixed, observations, unknowns);
  return { fixed, unknowns, index, sigmasM };
}
