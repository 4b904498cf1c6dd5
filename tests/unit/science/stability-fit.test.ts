import { describe, expect, it } from "vitest";
import {
  fitWhiteFrequencyLevel,
  overlappingAllanDeviation,
  ScienceInputError,
} from "../../../shared/science";
import { powerLawNoise, whiteNoise } from "./helpers/random";
import { relative } from "./helpers/runs";

// Model: σ²_y(τ) = h0/(2τ) + 2 ln2·h−1 for white FM plus flicker FM (IEEE Std 1139-2008).
describe("fitWhiteFrequencyLevel", () => {
  it("recovers the level and floor of exact model points", () => {
    // computed from the model: σ(1 s) = 1e-15, floor 3e-18
    const points = [1, 10, 100, 1e3, 1e4, 1e5, 1e6, 1e7].map((tau) => ({
      tau,
      deviation: Math.sqrt(1e-30 / tau + 9e-36),
      edf: 1e6,
    }));
    const fit = fitWhiteFrequencyLevel(points);
    expect(relative(fit.sigmaAt1s, 1e-15)).toBeLessThan(1e-9);
    expect(relative(fit.flickerFloor ?? NaN, 3e-18)).toBeLessThan(1e-6);
    expect(fit.pointsUsed).toBe(8);
  });

  it("skips the leading white-PM region (slope −1) and reports no floor for pure white FM", () => {
    // computed: white PM 1e-14/τ below τ = 100 s, white FM 1e-15/√τ above
    const points = [1, 2, 4, 8, 16, 32, 64, 128, 256, 512, 1024].map((tau) => ({
      tau,
      deviation: Math.max(1e-14 / tau, 1e-15 / Math.sqrt(tau)),
      edf: 1e4,
    }));
    const fit = fitWhiteFrequencyLevel(points);
    expect(fit.fromTauS).toBe(128);
    expect(relative(fit.sigmaAt1s, 1e-15)).toBeLessThan(1e-9);
    expect(fit.flickerFloor).toBeNull();
    expect(fitWhiteFrequencyLevel(points, { minTauS: 256 }).pointsUsed).toBe(3);
  });

  it("finds σ of simulated white FM within its uncertainty (3σ) on an ADEV curve", () => {
    // seeded white FM, σ_y(1 s) = 2e-16 with τ0 = 1 s
    for (const seed of [1, 2, 3]) {
      const fit = fitWhiteFrequencyLevel(
        overlappingAllanDeviation(whiteNoise(20_000, 2e-16, seed), 1),
      );
      expect(Math.abs(fit.sigmaAt1s - 2e-16)).toBeLessThan(3 * fit.sigmaAt1sUncertainty + 1e-18);
      expect(fit.sigmaAt1sUncertainty).toBeLessThan(0.05 * 2e-16);
    }
  });

  it("finds a flicker floor in white FM plus flicker FM", () => {
    // Kasdin–Walter flicker FM added to white FM. Reference: the median OADEV of the flicker
    // component alone (flat for flicker FM, IEEE Std 1139-2008), computed on the same series.
    const n = 4096;
    const white = whiteNoise(n, 1e-15, 7);
    const flicker = powerLawNoise(n, 1, 8).map((v) => 2e-16 * v);
    const fit = fitWhiteFrequencyLevel(
      overlappingAllanDeviation(
        white.map((v, i) => v + (flicker[i] ?? 0)),
        1,
      ),
    );
    const alone = overlappingAllanDeviation(flicker, 1)
      .map((p) => p.deviation)
      .sort((a, b) => a - b);
    const reference = alone[Math.floor(alone.length / 2)] ?? NaN;
    expect(fit.flickerFloor).not.toBeNull();
    expect(relative(fit.flickerFloor ?? 0, reference)).toBeLessThan(0.3);
    expect(relative(fit.sigmaAt1s, 1e-15)).toBeLessThan(0.1);
  });

  it("refuses empty, non-positive and unfit input", () => {
    expect(() => fitWhiteFrequencyLevel([])).toThrow(ScienceInputError);
    expect(() => fitWhiteFrequencyLevel([{ tau: -1, deviation: 1 }])).toThrow(
      expect.objectContaining({ field: "points[0].tau" }),
    );
    expect(() => fitWhiteFrequencyLevel([{ tau: 1, deviation: NaN }])).toThrow(ScienceInputError);
    expect(() => fitWhiteFrequencyLevel([{ tau: 1, deviation: 1, edf: 0 }])).toThrow(
      ScienceInputError,
    );
    expect(() => fitWhiteFrequencyLevel([{ tau: 1, deviation: 1 }], { minTauS: 10 })).toThrow(
      expect.objectContaining({ field: "minTauS" }),
    );
  });
});
