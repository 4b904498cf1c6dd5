// Comparison runs: a remote clock against a reference clock over a link, with a target height
// uncertainty; their uploaded series, the stability analysis and the height result with its
// budget and the time left to the target.
import { z } from "zod";
import { between, geodesyLimits as L, positiveUpTo, required, text } from "./geodesy-fields";

export const seriesValueKinds = ["fractional", "ratio"] as const;
export const seriesValueKind = z.enum(seriesValueKinds, {
  error: "Values must be fractional (fractional frequency) or ratio (frequency ratio)",
});
export type SeriesValueKind = z.infer<typeof seriesValueKind>;

export const analysisStates = ["running", "done", "failed"] as const;
export type AnalysisState = (typeof analysisStates)[number];

export const comparisonLimits = {
  /** Rows per uploaded file. */
  rowsMax: 10_000_000,
  /** Bytes per uploaded file (10⁷ rows of ISO time and a 20-digit value fit well inside). */
  fileBytesMax: 1_000_000_000,
  /** Sample intervals accepted, s (DOMAIN.md §4: 1 s … 1000 s, with margin). */
  tau0S: { min: 0.001, max: 86_400 },
  /** Bad rows listed in an answer; the count says how many more. */
  errorsListed: 100,
  gapsListed: 200,
  /** Points of the decimated series sent for display. */
  displayPoints: 2000,
} as const;

export const comparisonRunFields = z
  .strictObject({
    name: required("Name", L.nameMax),
    remoteSiteId: z.uuid("Remote site must be chosen"),
    remoteClockId: z.uuid("Remote clock must be chosen"),
    referenceClockId: z.uuid("Reference clock must be chosen"),
    /** A link instrument with its own instability and systematics, or none. */
    linkId: z.uuid("Link must be an instrument id").nullable().default(null),
    linkName: required("Link name", L.nameMax),
    remoteMark: text("Remote mark", L.codeMax).default(""),
    referenceHeightM: between("Reference height", L.heightM.min, L.heightM.max, "m")
      .nullable()
      .default(null),
    referenceHeightSigmaM: positiveUpTo("Reference height uncertainty", L.heightSigmaM.max, "m")
      .nullable()
      .default(null),
    targetHeightUncertaintyM: between(
      "Target height uncertainty",
      L.targetHeightUncertaintyM.min,
      L.targetHeightUncertaintyM.max,
      "m",
    ),
    /** Valid data per wall-clock time expected before any data came in (DOMAIN.md: 0.5 … 0.9). */
    plannedUptime: between("Planned uptime", 0.01, 1).default(0.7),
    notes: text("Notes", L.noteMax).default(""),
  })
  .refine((r) => r.remoteClockId !== r.referenceClockId, {
    message: "The remote and reference clocks must differ",
    path: ["referenceClockId"],
  })
  .refine((r) => (r.referenceHeightM === null) === (r.referenceHeightSigmaM === null), {
    message: "Give the reference height together with its uncertainty",
    path: ["referenceHeightSigmaM"],
  });
export type ComparisonRunFields = z.input<typeof comparisonRunFields>;

export const comparisonRunCreateInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  run: comparisonRunFields,
});
export const comparisonRunUpdateInput = z.strictObject({
  baseVersion: z.number().int().positive(),
  run: comparisonRunFields,
});

export const comparisonRunView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  name: z.string(),
  remoteSiteId: z.uuid(),
  remoteClockId: z.uuid(),
  referenceClockId: z.uuid(),
  linkId: z.uuid().nullable(),
  linkName: z.string(),
  remoteMark: z.string(),
  referenceHeightM: z.number().nullable(),
  referenceHeightSigmaM: z.number().nullable(),
  targetHeightUncertaintyM: z.number(),
  plannedUptime: z.number(),
  notes: z.string(),
  dataRevision: z.number().int(),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ComparisonRunView = z.infer<typeof comparisonRunView>;

/**
 * Upload (POST …/comparison-runs/:runId/files, the file's bytes as the body, streamed): the
 * query names how to read it. Accepted columns are documented in README (comparison series).
 */
export const seriesUploadQuery = z.strictObject({
  fileName: required("File name", L.textMax),
  valueKind: seriesValueKind.default("fractional"),
  /** Frequency-ratio files: y = ratio/nominal − 1, computed in exact decimal arithmetic. */
  nominalRatio: z
    .string()
    .regex(/^\d+(\.\d+)?([eE][+-]?\d+)?$/, "Nominal ratio must be a positive decimal number")
    .optional(),
});

export const gapView = z.object({
  fromAt: z.string(),
  toAt: z.string(),
  /** Samples missing in the gap (at the file's interval). */
  missing: z.number().int(),
});
export type GapView = z.infer<typeof gapView>;

export const gapsSummary = z.object({
  count: z.number().int(),
  missingSamples: z.number().int(),
  /** The first gaps (up to comparisonLimits.gapsListed). */
  list: z.array(gapView),
});
export type GapsSummary = z.infer<typeof gapsSummary>;

export const comparisonFileView = z.object({
  id: z.uuid(),
  runId: z.uuid(),
  fileName: z.string(),
  byteSize: z.number().int(),
  valueKind: seriesValueKind,
  nominalRatio: z.string().nullable(),
  tau0S: z.number(),
  rowCount: z.number().int(),
  validCount: z.number().int(),
  firstAt: z.string(),
  lastAt: z.string(),
  gaps: gapsSummary,
  uploadedAt: z.string(),
  uploadedByName: z.string().nullable(),
});
export type ComparisonFileView = z.infer<typeof comparisonFileView>;

export const seriesRowError = z.object({
  /** 1-based line of the file. */
  line: z.number().int(),
  /** The column's header, or "row" for the whole row. */
  field: z.string(),
  message: z.string(),
});
export type SeriesRowError = z.infer<typeof seriesRowError>;

/** 422 answer of a refused upload: nothing was stored. */
export const seriesUploadRefusal = z.object({
  error: z.object({
    code: z.literal("invalid_file"),
    message: z.string(),
    rows: z.array(seriesRowError),
    /** Bad rows in all (the list holds the first ones). */
    badRows: z.number().int(),
  }),
});

export const stabilityPointView = z.object({
  tau: z.number(),
  deviation: z.number(),
  low68: z.number(),
  high68: z.number(),
  edf: z.number(),
  count: z.number().int(),
  noise: z.string(),
  noiseMethod: z.string(),
});
export type StabilityPointView = z.infer<typeof stabilityPointView>;

/** The series part of the analysis: what depends on the data only (stored per data revision). */
export const seriesAnalysis = z.object({
  dataRevision: z.number().int(),
  tau0S: z.number(),
  /** Grid points from the first to the last sample, and how many hold a valid value. */
  samples: z.number().int(),
  validSamples: z.number().int(),
  firstAt: z.string(),
  lastAt: z.string(),
  /** Valid averaging time, s, and valid per wall-clock time over the series. */
  validTimeS: z.number(),
  uptime: z.number(),
  meanFractional: z.number(),
  /** Overlapping Allan and modified Allan deviation at octave factors, with 68 % intervals. */
  adev: z.array(stabilityPointView),
  mdev: z.array(stabilityPointView),
  /** The noise type at most ADEV points, in words (IEEE Std 1139-2008 power-law names). */
  noiseType: z.string(),
  /** White-FM fit σ²(τ) = a/τ + b on the ADEV points (shared/science/stability/fit.ts). */
  fit: z
    .object({
      sigmaAt1s: z.number(),
      sigmaAt1sUncertainty: z.number(),
      flickerFloor: z.number().nullable(),
      fromTauS: z.number(),
      toTauS: z.number(),
    })
    .nullable(),
  gaps: gapsSummary,
  /** Decimated for display: per bin the time (Unix s), mean, min and max of the valid samples. */
  display: z.object({
    t: z.array(z.number()),
    mean: z.array(z.number().nullable()),
    min: z.array(z.number().nullable()),
    max: z.array(z.number().nullable()),
  }),
  computeMs: z.number(),
});
export type SeriesAnalysis = z.infer<typeof seriesAnalysis>;

export const budgetTermKinds = [
  "statistical",
  "flicker",
  "systematic",
  "levelling-tie",
  "benchmark",
  "reference-height",
] as const;

export const budgetRowView = z.object({
  term: z.string(),
  kind: z.enum(budgetTermKinds),
  fractional: z.number(),
  heightM: z.number(),
});
export type BudgetRowView = z.infer<typeof budgetRowView>;

/** The inputs of timeToTarget as used, so a client can draw σ_H(τ) (heightUncertaintyAt). */
export const timeToTargetInputView = z.object({
  targetHeightUncertaintyM: z.number(),
  instabilityAt1s: z.array(z.object({ name: z.string(), value: z.number() })),
  flickerFloor: z.number().optional(),
  systematic: z.array(z.object({ name: z.string(), value: z.number() })),
  heightTermsM: z.array(z.object({ name: z.string(), value: z.number() })),
  latitudeDeg: z.number(),
  heightM: z.number(),
  accumulatedS: z.number(),
  uptime: z.number(),
  now: z.string(),
});

export const heightResultView = z.object({
  runId: z.uuid(),
  /** The run's data revision, and the one the analysis used (older while a new one runs). */
  dataRevision: z.number().int(),
  analysis: z.object({
    state: z.enum(["none", ...analysisStates]),
    dataRevision: z.number().int().nullable(),
    error: z.string().nullable(),
  }),
  /** From the data: ΔC and ΔH of the remote clock minus the reference clock. */
  clock: z
    .object({
      meanFractional: z.number(),
      geopotentialDifference: z.number(),
      heightDifferenceM: z.number(),
      /** Combined standard uncertainty of ΔH from the budget, m. */
      sigmaM: z.number(),
    })
    .nullable(),
  budget: z.array(budgetRowView),
  combinedHeightUncertaintyM: z.number(),
  /** From levelling: the adjusted height of the remote mark minus the reference height. */
  levelled: z
    .object({
      mark: z.string(),
      markHeightM: z.number(),
      tieSigmaM: z.number(),
      benchmarkSigmaM: z.number(),
      referenceHeightM: z.number(),
      referenceHeightSigmaM: z.number(),
      heightDifferenceM: z.number(),
      sigmaM: z.number(),
      adjustmentId: z.uuid(),
      adjustedAt: z.string(),
    })
    .nullable(),
  /** Why there is no levelled value (no mark, no adjustment, mark not in it, no reference height). */
  levelledMissing: z.string().nullable(),
  /** Clock minus levelled ΔH, its σ and z = |d|/σ (consistent at 95 % when z ≤ 1.96). */
  comparison: z
    .object({
      differenceM: z.number(),
      sigmaM: z.number(),
      z: z.number(),
      consistent: z.boolean(),
    })
    .nullable(),
  timeToTarget: z.object({
    input: timeToTargetInputView,
    /** "data": white-FM level fitted to the series; "stated": the instruments' own figures. */
    instabilitySource: z.enum(["data", "stated"]),
    reachable: z.boolean(),
    neededS: z.number().nullable(),
    leftS: z.number().nullable(),
    wallClockLeftS: z.number().nullable(),
    eta: z.string().nullable(),
    floorM: z.number(),
    dominant: z.string(),
    /** The height uncertainty now (after accumulatedS), m; null before any data. */
    nowM: z.number().nullable(),
    /** When not reachable: why, and what would have to improve. */
    reason: z.string().nullable(),
    improve: z.string().nullable(),
  }),
  /** Campaign results, not official heights (DESIGN.md §9): shown on the page and in exports. */
  caution: z.string(),
  computedAt: z.string(),
});
export type HeightResultView = z.infer<typeof heightResultView>;

export const officialHeightsCaution =
  "These are campaign results, not official heights. Official heights come from the national survey authority.";
