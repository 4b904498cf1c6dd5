// Normal gravity of a level ellipsoid: the closed Somigliana formula with the second-order
// height correction (NIMA TR8350.2, eq. 4-1 and 4-3; Moritz, "Geodetic Reference System 1980").
import { requireLatitude, requireRange } from "./validate";
import { ScienceInputError } from "./errors";

export type EllipsoidModel = "GRS80" | "WGS84";

export interface NormalGravityEllipsoid {
  readonly name: EllipsoidModel;
  /** Semi-major axis a, m. */
  readonly semiMajorAxisM: number;
  /** Flattening f. */
  readonly flattening: number;
  /** Geocentric gravitational constant GM, m³/s². */
  readonly gmM3PerS2: number;
  /** Angular velocity ω, rad/s. */
  readonly angularVelocityRadPerS: number;
  /** Normal gravity at the equator γ_e, m/s². */
  readonly gammaEquatorMPerS2: number;
  /** Normal gravity at the pole γ_p, m/s². */
  readonly gammaPoleMPerS2: number;
  /** Somigliana constant k = bγ_p/(aγ_e) − 1. */
  readonly somiglianaK: number;
  /** First eccentricity squared e². */
  readonly eccentricitySquared: number;
}

// Moritz (2000), "Geodetic Reference System 1980", J. Geodesy 74: a, GM, ω defining; f, γ_e, γ_p,
// k, e² derived and printed there.
export const GRS80: NormalGravityEllipsoid = {
  name: "GRS80",
  semiMajorAxisM: 6_378_137,
  flattening: 1 / 298.257222101,
  gmM3PerS2: 3.986005e14,
  angularVelocityRadPerS: 7.292115e-5,
  gammaEquatorMPerS2: 9.7803267715,
  gammaPoleMPerS2: 9.8321863685,
  somiglianaK: 0.001931851353,
  eccentricitySquared: 0.0066943800229,
};

// NIMA TR8350.2 (3rd ed., 2000), Tables 3.1 and 3.3: a, 1/f, GM, ω defining; γ_e, γ_p, k, e² derived.
export const WGS84: NormalGravityEllipsoid = {
  name: "WGS84",
  semiMajorAxisM: 6_378_137,
  flattening: 1 / 298.257223563,
  gmM3PerS2: 3.986004418e14,
  angularVelocityRadPerS: 7.292115e-5,
  gammaEquatorMPerS2: 9.7803253359,
  gammaPoleMPerS2: 9.8321849378,
  somiglianaK: 0.00193185265241,
  eccentricitySquared: 0.00669437999013,
};

/** The height correction is a series in h/a: heights are limited to the near-Earth range. */
export const NORMAL_GRAVITY_HEIGHT_RANGE_M = { min: -11_000, max: 100_000 } as const;

/** A height in the range normal gravity is computed for, m. */
export function requireSiteHeight(heightM: number, field = "heightM"): number {
  const { min, max } = NORMAL_GRAVITY_HEIGHT_RANGE_M;
  return requireRange(heightM, field, min, max);
}

export function ellipsoid(model: EllipsoidModel): NormalGravityEllipsoid {
  if (model === "GRS80") return GRS80;
  if (model === "WGS84") return WGS84;
  throw new ScienceInputError("model", `must be "GRS80" or "WGS84", got ${String(model)}`);
}

/** m = ω²a²b/GM, the ratio of centrifugal to gravitational force at the equator. */
export function geodeticParameterM(e: NormalGravityEllipsoid): number {
  const a = e.semiMajorAxisM;
  const b = a * (1 - e.flattening);
  return (e.angularVelocityRadPerS ** 2 * a * a * b) / e.gmM3PerS2;
}

/** Normal gravity on the ellipsoid, closed Somigliana formula, m/s². */
export function somiglianaGravity(latitudeDeg: number, e: NormalGravityEllipsoid): number {
  const s2 = Math.sin((latitudeDeg * Math.PI) / 180) ** 2;
  return (
    (e.gammaEquatorMPerS2 * (1 + e.somiglianaK * s2)) / Math.sqrt(1 - e.eccentricitySquared * s2)
  );
}

/**
 * Normal gravity at latitude φ and height h above the ellipsoid, m/s²:
 * γ_h = γ(φ)·[1 − (2/a)(1 + f + m − 2f sin²φ)h + 3h²/a²] (TR8350.2 eq. 4-3).
 */
export function normalGravity(
  latitudeDeg: number,
  heightM = 0,
  model: EllipsoidModel = "GRS80",
): number {
  requireLatitude(latitudeDeg);
  requireSiteHeight(heightM);
  const e = ellipsoid(model);
  const { c1, c2 } = heightCoefficients(latitudeDeg, e);
  return somiglianaGravity(latitudeDeg, e) * (1 - c1 * heightM + c2 * heightM * heightM);
}

interface HeightCoefficients {
  /** (2/a)(1 + f + m − 2f sin²φ), 1/m. */
  readonly c1: number;
  /** 3/a², 1/m². */
  readonly c2: number;
}

function heightCoefficients(latitudeDeg: number, e: NormalGravityEllipsoid): HeightCoefficients {
  const a = e.semiMajorAxisM;
  const f = e.flattening;
  const s2 = Math.sin((latitudeDeg * Math.PI) / 180) ** 2;
  return { c1: (2 / a) * (1 + f + geodeticParameterM(e) - 2 * f * s2), c2: 3 / (a * a) };
}

/**
 * Mean of normal gravity along the plumb line between heights h1 and h2 at one latitude, m/s²:
 * the exact mean of the second-order formula above over [h1, h2]. With h1 = 0 this is the mean
 * normal gravity used for normal heights (Heiskanen & Moritz 1967, eq. 4-42).
 */
export function meanNormalGravity(
  latitudeDeg: number,
  fromHeightM: number,
  toHeightM: number,
  model: EllipsoidModel = "GRS80",
): number {
  requireLatitude(latitudeDeg);
  requireSiteHeight(fromHeightM, "fromHeightM");
  requireSiteHeight(toHeightM, "toHeightM");
  const e = ellipsoid(model);
  const { c1, c2 } = heightCoefficients(latitudeDeg, e);
  const h1 = fromHeightM;
  const h2 = toHeightM;
  // ∫(1 − c1 h + c2 h²) dh / (h2 − h1), written so that h1 = h2 needs no special case.
  const mean = 1 - (c1 * (h1 + h2)) / 2 + (c2 * (h1 * h1 + h1 * h2 + h2 * h2)) / 3;
  return somiglianaGravity(latitudeDeg, e) * mean;
}
