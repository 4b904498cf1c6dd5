// Equipot science core: pure functions over numbers and arrays (no I/O), usable in Node and in a
// browser Web Worker. SI units throughout; names carry units.
export { ScienceInputError } from "./errors";
export * from "./constants";
export {
  GRS80,
  WGS84,
  ellipsoid,
  geodeticParameterM,
  meanNormalGravity,
  NORMAL_GRAVITY_HEIGHT_RANGE_M,
  normalGravity,
  type EllipsoidModel,
  type NormalGravityEllipsoid,
} from "./gravity";
export * from "./redshift";
export * from "./budget";

export * from "./stability/types";
export * from "./stability/deviations";
export { analyzeStability } from "./stability/curve";
export { confidenceInterval, type ConfidenceInterval } from "./stability/confidence";
export { simpleOverlappingAllanEdf, edfFor } from "./stability/edf";
export { greenhallEdf, type GreenhallInput } from "./stability/greenhall";
export { maxFactor, ALL_FACTORS_MAX_SAMPLES } from "./stability/factors";
export {
  identifyNoise,
  MAX_NOISE_ID_PAIRS,
  MIN_POINTS_FOR_NOISE_ID,
  type NoiseIdentification,
} from "./stability/noise";
export {
  frequencyToPhase,
  phaseToFrequency,
  summarizeSamples,
  type SampleSummary,
} from "./stability/phase";
export * from "./stability/fit";

export * from "./levelling/reduce";
export * from "./levelling/running";
export * from "./levelling/balance";
export * from "./levelling/misclosure";
export type { FixedPoint, LevellingObservation } from "./levelling/network";
export * from "./levelling/adjust";

export * from "./transport/shock";
export * from "./transport/mkt";
export * from "./transport/temperature";
export * from "./transport/dewpoint";
