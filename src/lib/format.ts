// Display formats (DESIGN.md §8): SI units, tabular figures, times in UTC with local time beside.
const degrees = new Intl.NumberFormat("en-GB", {
  minimumFractionDigits: 5,
  maximumFractionDigits: 5,
  signDisplay: "negative",
});
// No thousands separator: "2871.0 m" reads the same in every locale.
const metres = new Intl.NumberFormat("en-GB", {
  minimumFractionDigits: 1,
  maximumFractionDigits: 1,
  signDisplay: "negative",
  useGrouping: false,
});

export function formatLatitude(latitudeDeg: number): string {
  return `${degrees.format(Math.abs(latitudeDeg))}° ${latitudeDeg < 0 ? "S" : "N"}`;
}

export function formatLongitude(longitudeDeg: number): string {
  return `${degrees.format(Math.abs(longitudeDeg))}° ${longitudeDeg < 0 ? "W" : "E"}`;
}

export function formatHeightM(heightM: number): string {
  return `${metres.format(heightM)} m`;
}

const pad = (value: number) => String(value).padStart(2, "0");

/** "2025-06-03 14:05 UTC" */
export function formatUtc(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  const day = `${date.getUTCFullYear()}-${pad(date.getUTCMonth() + 1)}-${pad(date.getUTCDate())}`;
  return `${day} ${pad(date.getUTCHours())}:${pad(date.getUTCMinutes())} UTC`;
}

/** "16:05 local" (with the date when it differs from the UTC date). */
export function formatLocalBeside(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return "";
  const time = `${pad(date.getHours())}:${pad(date.getMinutes())}`;
  const sameDay = date.getDate() === date.getUTCDate();
  const day = `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
  return sameDay ? `${time} local` : `${day} ${time} local`;
}

/** Parses a typed decimal number; accepts a decimal comma. Empty or unreadable gives NaN. */
export function parseDecimal(value: unknown): number {
  if (typeof value === "number") return value;
  if (typeof value !== "string") return Number.NaN;
  const cleaned = value.trim().replace(/\s/g, "").replace(",", ".").replace("−", "-");
  if (cleaned === "" || !/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(cleaned)) return Number.NaN;
  return Number(cleaned);
}

const superscriptOf: Readonly<Record<string, string>> = Object.fromEntries(
  [..."0123456789-+"].map((c, i) => [c, "⁰¹²³⁴⁵⁶⁷⁸⁹⁻⁺"[i] ?? c]),
);
/** "⁻¹⁸" → "-18": superscript digits and signs back to ASCII. */
export const asciiOfSuperscript: Readonly<Record<string, string>> = Object.fromEntries(
  Object.entries(superscriptOf).map(([ascii, sup]) => [sup, ascii]),
);

/** 10ᵏ as "10⁻¹⁵". */
export function powerOfTen(k: number): string {
  return `10${[...String(k)].map((c) => superscriptOf[c] ?? c).join("")}`;
}

/**
 * "1.23 × 10⁻¹⁵" with `digits` significant figures, kept as a measure of precision; `trimZeros`
 * drops trailing zeros, for values shown as they were typed ("1.2 × 10⁻¹⁸"). 0 stays "0".
 */
export function formatScientific(value: number, digits = 3, { trimZeros = false } = {}): string {
  if (!Number.isFinite(value)) return "—";
  if (value === 0) return "0";
  const [mantissa = "", exponent = "0"] = value.toExponential(digits - 1).split("e");
  const shown = trimZeros && mantissa.includes(".") ? mantissa.replace(/\.?0+$/, "") : mantissa;
  return `${shown.replace("-", "−")} × ${powerOfTen(Number(exponent))}`;
}
