// Shared types of the frequency-stability functions.

/** Power-law noise types (IEEE Std 1139-2008), with α the exponent of S_y(f) ∝ f^α. */
export type NoiseType = "white-pm" | "flicker-pm" | "white-fm" | "flicker-fm" | "random-walk-fm";

export const NOISE_TYPES: readonly { id: NoiseType; alpha: number; label: string }[] = [
  { id: "white-pm", alpha: 2, label: "white PM" },
  { id: "flicker-pm", alpha: 1, label: "flicker PM" },
  { id: "white-fm", alpha: 0, label: "white FM" },
  { id: "flicker-fm", alpha: -1, label: "flicker FM" },
  { id: "random-walk-fm", alpha: -2, label: "random-walk FM" },
];

/** How the noise type behind a point's edf was found. */
export type NoiseMethod =
  | "lag-1 autocorrelation" // identified at this factor (Riley & Greenhall 2004)
  | "carried over" // too few averages here: the type found at the largest smaller factor
  | "assumed white FM" // too few averages at every factor so far
  | "given"; // set by the caller in options.noise

export type StatisticName = "adev" | "oadev" | "mdev" | "tdev" | "ohdev";

/** Gap policy: see GAP_POLICY. "none" when the series had no missing sample. */
export type GapTreatment = "none" | "terms-touching-a-gap-dropped";

export const GAP_POLICY =
  "A missing sample (NaN) is never interpolated or bridged: every term of a statistic that spans " +
  "a missing frequency sample is dropped and counted in `dropped`; the statistic is averaged over " +
  "the remaining terms (`count`). A missing phase point makes the two frequency samples beside it missing.";

export interface StabilityPoint {
  /** Averaging factor m, τ = m·τ0. */
  readonly factor: number;
  /** Averaging time τ, s. */
  readonly tau: number;
  /** The deviation: dimensionless for ADEV/MDEV/HDEV, seconds for TDEV. */
  readonly deviation: number;
  /** Number of terms averaged. */
  readonly count: number;
  /** Terms dropped because they span a missing sample. */
  readonly dropped: number;
  /** Equivalent degrees of freedom, within [1, count]. */
  readonly edf: number;
  /** 68.27 % chi-squared confidence interval (SP 1065 eq. 45). */
  readonly low68: number;
  readonly high68: number;
  /** Noise type used for the edf, its α, and how it was found. */
  readonly noise: NoiseType;
  readonly alpha: number;
  readonly noiseMethod: NoiseMethod;
}

export interface StabilityInfo {
  readonly statistic: StatisticName;
  readonly input: "frequency" | "phase";
  /** Samples given (phase points for phase input). */
  readonly samples: number;
  /** Missing (NaN) samples given. */
  readonly missing: number;
  readonly treatment: GapTreatment;
  /** Factors asked for but with no usable term left after dropping gaps. */
  readonly skippedFactors: readonly number[];
}

/**
 * The per-factor array, with the gap information as extra array properties so the array shape
 * stays the contract. JSON.stringify drops those properties: use analyzeStability for a plain object.
 */
export type StabilityCurve = StabilityPoint[] & StabilityInfo;

export interface StabilityAnalysis extends StabilityInfo {
  readonly tau0: number;
  readonly points: StabilityPoint[];
}

/** Averaging factors: a list, or a rule. "all" is every m (cost O(N²)), limited to 20 000 samples. */
export type FactorChoice = readonly number[] | "octave" | "decade" | "all";

export interface StabilityOptions {
  /** The samples are phase (time error) x in seconds instead of fractional frequency y. */
  readonly fromPhase?: boolean;
  /** Use this noise type for every edf instead of identifying it. */
  readonly noise?: NoiseType;
}
