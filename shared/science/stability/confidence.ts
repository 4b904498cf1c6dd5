// Chi-squared confidence interval of a deviation from its edf, NIST SP 1065 (Riley 2008) eq. 45:
// σ_low = σ·√(edf/χ²(1 − p/2, edf)), σ_high = σ·√(edf/χ²(p/2, edf)), p = 1 − probability.
// Quantiles from @stdlib/stats-base-dists-chisquare-quantile.
import chisquareQuantile from "@stdlib/stats-base-dists-chisquare-quantile";
import { ONE_SIGMA_PROBABILITY } from "../constants";
import { requireNonNegative, requirePositive, requireRange } from "../validate";
import { ScienceInputError } from "../errors";

export interface ConfidenceInterval {
  readonly low: number;
  readonly high: number;
}

export function confidenceInterval(
  deviation: number,
  edf: number,
  probability: number = ONE_SIGMA_PROBABILITY,
): ConfidenceInterval {
  requireNonNegative(deviation, "deviation");
  requirePositive(edf, "edf");
  requireRange(probability, "probability", 1e-9, 1 - 1e-9);
  const tail = (1 - probability) / 2;
  const chiHigh = chisquareQuantile(1 - tail, edf);
  const chiLow = chisquareQuantile(tail, edf);
  const low = deviation * Math.sqrt(edf / chiHigh);
  const high = deviation * Math.sqrt(edf / chiLow);
  if (!Number.isFinite(low) || !Number.isFinite(high)) {
    throw new ScienceInputError("edf", `gives no finite interval at probability ${probability}`);
  }
  return { low, high };
}
