// Tick labels for uPlot axes. uPlot hands a log axis every split (1…9 × 10ᵏ) and null for the
// ones it hides; labelling only the decades keeps a tablet-width axis readable.
import { powerOfTen } from "../../../lib/format";

/** 10ᵏ as "10⁻¹⁵"; other splits of a log axis stay unlabelled. */
export function decadeLabels(splits: readonly (number | null)[]): string[] {
  return splits.map((v) => {
    if (v === null || !(v > 0)) return "";
    const k = Math.log10(v);
    return Math.abs(k - Math.round(k)) < 1e-9 ? powerOfTen(Math.round(k)) : "";
  });
}

/** Metres on a log axis as millimetres at the decades: "0.1", "1", "1000". */
export function decadeMmLabels(splitsM: readonly (number | null)[]): string[] {
  return splitsM.map((v) => {
    if (v === null || !(v > 0)) return "";
    const k = Math.log10(v * 1000);
    if (Math.abs(k - Math.round(k)) >= 1e-9) return "";
    const mm = 10 ** Math.round(k);
    return mm >= 1 ? mm.toLocaleString("en") : String(Number(mm.toPrecision(1)));
  });
}

/**
 * A linear axis of small numbers, "1.0e-15"; hidden splits stay empty. Digits are added until
 * neighbouring ticks differ (a series far from zero, 2.898e-13 … 2.902e-13, needs four).
 */
export function exponentLabels(splits: readonly (number | null)[], minDigits = 1): string[] {
  const label = (digits: number) =>
    splits.map((v) => (v === null ? "" : v === 0 ? "0" : v.toExponential(digits)));
  for (let digits = minDigits; digits < 8; digits++) {
    const labels = label(digits).filter((l) => l !== "");
    if (new Set(labels).size === labels.length) return label(digits);
  }
  return label(8);
}

const pad = (n: number) => String(n).padStart(2, "0");

/** Unix seconds on a time axis, in UTC, 24-hour: "13:00", and the date ("07-13") at midnight. */
export function utcTimeLabels(splits: readonly (number | null)[]): string[] {
  return splits.map((v) => {
    if (v === null) return "";
    const d = new Date(v * 1000);
    const hm = `${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())}`;
    return hm === "00:00" && d.getUTCSeconds() === 0
      ? `${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}`
      : hm;
  });
}
