// Property-test sizes: small in every run, larger with EQUIPOT_SOAK=1.
export const SOAK = process.env.EQUIPOT_SOAK === "1";

export function runs(normal: number, soak: number = normal * 20): number {
  return SOAK ? soak : normal;
}

/** Relative difference |a − b| / |b|. */
export function relative(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

/** Every number anywhere in a value is finite (results never hold NaN or Infinity). */
export function allFinite(value: unknown): boolean {
  if (typeof value === "number") return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(allFinite);
  if (value !== null && typeof value === "object") return Object.values(value).every(allFinite);
  return true;
}
