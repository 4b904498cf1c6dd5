// The common driver: prepare once, then per factor the statistic's sums, the noise type, the
// edf and the 68 % interval.
import { ScienceInputError } from "../errors";
import { allanSumsNonOverlapping, overlappingAllanMany } from "./adev";
import { confidenceInterval } from "./confidence";
import { edfFor, requireStatistic } from "./edf";
import { chooseFactors } from "./factors";
import { overlappingHadamardSums } from "./hadamard";
import type { KernelResult } from "./kernel";
import { modifiedAllanMany } from "./mdev";
import { identifyPrepared, noiseTypeForAlpha } from "./noise";
import { prepareSeries, type PreparedSeries } from "./prepare";
import {
  NOISE_TYPES,
  type FactorChoice,
  type NoiseMethod,
  type StabilityAnalysis,
  type StabilityCurve,
  type StabilityOptions,
  type StabilityPoint,
  type StatisticName,
} from "./types";

type Kernel = (p: PreparedSeries, factors: readonly number[]) => KernelResult[];
const each =
  (one: (p: PreparedSeries, m: number) => KernelResult): Kernel =>
  (p, factors) =>
    factors.map((m) => one(p, m));

const KERNELS: Record<StatisticName, Kernel> = {
  adev: each(allanSumsNonOverlapping),
  oadev: overlappingAllanMany,
  mdev: modifiedAllanMany,
  tdev: modifiedAllanMany,
  ohdev: each(overlappingHadamardSums),
};

interface NoiseChoice {
  readonly alpha: number;
  readonly method: NoiseMethod;
}

/** Noise per factor: given, identified, carried over from a smaller factor, or assumed white FM. */
function noiseChooser(p: PreparedSeries, statistic: StatisticName, options: StabilityOptions) {
  const given = options.noise;
  if (given !== undefined) {
    const found = NOISE_TYPES.find((t) => t.id === given);
    if (found === undefined)
      throw new ScienceInputError("options.noise", `unknown noise type ${String(given)}`);
    return (): NoiseChoice => ({ alpha: found.alpha, method: "given" });
  }
  let last: number | null = null;
  const dmax = statistic === "ohdev" ? 3 : 2;
  return (m: number): NoiseChoice => {
    const id = identifyPrepared(p, m, dmax);
    if (id !== null) {
      last = id.alpha;
      return { alpha: id.alpha, method: "lag-1 autocorrelation" };
    }
    return last === null
      ? { alpha: 0, method: "assumed white FM" }
      : { alpha: last, method: "carried over" };
  };
}

function pointAt(
  statistic: StatisticName,
  p: PreparedSeries,
  m: number,
  k: KernelResult,
  noise: NoiseChoice,
): StabilityPoint {
  const tau = m * p.tau0;
  const sigma = Math.sqrt(k.variance);
  const deviation = statistic === "tdev" ? (tau / Math.sqrt(3)) * sigma : sigma;
  if (!Number.isFinite(deviation)) {
    throw new ScienceInputError(
      p.input === "phase" ? "x" : "y",
      "values are too large to square in double precision",
    );
  }
  const edf = edfFor(statistic, noise.alpha, m, k.count);
  const ci = confidenceInterval(deviation, edf);
  return {
    factor: m,
    tau,
    deviation,
    count: k.count,
    dropped: k.dropped,
    edf,
    low68: ci.low,
    high68: ci.high,
    noise: noiseTypeForAlpha(noise.alpha),
    alpha: noise.alpha,
    noiseMethod: noise.method,
  };
}

export function analyzeStability(
  statistic: StatisticName,
  data: ArrayLike<number>,
  tau0: number,
  factors: FactorChoice = "octave",
  options: StabilityOptions = {},
): StabilityAnalysis {
  requireStatistic(statistic);
  const p = prepareSeries(data, tau0, options.fromPhase ?? false);
  const chosen = chooseFactors(statistic, p.n, factors);
  const noiseAt = noiseChooser(p, statistic, options);
  const points: StabilityPoint[] = [];
  const skippedFactors: number[] = [];
  const sums = KERNELS[statistic](p, chosen);
  chosen.forEach((m, i) => {
    const k = sums[i];
    if (k === undefined || k.count === 0) skippedFactors.push(m);
    else points.push(pointAt(statistic, p, m, k, noiseAt(m)));
  });
  return {
    statistic,
    input: p.input,
    tau0,
    samples: p.samples,
    missing: p.inputMissing,
    treatment: p.missing > 0 ? "terms-touching-a-gap-dropped" : "none",
    skippedFactors,
    points,
  };
}

export function toCurve(a: StabilityAnalysis): StabilityCurve {
  const { statistic, input, samples, missing, treatment, skippedFactors } = a;
  return Object.assign([...a.points], {
    statistic,
    input,
    samples,
    missing,
    treatment,
    skippedFactors,
  });
}
