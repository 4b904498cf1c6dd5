// Benchmarks: surveyed marks of the national height network with their published heights.
// Entered by geodesists, or imported from CSV or GeoJSON (shared/benchmark-import.ts).
import { z } from "zod";
import { between, geodesyLimits as L, positiveUpTo, required, text } from "./geodesy-fields";

export const benchmarkFields = z.strictObject({
  code: required("Code", L.codeMax),
  description: text("Description", L.textMax).default(""),
  latitudeDeg: between("Latitude", L.latitudeDeg.min, L.latitudeDeg.max, "°"),
  longitudeDeg: between("Longitude", L.longitudeDeg.min, L.longitudeDeg.max, "°"),
  heightM: between("Height", L.heightM.min, L.heightM.max, "m"),
  heightSigmaM: positiveUpTo("Height uncertainty", L.heightSigmaM.max, "m"),
  heightSystem: required("Height system", L.textMax),
  datum: text("Datum", L.textMax).default(""),
  source: text("Source", L.textMax).default(""),
});
export type BenchmarkFields = z.input<typeof benchmarkFields>;

export const benchmarkCreateInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  benchmark: benchmarkFields,
});
export const benchmarkUpdateInput = z.strictObject({
  baseVersion: z.number().int().positive(),
  benchmark: benchmarkFields,
});

export const benchmarkView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  code: z.string(),
  description: z.string(),
  latitudeDeg: z.number(),
  longitudeDeg: z.number(),
  heightM: z.number(),
  heightSigmaM: z.number(),
  heightSystem: z.string(),
  datum: z.string(),
  source: z.string(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type BenchmarkView = z.infer<typeof benchmarkView>;

/** A bad row of an import: its line (CSV) or feature number (GeoJSON), the field and the problem. */
export const importRowError = z.object({
  /** 1-based line of the file for CSV, 1-based feature number for GeoJSON. */
  row: z.number().int(),
  field: z.string(),
  message: z.string(),
});
export type ImportRowError = z.infer<typeof importRowError>;

/** POST …/benchmarks/import: the file's text; nothing is stored when any row is bad. */
export const benchmarkImportInput = z.strictObject({
  format: z.enum(["csv", "geojson"], { error: "Format must be csv or geojson" }),
  fileName: text("File name", L.textMax).default(""),
  content: z.string().min(1, "The file is empty"),
  /** A code already in the campaign: refuse the file (default) or update the benchmark. */
  onExisting: z.enum(["refuse", "update"]).default("refuse"),
});
export const benchmarkImportResult = z.object({
  created: z.number().int(),
  updated: z.number().int(),
  benchmarks: z.array(benchmarkView),
});
