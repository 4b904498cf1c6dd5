import { describe, expect, it } from "vitest";
import {
  identifyNoise,
  MAX_NOISE_ID_PAIRS,
  NOISE_TYPES,
  overlappingAllanDeviation,
  ScienceInputError,
} from "../../../shared/science";
import { noiseSeries } from "./helpers/random";

// Series of known power-law type (white noise, its sums and differences, and Kasdin–Walter 1992
// flicker noise) must be recognised by the lag-1 autocorrelation method (Riley & Greenhall 2004;
// IEEE Std 1139-2008 noise types). Ten seeded series per type.
const SEEDS = Array.from({ length: 10 }, (_, i) => i + 1);

function hits(type: string, factor: number, n: number): number {
  return SEEDS.filter((seed) => identifyNoise(noiseSeries(type, n, seed), 1, factor).noise === type)
    .length;
}

describe("identifyNoise (lag-1 autocorrelation)", () => {
  it.each(NOISE_TYPES.map((t) => t.id))(
    "recognises %s at m = 1 in at least 9 of 10 series",
    (type) => {
      expect(hits(type, 1, 2048)).toBeGreaterThanOrEqual(9);
    },
  );

  it.each(["white-pm", "white-fm", "random-walk-fm"])("recognises %s at m = 8", (type) => {
    expect(hits(type, 8, 2048)).toBeGreaterThanOrEqual(9);
  });

  it("flicker noise at m = 4: the estimate of α stays within 0.6 of the truth", () => {
    // Averaging before the autocorrelation aliases the spectrum and biases flicker estimates
    // toward the neighbouring type; the bias is bounded here (computed on these series).
    for (const [type, alpha] of [
      ["flicker-fm", -1],
      ["flicker-pm", 1],
    ] as const) {
      for (const seed of SEEDS) {
        const id = identifyNoise(noiseSeries(type, 4096, seed), 1, 4);
        expect(Math.abs(id.alphaEstimate - alpha)).toBeLessThan(0.6);
      }
    }
  });

  it("says how it identified and how many averages it used", () => {
    const id = identifyNoise(noiseSeries("white-fm", 600, 3), 1, 10);
    expect(id.method).toBe("lag-1 autocorrelation");
    expect(id.points).toBe(60);
    expect(id.differences).toBe(0);
  });

  it("refuses a factor that leaves fewer than 30 averages", () => {
    const y = noiseSeries("white-fm", 100, 1);
    expect(() => identifyNoise(y, 1, 4)).toThrow(ScienceInputError);
    expect(() => identifyNoise(y, 1, 3)).not.toThrow();
  });

  it("refuses a bad factor or τ0", () => {
    const y = noiseSeries("white-fm", 100, 1);
    for (const factor of [0, -1, 1.5, NaN]) {
      expect(() => identifyNoise(y, 1, factor)).toThrow(
        expect.objectContaining({ field: "factor" }),
      );
    }
    expect(() => identifyNoise(y, 0, 1)).toThrow(expect.objectContaining({ field: "tau0" }));
  });
});

describe("long series: the lag-1 pairs are sampled in blocks over the whole series", () => {
  /** Riley & Greenhall's r1 of the whole series (detrended), computed directly here. */
  function fullR1(y: Float64Array): number {
    const n = y.length;
    const tm = (n - 1) / 2;
    let ym = 0;
    for (const v of y) ym += v / n;
    let stt = 0;
    let sty = 0;
    y.forEach((v, i) => {
      stt += (i - tm) ** 2;
      sty += (i - tm) * (v - ym);
    });
    const z = y.map((v, i) => v - ym - (sty / stt) * (i - tm));
    let num = 0;
    let den = 0;
    z.forEach((v, i) => {
      den += v * v;
      if (i + 1 < n) num += v * (z[i + 1] ?? 0);
    });
    return num / den;
  }

  it.each(["white-pm", "white-fm"])(
    "%s on 60 000 samples: the sampled r1 is within 0.03 of the full r1",
    (type) => {
      const y = noiseSeries(type, 60_000, 31);
      const id = identifyNoise(y, 1, 1);
      expect(id.noise).toBe(type);
      expect(id.pairs).toBeLessThanOrEqual(MAX_NOISE_ID_PAIRS);
      expect(id.points).toBe(60_000);
      expect(Math.abs(id.lag1 - fullR1(y))).toBeLessThan(0.03);
    },
  );

  it("random-walk FM on 60 000 samples is found after one difference", () => {
    const id = identifyNoise(noiseSeries("random-walk-fm", 60_000, 32), 1, 2);
    expect(id.noise).toBe("random-walk-fm");
    expect(id.differences).toBe(1);
  });
});

describe("noise type behind each point of a curve", () => {
  it("random-walk FM is found and carried to factors with too few averages", () => {
    // IEEE Std 1139-2008: random-walk FM, α = −2
    const curve = overlappingAllanDeviation(noiseSeries("random-walk-fm", 1024, 5), 1);
    const identified = curve.filter((p) => p.noiseMethod === "lag-1 autocorrelation");
    expect(identified.length).toBeGreaterThan(3);
    expect(identified.every((p) => p.noise === "random-walk-fm" && p.alpha === -2)).toBe(true);
    const carried = curve.filter((p) => p.noiseMethod === "carried over");
    expect(carried.length).toBeGreaterThan(0);
    // 1024/m ≥ 30 up to m = 32: every larger factor is carried over.
    expect(carried.every((p) => p.factor > 32)).toBe(true);
  });

  it("short series assume white FM and say so; a given noise type is used as given", () => {
    const y = noiseSeries("white-fm", 20, 2);
    expect(overlappingAllanDeviation(y, 1).every((p) => p.noiseMethod === "assumed white FM")).toBe(
      true,
    );
    const given = overlappingAllanDeviation(y, 1, "octave", { noise: "flicker-fm" });
    expect(given.every((p) => p.noise === "flicker-fm" && p.noiseMethod === "given")).toBe(true);
  });
});
