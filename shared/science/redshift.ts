// Gravitational redshift and heights. Convention: y = (ν_remote − ν_reference)/ν_reference after
// known corrections; the higher clock runs faster, so y > 0 means the remote clock sits higher.
// To first order y = ΔC/c² with ΔC the geopotential-number difference, remote minus reference
// (C = W0 − W grows upward), and ΔH = ΔC/γ̄ with γ̄ mean normal gravity along the plumb line.
import { SPEED_OF_LIGHT_SQUARED_M2_PER_S2 } from "./constants";
import { meanNormalGravity, requireSiteHeight, type EllipsoidModel } from "./gravity";
import { ScienceInputError } from "./errors";
import { requireFinite, requireLatitude } from "./validate";

/** |y| beyond 1e-11 (about 90 km of height) is outside the near-Earth normal-gravity formula. */
export const MAX_FRACTIONAL_FREQUENCY_FOR_HEIGHT = 1e-11;
const MAX_HEIGHT_DIFFERENCE_M = 90_000;

/** ΔC = c²·y, m²/s² (geopotential-number difference, remote minus reference). */
export function fractionalFrequencyToPotential(y: number): number {
  return requireFinite(y, "fractionalFrequency") * SPEED_OF_LIGHT_SQUARED_M2_PER_S2;
}

/** y = ΔC/c², the inverse of fractionalFrequencyToPotential. */
export function potentialToFractionalFrequency(geopotentialDifferenceM2PerS2: number): number {
  return (
    requireFinite(geopotentialDifferenceM2PerS2, "geopotentialDifference") /
    SPEED_OF_LIGHT_SQUARED_M2_PER_S2
  );
}

export interface HeightFromFrequencyInput {
  /** y = (ν_remote − ν_reference)/ν_reference. */
  readonly fractionalFrequency: number;
  /** Latitude of the plumb line (the remote site), degrees. */
  readonly latitudeDeg: number;
  /** Height of the reference level the difference starts from, m (0 for sea level). */
  readonly heightM: number;
  readonly model?: EllipsoidModel;
}

export interface HeightFromFrequencyResult {
  /** ΔC, m²/s². */
  readonly geopotentialDifference: number;
  /** ΔH, m, remote minus reference. */
  readonly heightDifference: number;
  /** Mean normal gravity between heightM and heightM + ΔH, m/s². */
  readonly meanGravity: number;
}

/**
 * ΔH = ΔC/γ̄ where γ̄ is the mean normal gravity along the plumb line over [h, h + ΔH]. γ̄ depends on
 * ΔH only through the free-air gradient (3e-7 per metre relative), so a fixed-point iteration
 * converges to machine precision in a few steps. A local conversion at one latitude: for sites
 * far apart, compare geopotential numbers.
 */
export function heightDifferenceFromFrequency(
  input: HeightFromFrequencyInput,
): HeightFromFrequencyResult {
  const latitudeDeg = requireLatitude(input.latitudeDeg);
  const heightM = requireSiteHeight(input.heightM);
  const model = input.model ?? "GRS80";
  const y = requireFinite(input.fractionalFrequency, "fractionalFrequency");
  if (Math.abs(y) > MAX_FRACTIONAL_FREQUENCY_FOR_HEIGHT) {
    throw new ScienceInputError(
      "fractionalFrequency",
      `|y| must be at most ${MAX_FRACTIONAL_FREQUENCY_FOR_HEIGHT} (about 90 km of height), got ${y}`,
    );
  }
  const geopotentialDifference = fractionalFrequencyToPotential(y);
  let meanGravity = meanNormalGravity(latitudeDeg, heightM, heightM, model);
  let heightDifference = geopotentialDifference / meanGravity;
  for (let i = 0; i < 8; i++) {
    meanGravity = meanNormalGravity(latitudeDeg, heightM, heightM + heightDifference, model);
    const next = geopotentialDifference / meanGravity;
    const done = Math.abs(next - heightDifference) <= 1e-15 * Math.abs(next);
    heightDifference = next;
    if (done) break;
  }
  return { geopotentialDifference, heightDifference, meanGravity };
}

export interface FrequencyFromHeightInput {
  /** ΔH, m, remote minus reference. */
  readonly heightDifferenceM: number;
  readonly latitudeDeg: number;
  /** Height of the reference level, m. */
  readonly heightM: number;
  readonly model?: EllipsoidModel;
}

export interface FrequencyFromHeightResult {
  /** Expected y = ΔC/c². */
  readonly fractionalFrequency: number;
  readonly geopotentialDifference: number;
  readonly meanGravity: number;
}

/** The expected fractional frequency offset for a known height difference: y = γ̄·ΔH/c². */
export function frequencyFromHeightDifference(
  input: FrequencyFromHeightInput,
): FrequencyFromHeightResult {
  const latitudeDeg = requireLatitude(input.latitudeDeg);
  const heightM = requireSiteHeight(input.heightM);
  const deltaM = requireFinite(input.heightDifferenceM, "heightDifferenceM");
  if (Math.abs(deltaM) > MAX_HEIGHT_DIFFERENCE_M) {
    throw new ScienceInputError(
      "heightDifferenceM",
      `must be within ±${MAX_HEIGHT_DIFFERENCE_M} m, got ${deltaM}`,
    );
  }
  const meanGravity = meanNormalGravity(latitudeDeg, heightM, heightM + deltaM, input.model);
  const geopotentialDifference = meanGravity * deltaM;
  return {
    fractionalFrequency: geopotentialDifference / SPEED_OF_LIGHT_SQUARED_M2_PER_S2,
    geopotentialDifference,
    meanGravity,
  };
}

/** Metres of height per unit of fractional frequency at a place: c²/γ (about 9.2e15 m). */
export function heightPerFractionalFrequency(
  latitudeDeg: number,
  heightM: number,
  model: EllipsoidModel = "GRS80",
): number {
  requireSiteHeight(heightM);
  return SPEED_OF_LIGHT_SQUARED_M2_PER_S2 / meanNormalGravity(latitudeDeg, heightM, heightM, model);
}
