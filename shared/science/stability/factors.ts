// Averaging factors and the largest factor each statistic allows for n frequency samples
// (N = n + 1 phase points): ADEV and overlapping ADEV need N − 2m ≥ 1, MDEV/TDEV N − 3m + 1 ≥ 1,
// overlapping HDEV N − 3m ≥ 1 (NIST SP 1065 (Riley 2008) §5.2).
import { ScienceInputError } from "../errors";
import { requireStatistic } from "./edf";
import type { FactorChoice, StatisticName } from "./types";

export const ALL_FACTORS_MAX_SAMPLES = 20_000;

export function maxFactor(statistic: StatisticName, n: number): number {
  requireStatistic(statistic);
  if (!Number.isInteger(n) || n < 0)
    throw new ScienceInputError("n", `must be a whole number ≥ 0, got ${String(n)}`);
  switch (statistic) {
    case "adev":
    case "oadev":
      return Math.floor(n / 2);
    case "mdev":
    case "tdev":
      return Math.floor((n + 1) / 3);
    case "ohdev":
      return Math.floor(n / 3);
  }
}

function ruleFactors(rule: "octave" | "decade" | "all", max: number): number[] {
  const out: number[] = [];
  if (rule === "all") for (let m = 1; m <= max; m++) out.push(m);
  else if (rule === "octave") for (let m = 1; m <= max; m *= 2) out.push(m);
  else {
    for (let decade = 1; decade <= max; decade *= 10) {
      for (const k of [1, 2, 5]) if (k * decade <= max) out.push(k * decade);
    }
  }
  return out;
}

/** The factors to evaluate, ascending and without repeats. Explicit factors must all be valid. */
export function chooseFactors(statistic: StatisticName, n: number, choice: FactorChoice): number[] {
  const max = maxFactor(statistic, n);
  if (max < 1) {
    throw new ScienceInputError("y", `${n} samples are too few for ${statistic} at any factor`);
  }
  if (typeof choice === "string") {
    if (choice === "all" && n > ALL_FACTORS_MAX_SAMPLES) {
      throw new ScienceInputError(
        "factors",
        `"all" is limited to ${ALL_FACTORS_MAX_SAMPLES} samples (cost grows as N²); use "octave" or "decade"`,
      );
    }
    if (choice !== "octave" && choice !== "decade" && choice !== "all") {
      throw new ScienceInputError("factors", `must be a list, "octave", "decade" or "all"`);
    }
    return ruleFactors(choice, max);
  }
  if (!Array.isArray(choice) || choice.length === 0) {
    throw new ScienceInputError("factors", "must be a non-empty list of averaging factors");
  }
  choice.forEach((m, i) => {
    if (!Number.isInteger(m) || m < 1) {
      throw new ScienceInputError(`factors[${i}]`, `must be a whole number ≥ 1, got ${String(m)}`);
    }
    if (m > max) {
      throw new ScienceInputError(
        `factors[${i}]`,
        `factor ${m} is too large for ${n} samples: ${statistic} allows at most ${max}`,
      );
    }
  });
  return [...new Set(choice)].sort((a, b) => a - b);
}
