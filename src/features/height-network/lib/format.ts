// Numbers of the network page: heights and height differences in metres to 0.1 mm, σ and
// residuals in mm; a true minus sign so columns of tabular figures line up.
const minus = (text: string) => text.replace("-", "−");

/** "+10.5090 m" */
export function formatDeltaM(m: number): string {
  const text = m.toFixed(4);
  return `${m > 0 ? "+" : ""}${minus(text === "-0.0000" ? "0.0000" : text)} m`;
}

/** "448.1087 m" */
export const formatHeight4M = (m: number) => `${minus(m.toFixed(4))} m`;

/** "1.2 mm" (digits as asked) */
export function formatMm(m: number, digits = 1): string {
  const text = (m * 1000).toFixed(digits);
  return `${minus(/^-0\.?0*$/.test(text) ? text.slice(1) : text)} mm`;
}

export const formatKm = (km: number) => `${km.toFixed(3)} km`;

export const formatNumber = (value: number, digits: number) => minus(value.toFixed(digits));
