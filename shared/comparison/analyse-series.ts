// The series part of a comparison's analysis, from the run's grid (series-grid.ts): overlapping
// ADEV and MDEV at octave factors from the science core, the noise type, the white-FM fit, mean,
// valid time, uptime, the gaps and a decimated series for display. Pure: runs in a worker thread
// on the server and in a Web Worker in the browser.
import {
  analyzeStability,
  fitWhiteFrequencyLevel,
  NOISE_TYPES,
  ScienceInputError,
  type StabilityPoint,
} from "../science";
import {
  comparisonLimits,
  type SeriesAnalysis,
  type StabilityPointView,
} from "../schemas/comparison";
import { createGapCollector } from "./series-grid";
import { isoFromUnixS } from "./series-time";

export interface AnalyseSeriesInput {
  /** Unix seconds of grid point 0. */
  readonly t0: number;
  readonly tau0S: number;
  /** Fractional frequency per grid point, NaN where missing or flagged invalid. */
  readonly values: Float64Array;
}

export type SeriesAnalysisResult = Omit<SeriesAnalysis, "dataRevision">;

const noiseLabel = (id: string) => NOISE_TYPES.find((n) => n.id === id)?.label ?? id;

function pointView(p: StabilityPoint): StabilityPointView {
  return {
    tau: p.tau,
    deviation: p.deviation,
    low68: p.low68,
    high68: p.high68,
    edf: p.edf,
    count: p.count,
    noise: noiseLabel(p.noise),
    noiseMethod: p.noiseMethod,
  };
}

/** The noise type at most points (the first such in τ order on a tie). */
function mostCommonNoise(points: readonly StabilityPointView[]): string {
  const counts = new Map<string, number>();
  for (const p of points) counts.set(p.noise, (counts.get(p.noise) ?? 0) + 1);
  let best = "not identified";
  let bestCount = 0;
  for (const [noise, count] of counts) {
    if (count > bestCount) [best, bestCount] = [noise, count];
  }
  return best;
}

function fitOf(points: readonly StabilityPoint[]): SeriesAnalysis["fit"] {
  const usable = points.filter((p) => p.deviation > 0);
  if (usable.length === 0) return null;
  try {
    const f = fitWhiteFrequencyLevel(usable.map((p) => ({ ...p })));
    return {
      sigmaAt1s: f.sigmaAt1s,
      sigmaAt1sUncertainty: f.sigmaAt1sUncertainty,
      flickerFloor: f.flickerFloor,
      fromTauS: f.fromTauS,
      toTauS: f.toTauS,
    };
  } catch (error) {
    // The core refuses data without white FM: then there is no fit, not a failed analysis.
    if (error instanceof ScienceInputError) return null;
    throw error;
  }
}

interface Summary {
  valid: number;
  mean: number;
  gaps: SeriesAnalysis["gaps"];
}

/** Mean over valid samples and the runs of grid points without a valid value. */
function summarise(input: AnalyseSeriesInput): Summary {
  const { values, t0, tau0S } = input;
  const gaps = createGapCollector();
  let valid = 0;
  let sum = 0;
  let runStart = -1;
  const at = (i: number) => t0 + i * tau0S;
  for (let i = 0; i <= values.length; i++) {
    const v = i < values.length ? (values[i] ?? NaN) : 0;
    const missing = i < values.length && Number.isNaN(v);
    if (missing) {
      if (runStart < 0) runStart = i;
      continue;
    }
    if (runStart >= 0) {
      // From the last valid sample before the run to the first after it (the run's ends at the edges).
      gaps.add(at(Math.max(runStart - 1, 0)), at(Math.min(i, values.length - 1)), i - runStart);
      runStart = -1;
    }
    if (i < values.length) {
      valid++;
      sum += v;
    }
  }
  return { valid, mean: valid > 0 ? sum / valid : NaN, gaps: gaps.summary() };
}

/** At most displayPoints bins of consecutive grid points: time of the bin's centre, mean, min, max. */
function decimate(input: AnalyseSeriesInput): SeriesAnalysis["display"] {
  const { values, t0, tau0S } = input;
  const size = Math.max(1, Math.ceil(values.length / comparisonLimits.displayPoints));
  const out: SeriesAnalysis["display"] = { t: [], mean: [], min: [], max: [] };
  for (let start = 0; start < values.length; start += size) {
    const end = Math.min(start + size, values.length);
    let n = 0;
    let sum = 0;
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = start; i < end; i++) {
      const v = values[i] ?? NaN;
      if (Number.isNaN(v)) continue;
      n++;
      sum += v;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    out.t.push(t0 + ((start + end - 1) / 2) * tau0S);
    out.mean.push(n > 0 ? sum / n : null);
    out.min.push(n > 0 ? lo : null);
    out.max.push(n > 0 ? hi : null);
  }
  return out;
}

export function analyseSeries(input: AnalyseSeriesInput): SeriesAnalysisResult {
  const started = performance.now();
  const { values, t0, tau0S } = input;
  const summary = summarise(input);
  if (summary.valid < 2) {
    throw new ScienceInputError("values", "need at least 2 valid samples for an analysis");
  }
  const adevPoints = analyzeStability("oadev", values, tau0S, "octave").points;
  const mdevPoints = analyzeStability("mdev", values, tau0S, "octave").points;
  const adev = adevPoints.map(pointView);
  return {
    tau0S,
    samples: values.length,
    validSamples: summary.valid,
    firstAt: isoFromUnixS(t0),
    lastAt: isoFromUnixS(t0 + (values.length - 1) * tau0S),
    validTimeS: summary.valid * tau0S,
    uptime: summary.valid / values.length,
    meanFractional: summary.mean,
    adev,
    mdev: mdevPoints.map(pointView),
    noiseType: mostCommonNoise(adev),
    fit: fitOf(adevPoints),
    gaps: summary.gaps,
    display: decimate(input),
    computeMs: performance.now() - started,
  };
}
