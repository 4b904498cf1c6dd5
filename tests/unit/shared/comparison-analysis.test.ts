import { describe, expect, it } from "vitest";
import { analyseSeries } from "../../../shared/comparison";
import { analyzeStability } from "../../../shared/science";
import { seededGaussian } from "../science/helpers/random";
import { NBS_140_FREQUENCY, sp1065ThousandPoints } from "../science/helpers/sp1065";

const rel = (a: number | undefined, b: number) => Math.abs((a ?? NaN) - b) / Math.abs(b);
const T0 = Date.UTC(2026, 2, 1) / 1000;

describe("analyseSeries", () => {
  it("gives the published ADEV and MDEV of the NBS Monograph 140 data", () => {
    // NIST SP 1065 (Riley 2008) §12.3, NBS Monograph 140 data (reproduced, REFERENCES.md §1.1)
    const a = analyseSeries({ t0: T0, tau0S: 1, values: Float64Array.from(NBS_140_FREQUENCY) });
    expect(rel(a.adev[0]?.deviation, 91.22945)).toBeLessThan(5e-7);
    expect(rel(a.adev[1]?.deviation, 85.95287)).toBeLessThan(5e-7);
    expect(rel(a.mdev[1]?.deviation, 74.78849)).toBeLessThan(5e-7);
    expect(rel(a.meanFractional, 788.8889)).toBeLessThan(5e-7);
  });

  it("gives the published overlapping ADEV of the 1000-point set and matches the core", () => {
    // NIST SP 1065 (Riley 2008) §12.4, 1000-point set (reproduced, REFERENCES.md §1.2)
    const y = sp1065ThousandPoints();
    const a = analyseSeries({ t0: T0, tau0S: 1, values: y });
    expect(rel(a.adev[0]?.deviation, 2.922319e-1)).toBeLessThan(5e-7);
    expect(rel(a.mdev[0]?.deviation, 2.922319e-1)).toBeLessThan(5e-7);
    const core = analyzeStability("oadev", y, 1, "octave").points;
    expect(a.adev.map((p) => p.deviation)).toEqual(core.map((p) => p.deviation));
    expect(a.adev.map((p) => p.low68)).toEqual(core.map((p) => p.low68));
  });

  it("summarises gaps, valid time, uptime, the fit and the display", () => {
    const g = seededGaussian(7);
    const values = new Float64Array(20_000).map(() => 2e-16 + 1e-15 * g());
    values.fill(NaN, 1000, 1100);
    values[5000] = NaN;
    const a = analyseSeries({ t0: T0, tau0S: 10, values });
    expect(a.validSamples).toBe(20_000 - 101);
    expect(a.validTimeS).toBe((20_000 - 101) * 10);
    expect(a.uptime).toBeCloseTo((20_000 - 101) / 20_000, 12);
    expect(a.gaps.count).toBe(2);
    expect(a.gaps.list[0]).toEqual({
      fromAt: new Date((T0 + 999 * 10) * 1000).toISOString(),
      toAt: new Date((T0 + 1100 * 10) * 1000).toISOString(),
      missing: 100,
    });
    expect(a.noiseType).toBe("white FM");
    // White FM of σ = 1e-15 per 10 s sample: σ_y(τ) = 1e-15·√(10/τ), so √a = 1e-15·√10 at 1 s.
    expect(rel(a.fit?.sigmaAt1s, 1e-15 * Math.sqrt(10))).toBeLessThan(0.05);
    expect(a.display.t.length).toBeLessThanOrEqual(2000);
    expect(a.display.mean[100]).toBeNull(); // bin 100 covers samples 1000–1009: all missing
    expect(a.lastAt).toBe(new Date((T0 + 19_999 * 10) * 1000).toISOString());
  });
});
