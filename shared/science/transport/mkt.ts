// Mean kinetic temperature (J. D. Haynes, J. Pharm. Sci. 60 (1971) 927, as used in USP <1079>):
// T_MKT = (ΔH/R) / −ln[Σ w_i exp(−ΔH/(R·T_i)) / Σ w_i], T in kelvin, ΔH/R = 83.144 kJ/mol ÷
// 8.3144 J/(mol·K) = 10 000 K by default. Evaluated with a log-sum-exp for range safety.
import { ScienceInputError } from "../errors";
import { requireNonEmpty, requireNonNegative, requirePositive, requireRange } from "../validate";

export const KELVIN_OFFSET = 273.15;
export const DEFAULT_ACTIVATION_OVER_R_K = 83_144 / 8.3144;

export function meanKineticTemperature(
  samplesC: ArrayLike<number>,
  weights?: ArrayLike<number>,
  activationOverRK: number = DEFAULT_ACTIVATION_OVER_R_K,
): number {
  requireNonEmpty(samplesC, "samplesC");
  requirePositive(activationOverRK, "activationOverRK");
  if (weights !== undefined && weights.length !== samplesC.length) {
    throw new ScienceInputError(
      "weights",
      `must have one weight per sample (${samplesC.length}), got ${weights.length}`,
    );
  }
  const exponents = new Float64Array(samplesC.length);
  let top = -Infinity;
  for (let i = 0; i < samplesC.length; i++) {
    const t = requireRange(samplesC[i] ?? NaN, `samplesC[${i}]`, -KELVIN_OFFSET + 1e-6, 1e4);
    exponents[i] = -activationOverRK / (t + KELVIN_OFFSET);
    top = Math.max(top, exponents[i] ?? -Infinity);
  }
  let sum = 0;
  let total = 0;
  for (let i = 0; i < exponents.length; i++) {
    const w = weights === undefined ? 1 : requireNonNegative(weights[i] ?? NaN, `weights[${i}]`);
    sum += w * Math.exp((exponents[i] ?? 0) - top);
    total += w;
  }
  if (!(total > 0)) throw new ScienceInputError("weights", "must not all be zero");
  const logMean = top + Math.log(sum / total);
  return activationOverRK / -logMean - KELVIN_OFFSET;
}
