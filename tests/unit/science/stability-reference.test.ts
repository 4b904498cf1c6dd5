import { describe, expect, it } from "vitest";
import {
  allanDeviation,
  analyzeStability,
  confidenceInterval,
  modifiedAllanDeviation,
  overlappingAllanDeviation,
  overlappingHadamardDeviation,
  simpleOverlappingAllanEdf,
  summarizeSamples,
  timeDeviation,
} from "../../../shared/science";
import { NBS_140_FREQUENCY, NBS_140_PHASE, sp1065ThousandPoints } from "./helpers/sp1065";

// Values of NIST SP 1065 (Riley 2008) §12.3 and §12.4 as listed in REFERENCES.md §1 (tag:
// reproduced). They are printed to 7 significant digits: compare to 5e-7 relative.
const close = (actual: number, expected: number) =>
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThan(5e-7);

function deviations(curve: readonly { factor: number; deviation: number }[]) {
  return new Map(curve.map((p) => [p.factor, p.deviation]));
}

describe("NBS Monograph 140 data set", () => {
  const y = NBS_140_FREQUENCY;

  it("mean and sample standard deviation", () => {
    // NIST SP 1065 (Riley 2008) §12.3, NBS Monograph 140 data (reproduced)
    const s = summarizeSamples(y);
    close(s.mean, 788.8889);
    close(s.standardDeviation, 100.977);
    expect(s.count).toBe(9);
  });

  it.each([
    // NIST SP 1065 (Riley 2008) §12.3, NBS Monograph 140 data (reproduced)
    ["Allan deviation (non-overlapping)", allanDeviation, 91.22945, 115.8082],
    ["overlapping Allan deviation", overlappingAllanDeviation, 91.22945, 85.95287],
    ["modified Allan deviation", modifiedAllanDeviation, 91.22945, 74.78849],
    ["time deviation", timeDeviation, 52.67135, 86.35831],
    ["overlapping Hadamard deviation", overlappingHadamardDeviation, 70.80607, 85.61487],
  ])("%s at τ = 1 and 2 s, from frequency and from phase", (_name, fn, at1, at2) => {
    for (const curve of [fn(y, 1), fn(NBS_140_PHASE, 1, "octave", { fromPhase: true })]) {
      const d = deviations(curve);
      close(d.get(1) ?? NaN, at1);
      // The printed phase has 5 decimals: 1e-6 relative is the most it can give.
      expect(Math.abs((d.get(2) ?? NaN) - at2) / at2).toBeLessThan(1e-6);
    }
  });

  it("reports no gap and the τ of each point", () => {
    const curve = overlappingAllanDeviation(y, 1);
    expect(curve.missing).toBe(0);
    expect(curve.treatment).toBe("none");
    // Octave factors up to (N − 1)/2 = 4 for 10 phase points (SP 1065 §5.2.4: N − 2m ≥ 1).
    expect(curve.map((p) => p.factor)).toEqual([1, 2, 4]);
    expect(curve.map((p) => p.tau)).toEqual([1, 2, 4]);
  });
});

describe("SP 1065 1000-point pseudo-random data set", () => {
  const y = sp1065ThousandPoints();

  it("is generated as printed", () => {
    // NIST SP 1065 (Riley 2008) §12.4: first value 0.5748904731939040 (published)
    expect(y[0]).toBeCloseTo(0.574890473193904, 15);
  });

  it("overlapping Allan deviation at τ = 1, 10, 100 s", () => {
    // NIST SP 1065 (Riley 2008) §12.4 (reproduced)
    const d = deviations(overlappingAllanDeviation(y, 1, [1, 10, 100]));
    close(d.get(1) ?? NaN, 2.922319e-1);
    close(d.get(10) ?? NaN, 9.159953e-2);
    close(d.get(100) ?? NaN, 3.241343e-2);
  });

  it("modified Allan deviation at τ = 1 s equals the overlapping Allan deviation", () => {
    // NIST SP 1065 (Riley 2008) §12.4 (reproduced)
    close(modifiedAllanDeviation(y, 1, [1])[0]?.deviation ?? NaN, 2.922319e-1);
  });

  it("edf and 68 % interval at τ = 10 s (white FM)", () => {
    // REFERENCES.md §1.3 worked value (computed from SP 1065 Table 5): edf = 146.18,
    // interval [8.6681e-2, 9.7463e-2]; the noise is white FM (uniform iid samples).
    const p = analyzeStability("oadev", y, 1, [10]).points[0];
    expect(p?.noise).toBe("white-fm");
    expect(p?.noiseMethod).toBe("lag-1 autocorrelation");
    expect(p?.edf ?? NaN).toBeCloseTo(146.18, 2);
    expect(p?.low68 ?? NaN).toBeCloseTo(8.6681e-2, 6);
    expect(p?.high68 ?? NaN).toBeCloseTo(9.7463e-2, 6);
  });
});

describe("edf formula and chi-squared interval", () => {
  it("SP 1065 Table 5 white FM formula gives the worked value", () => {
    // REFERENCES.md §1.3 (computed): N = 1001, m = 10 → 146.18
    expect(simpleOverlappingAllanEdf(1001, 10, 0)).toBeCloseTo(146.18, 2);
  });

  it("interval from the chi-squared quantiles", () => {
    // REFERENCES.md §1.3 (computed); quantiles by @stdlib/stats-base-dists-chisquare-quantile
    const ci = confidenceInterval(9.159953e-2, 146.1768);
    expect(ci.low).toBeCloseTo(8.6681e-2, 6);
    expect(ci.high).toBeCloseTo(9.7463e-2, 6);
  });

  it("a 95 % interval is wider than the 68 % one and contains it", () => {
    // Property of nested chi-squared intervals (SP 1065 eq. 45)
    const a = confidenceInterval(1, 20);
    const b = confidenceInterval(1, 20, 0.95);
    expect(b.low).toBeLessThan(a.low);
    expect(b.high).toBeGreaterThan(a.high);
    expect(a.low).toBeLessThan(1);
    expect(a.high).toBeGreaterThan(1);
  });
});
