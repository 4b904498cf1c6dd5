import { describe, expect, it } from "vitest";
import {
  allanDeviation,
  analyzeStability,
  confidenceInterval,
  edfFor,
  greenhallEdf,
  maxFactor,
  modifiedAllanDeviation,
  overlappingAllanDeviation,
  overlappingHadamardDeviation,
  ScienceInputError,
  simpleOverlappingAllanEdf,
  timeDeviation,
} from "../../../shared/science";
import { whiteNoise } from "./helpers/random";

const ALL = [
  ["allanDeviation", allanDeviation, 2],
  ["overlappingAllanDeviation", overlappingAllanDeviation, 2],
  ["modifiedAllanDeviation", modifiedAllanDeviation, 3],
  ["timeDeviation", timeDeviation, 3],
  ["overlappingHadamardDeviation", overlappingHadamardDeviation, 3],
] as const;

const field = (name: string) => expect.objectContaining({ field: name });

describe.each(ALL)("%s refuses bad input with the field named", (_name, fn, span) => {
  const y = whiteNoise(64, 1e-15, 1);

  it("empty or all-missing samples", () => {
    expect(() => fn([], 1)).toThrow(ScienceInputError);
    expect(() => fn([NaN, NaN, NaN], 1)).toThrow(field("y"));
    expect(() => fn([1e-15], 1)).toThrow(field("y"));
  });

  it("infinite samples (NaN alone marks a gap)", () => {
    expect(() => fn([1, 2, Infinity, 3], 1)).toThrow(field("y[2]"));
    expect(() => fn([1, 2, -Infinity, 3], 1, "octave", { fromPhase: true })).toThrow(field("x[2]"));
  });

  it("a bad τ0", () => {
    for (const tau0 of [0, -1, NaN, Infinity]) expect(() => fn(y, tau0)).toThrow(field("tau0"));
  });

  it("too few points for a factor", () => {
    // The largest factor is n/2 (ADEV) or about n/3 (MDEV, HDEV) for n samples (SP 1065 §5.2).
    const tooBig = Math.floor(64 / span) + 1;
    expect(() => fn(y, 1, [tooBig])).toThrow(field("factors[0]"));
    expect(() => fn(y, 1, [1, 0])).toThrow(field("factors[1]"));
    expect(() => fn(y, 1, [1.5])).toThrow(field("factors[0]"));
    expect(() => fn(y, 1, [])).toThrow(field("factors"));
    expect(() => fn([1, 2], 1, [2])).toThrow(ScienceInputError);
  });

  it("a bad factor rule or noise type", () => {
    expect(() => fn(y, 1, "weekly" as unknown as "octave")).toThrow(field("factors"));
    expect(() => fn(y, 1, "octave", { noise: "pink" as unknown as "white-fm" })).toThrow(
      field("options.noise"),
    );
    expect(() => fn(new Float64Array(30_000), 1, "all")).toThrow(field("factors"));
  });

  it("values too large to square", () => {
    expect(() => fn([1e200, -1e200, 1e200, -1e200, 1e200, -1e200, 1e200], 1)).toThrow(field("y"));
  });
});

describe("other stability inputs", () => {
  it("factor rules give ascending factors without repeats", () => {
    const y = whiteNoise(1000, 1, 2);
    // decade rule: 1, 2, 5 × 10^k up to the largest valid factor (500 for ADEV on 1000 samples)
    expect(overlappingAllanDeviation(y, 1, "decade").map((p) => p.factor)).toEqual([
      1, 2, 5, 10, 20, 50, 100, 200, 500,
    ]);
    expect(overlappingAllanDeviation(y, 1, [4, 1, 4]).map((p) => p.factor)).toEqual([1, 4]);
    expect(overlappingAllanDeviation(y.slice(0, 10), 1, "all").map((p) => p.factor)).toEqual([
      1, 2, 3, 4, 5,
    ]);
  });

  it("analyzeStability returns a plain object that survives JSON", () => {
    const a = analyzeStability("mdev", whiteNoise(100, 1, 3), 2);
    const back = JSON.parse(JSON.stringify(a)) as typeof a;
    expect(back.points.length).toBe(a.points.length);
    expect(back.tau0).toBe(2);
    expect(back.points[1]?.tau).toBe(4);
  });

  it("analyzeStability refuses an unknown statistic", () => {
    expect(() => analyzeStability("xdev" as "oadev", [1, 2, 3], 1)).toThrow(field("statistic"));
  });

  it("the edf functions and maxFactor refuse bad arguments", () => {
    expect(() => simpleOverlappingAllanEdf(10, 5, 0)).toThrow(field("n"));
    expect(() => simpleOverlappingAllanEdf(100, 0, 0)).toThrow(field("m"));
    expect(() => simpleOverlappingAllanEdf(100, 2, 0.5)).toThrow(field("alpha"));
    expect(() => edfFor("oadev", 3, 1, 10)).toThrow(field("alpha"));
    expect(() => edfFor("mdev", 0, 1, 0)).toThrow(field("terms"));
    expect(() => edfFor("pdev" as "mdev", 0, 1, 5)).toThrow(field("statistic"));
    const g = { alpha: 0, d: 2, m: 4, modified: false, overlapping: true, terms: 100 };
    expect(() => greenhallEdf({ ...g, d: 4 })).toThrow(field("d"));
    expect(() => greenhallEdf({ ...g, alpha: -3 })).toThrow(field("alpha"));
    expect(greenhallEdf({ ...g, d: 3, alpha: -3 })).toBeGreaterThan(1);
    expect(() => greenhallEdf({ ...g, m: 1.5 })).toThrow(field("m"));
    expect(() => maxFactor("oadev", -1)).toThrow(field("n"));
    expect(maxFactor("mdev", 9)).toBe(3);
  });

  it("confidenceInterval refuses a bad edf, deviation or probability", () => {
    expect(() => confidenceInterval(1, 0)).toThrow(field("edf"));
    expect(() => confidenceInterval(-1, 3)).toThrow(field("deviation"));
    expect(() => confidenceInterval(1, 3, 1)).toThrow(field("probability"));
    expect(() => confidenceInterval(1, 3, 0)).toThrow(field("probability"));
  });
});
