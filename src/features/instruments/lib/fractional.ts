// Fractional (dimensionless) values such as 1e-15 or 1.2e-18: read as typed, shown in scientific
// notation. The display form is read back too, so a value copied from the page can be pasted.
import { parseDecimal } from "../../../lib/format";

const superscripts = "⁰¹²³⁴⁵⁶⁷⁸⁹";
const toSuperscript: Record<string, string> = { "-": "⁻", "+": "⁺" };
for (const [i, s] of [...superscripts].entries()) toSuperscript[String(i)] = s;
const fromSuperscript: Record<string, string> = Object.fromEntries(
  Object.entries(toSuperscript).map(([ascii, sup]) => [sup, ascii]),
);

/** "1e-15", "1,2e-18", "1.2 × 10⁻¹⁸", "1.2x10^-18" → number; anything else → NaN. */
export function parseFractional(text: string): number {
  const ascii = [...text.trim()]
    .map((c) => fromSuperscript[c] ?? c)
    .join("")
    .replace(/−/g, "-")
    .replace(/\s*[×x*]\s*10\s*\^?\s*/i, "e");
  return parseDecimal(ascii);
}

/** "1.2 × 10⁻¹⁸" with up to `digits` significant figures (trailing zeros dropped); 0 stays "0". */
export function formatFractional(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return "—";
  if (value === 0) return "0";
  const [mantissa = "", exponent = "0"] = value.toExponential(digits - 1).split("e");
  const trimmed = mantissa.includes(".") ? mantissa.replace(/\.?0+$/, "") : mantissa;
  const exp = [...String(Number(exponent))].map((c) => toSuperscript[c] ?? c).join("");
  return `${trimmed.replace("-", "−")} × 10${exp}`;
}

/** For a form field: "1e-15", "1.2e-18" (plain ASCII, as people type it). */
export function fractionalForInput(value: number): string {
  if (value === 0) return "0";
  return Number(value.toPrecision(12)).toExponential();
}
