// Fractional (dimensionless) values such as 1e-15 or 1.2e-18: read as typed, shown in scientific
// notation. The display form is read back too, so a value copied from the page can be pasted.
import { asciiOfSuperscript, formatScientific, parseDecimal } from "../../../lib/format";

/** "1e-15", "1,2e-18", "1.2 × 10⁻¹⁸", "1.2x10^-18" → number; anything else → NaN. */
export function parseFractional(text: string): number {
  const ascii = [...text.trim()]
    .map((c) => asciiOfSuperscript[c] ?? c)
    .join("")
    .replace(/−/g, "-")
    .replace(/\s*[×x*]\s*10\s*\^?\s*/i, "e");
  return parseDecimal(ascii);
}

/** "1.2 × 10⁻¹⁸" with up to `digits` significant figures (trailing zeros dropped); 0 stays "0". */
export function formatFractional(value: number, digits = 3): string {
  return formatScientific(value, digits, { trimZeros: true });
}

/** For a form field: "1e-15", "1.2e-18" (plain ASCII, as people type it). */
export function fractionalForInput(value: number): string {
  if (value === 0) return "0";
  return Number(value.toPrecision(12)).toExponential();
}
