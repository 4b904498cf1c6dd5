// Field builders shared by the geodesy schemas (benchmarks, instruments, runs, height ties): each
// error message names the field and the allowed range (DOMAIN.md §3).
import { z } from "zod";
import { hasNul, nulMessage } from "./text";

export const text = (field: string, max: number) =>
  z
    .string({ error: `${field} must be text` })
    .trim()
    .max(max, `${field} must be at most ${max} characters`)
    .refine((v) => !hasNul(v), nulMessage(field));

export const required = (field: string, max: number) =>
  text(field, max).pipe(z.string().min(1, `${field} is required`));

export const between = (field: string, min: number, max: number, unit = "") =>
  z
    .number({ error: `${field} must be a number` })
    .finite(`${field} must be a number`)
    .min(min, `${field} must be between ${min} and ${max}${unit === "" ? "" : ` ${unit}`}`)
    .max(max, `${field} must be between ${min} and ${max}${unit === "" ? "" : ` ${unit}`}`);

/** Positive and at most max: zero is refused (an uncertainty of exactly 0 is not a measurement). */
export const positiveUpTo = (field: string, max: number, unit = "") =>
  z
    .number({ error: `${field} must be a number` })
    .finite(`${field} must be a number`)
    .positive(`${field} must be above 0`)
    .max(max, `${field} must be at most ${max}${unit === "" ? "" : ` ${unit}`}`);

export const geodesyLimits = {
  codeMax: 40,
  nameMax: 120,
  textMax: 200,
  noteMax: 2000,
  latitudeDeg: { min: -90, max: 90 },
  longitudeDeg: { min: -180, max: 180 },
  /** Benchmark heights, m: the deepest land depression to the highest summit, with margin. */
  heightM: { min: -500, max: 9000 },
  heightSigmaM: { max: 10 },
  /** DOMAIN.md §3: instability at 1 s 1e-17 … 1e-13; systematic 1e-19 … 1e-14 (warnings beyond). */
  instabilityAt1s: { min: 1e-19, max: 1e-11 },
  systematic: { min: 0, max: 1e-12 },
  systematicTermsMax: 40,
  /** DOMAIN.md §3: target height uncertainty 1 mm … 10 m. */
  targetHeightUncertaintyM: { min: 0.001, max: 10 },
  sectionLengthKm: { min: 0.001, max: 100 },
  sectionDeltaM: { min: -3000, max: 3000 },
} as const;
