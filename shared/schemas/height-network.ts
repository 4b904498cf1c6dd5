// The levelling network of a campaign: sections from the field books (closed ones, the mean of
// forward and back) and imported section height differences, adjusted by least squares with the
// campaign's benchmarks as fixed points (shared/science/levelling/adjust.ts).
import { z } from "zod";
import { between, geodesyLimits as L, positiveUpTo, required, text } from "./geodesy-fields";

export const heightTieFields = z
  .strictObject({
    fromMark: required("From mark", L.codeMax),
    toMark: required("To mark", L.codeMax),
    deltaM: between("Height difference", L.sectionDeltaM.min, L.sectionDeltaM.max, "m"),
    lengthKm: between("Length", L.sectionLengthKm.min, L.sectionLengthKm.max, "km"),
    sigmaM: positiveUpTo("Standard deviation", 1, "m").nullable().default(null),
  })
  .refine((t) => t.fromMark !== t.toMark, {
    message: "From and to marks must differ",
    path: ["toMark"],
  });
export type HeightTieFields = z.input<typeof heightTieFields>;

/** POST …/height-ties/import: CSV text (from, to, dh_m, length_km, sigma_mm optional). */
export const heightTieImportInput = z.strictObject({
  fileName: text("File name", L.textMax).default(""),
  content: z.string().min(1, "The file is empty"),
});

export const heightTieView = z.object({
  id: z.uuid(),
  fromMark: z.string(),
  toMark: z.string(),
  deltaM: z.number(),
  lengthKm: z.number(),
  sigmaM: z.number().nullable(),
  source: z.string(),
  importedAt: z.string(),
  importedByName: z.string().nullable(),
});
export type HeightTieView = z.infer<typeof heightTieView>;

export const adjustmentOptions = z.strictObject({
  /** σ per √km for observations without their own σ, mm (default 1 mm/√km). */
  sigmaPerSqrtKmMm: between("σ per √km", 0.01, 100, "mm").default(1),
  significance: between("Significance", 0.001, 0.2).default(0.05),
  /** Observations (section or tie ids) left out, e.g. a flagged blunder. */
  excluded: z.array(z.uuid()).max(5000).default([]),
});
export type AdjustmentOptions = z.output<typeof adjustmentOptions>;

export const observationSource = z.enum(["field-book", "imported"]);

export const adjustedObservationView = z.object({
  /** The levelling section's or the imported tie's id. */
  sourceId: z.uuid(),
  source: observationSource,
  fromMark: z.string(),
  toMark: z.string(),
  deltaM: z.number(),
  lengthKm: z.number(),
  sigmaM: z.number(),
  residualM: z.number(),
  standardized: z.number(),
  redundancy: z.number(),
  /** |w| above the critical value, or the largest when the global test fails. */
  flagged: z.boolean(),
});

export const adjustedPointView = z.object({
  mark: z.string(),
  heightM: z.number(),
  sigmaM: z.number(),
  fixed: z.boolean(),
  /** Set for fixed points: the benchmark's id and its published σ. */
  benchmarkId: z.uuid().nullable(),
  benchmarkSigmaM: z.number().nullable(),
});

export const adjustmentView = z.object({
  id: z.uuid(),
  computedAt: z.string(),
  computedByName: z.string().nullable(),
  options: z.object({
    sigmaPerSqrtKmMm: z.number(),
    significance: z.number(),
    excluded: z.array(z.uuid()),
  }),
  points: z.array(adjustedPointView),
  observations: z.array(adjustedObservationView),
  dof: z.number().int(),
  sigma0: z.number().nullable(),
  globalTest: z
    .object({
      passed: z.boolean(),
      statistic: z.number(),
      lower: z.number(),
      upper: z.number(),
      significance: z.number(),
    })
    .nullable(),
  /** Marks that no observation chain joins to a benchmark (left out of the adjustment). */
  unconnected: z.array(z.string()),
  /** Observations in the network when this was computed, so a page can say "out of date". */
  observationCount: z.number().int(),
});
export type AdjustmentView = z.infer<typeof adjustmentView>;
