// Durations and small numbers for people: "3 d 4 h", "45 min", "1.2 × 10⁻¹⁵".

const minuteS = 60;
const hourS = 3600;
const dayS = 86_400;

/** Two units at most, largest first; under a minute in seconds. */
export function formatDuration(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) return "—";
  if (seconds < minuteS) return `${Math.round(seconds)} s`;
  if (seconds < hourS) return `${Math.round(seconds / minuteS)} min`;
  if (seconds < dayS) {
    const h = Math.floor(seconds / hourS);
    const min = Math.round((seconds - h * hourS) / minuteS);
    return min === 60 ? `${h + 1} h` : min === 0 ? `${h} h` : `${h} h ${min} min`;
  }
  const d = Math.floor(seconds / dayS);
  const h = Math.round((seconds - d * dayS) / hourS);
  return h === 24 ? `${d + 1} d` : h === 0 ? `${d} d` : `${d} d ${h} h`;
}

/** Metres shown in millimetres: "12.3 mm". */
export function formatMm(metres: number, digits = 1): string {
  if (!Number.isFinite(metres)) return "—";
  return `${(metres * 1000).toFixed(digits).replace("-", "−")} mm`;
}

/** A signed height difference in metres with its uncertainty in mm: "−0.842 m ± 12.3 mm". */
export function formatHeightWithSigma(heightM: number, sigmaM: number): string {
  return `${heightM.toFixed(3).replace("-", "−")} m ± ${formatMm(sigmaM)}`;
}
