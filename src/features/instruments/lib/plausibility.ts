// Values the schema accepts but that are unusual for the trade (DOMAIN.md §3): shown as warnings
// while typing, never refused — most often an exponent typed one off. Values the schema refuses
// get their error at the field instead, not a warning as well.
import { geodesyLimits as L } from "../../../../shared/schemas/geodesy-fields";
import { formatFractional } from "./fractional";

const accepted = (value: number, range: { min: number; max: number }) =>
  Number.isFinite(value) && value >= range.min && value <= range.max;

/** Clock instability at 1 s, usual range. */
export const usualInstabilityAt1s = { min: 1e-17, max: 1e-13 } as const;
/** A single systematic term above this is unusual. */
export const usualSystematicMax = 1e-14;

export interface PlausibilityInput {
  instabilityAt1s: number;
  systematic: readonly { name: string; value: number }[];
}

export function unusualValues({ instabilityAt1s, systematic }: PlausibilityInput): string[] {
  const warnings: string[] = [];
  const { min, max } = usualInstabilityAt1s;
  if (
    accepted(instabilityAt1s, L.instabilityAt1s) &&
    (instabilityAt1s < min || instabilityAt1s > max)
  )
    warnings.push(
      `Instability at 1 s of ${formatFractional(instabilityAt1s)} is outside the usual ${formatFractional(min)} … ${formatFractional(max)}: check the exponent.`,
    );
  for (const term of systematic) {
    if (accepted(term.value, L.systematic) && term.value > usualSystematicMax)
      warnings.push(
        `${term.name.trim() || "A systematic term"} of ${formatFractional(term.value)} is above the usual ${formatFractional(usualSystematicMax)}: check the exponent.`,
      );
  }
  return warnings;
}
