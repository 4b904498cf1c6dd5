// The named stability functions. Each returns one point per valid factor (see types.ts for the
// point and for the gap information carried on the array).
import { analyzeStability, toCurve } from "./curve";
import type { FactorChoice, StabilityCurve, StabilityOptions } from "./types";

/** Non-overlapping Allan deviation (NIST SP 1065 §5.2.2). */
export function allanDeviation(
  y: ArrayLike<number>,
  tau0: number,
  factors?: FactorChoice,
  options?: StabilityOptions,
): StabilityCurve {
  return toCurve(analyzeStability("adev", y, tau0, factors, options));
}

/** Overlapping Allan deviation (NIST SP 1065 §5.2.4). */
export function overlappingAllanDeviation(
  y: ArrayLike<number>,
  tau0: number,
  factors?: FactorChoice,
  options?: StabilityOptions,
): StabilityCurve {
  return toCurve(analyzeStability("oadev", y, tau0, factors, options));
}

/** Modified Allan deviation (NIST SP 1065 §5.2.5). */
export function modifiedAllanDeviation(
  y: ArrayLike<number>,
  tau0: number,
  factors?: FactorChoice,
  options?: StabilityOptions,
): StabilityCurve {
  return toCurve(analyzeStability("mdev", y, tau0, factors, options));
}

/** Time deviation, TDEV = (τ/√3)·MDEV, in seconds (NIST SP 1065 §5.2.6). */
export function timeDeviation(
  y: ArrayLike<number>,
  tau0: number,
  factors?: FactorChoice,
  options?: StabilityOptions,
): StabilityCurve {
  return toCurve(analyzeStability("tdev", y, tau0, factors, options));
}

/** Overlapping Hadamard deviation (NIST SP 1065 §5.2.8); insensitive to linear frequency drift. */
export function overlappingHadamardDeviation(
  y: ArrayLike<number>,
  tau0: number,
  factors?: FactorChoice,
  options?: StabilityOptions,
): StabilityCurve {
  return toCurve(analyzeStability("ohdev", y, tau0, factors, options));
}
