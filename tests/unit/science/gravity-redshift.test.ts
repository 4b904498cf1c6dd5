import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  fractionalFrequencyToPotential,
  frequencyFromHeightDifference,
  GRS80,
  heightDifferenceFromFrequency,
  heightPerFractionalFrequency,
  L_G,
  meanNormalGravity,
  normalGravity,
  potentialToFractionalFrequency,
  ScienceInputError,
  SPEED_OF_LIGHT_M_PER_S,
  STANDARD_GRAVITY_M_PER_S2,
  W0_IAG_2015_M2_PER_S2,
  W0_IERS_2010_M2_PER_S2,
  WGS84,
} from "../../../shared/science";
import { relative, runs } from "./helpers/runs";

describe("normal gravity (closed Somigliana formula)", () => {
  it("GRS80 at 30°, 45°, 60°", () => {
    // REFERENCES.md §3 (computed from Moritz, GRS80)
    expect(normalGravity(45)).toBeCloseTo(9.8061992025, 9);
    expect(normalGravity(30)).toBeCloseTo(9.7932487036, 9);
    expect(normalGravity(60)).toBeCloseTo(9.819178385, 9);
  });

  it.each([
    ["GRS80", GRS80],
    ["WGS84", WGS84],
  ] as const)("%s gives its published γ_e and γ_p at the equator and the poles", (model, e) => {
    // Moritz, "Geodetic Reference System 1980"; NIMA TR8350.2 (published)
    // The printed k and e² are rounded: the pole value comes back to 1e-10 m/s².
    expect(Math.abs(normalGravity(0, 0, model) - e.gammaEquatorMPerS2)).toBeLessThan(1e-12);
    expect(Math.abs(normalGravity(90, 0, model) - e.gammaPoleMPerS2)).toBeLessThan(1e-10);
    expect(Math.abs(normalGravity(-90, 0, model) - e.gammaPoleMPerS2)).toBeLessThan(1e-10);
  });

  it.each([GRS80, WGS84])("$name constants obey k = bγ_p/(aγ_e) − 1 and e² = f(2 − f)", (e) => {
    // Defining relations of the Somigliana formula (Moritz, GRS80; TR8350.2 §3)
    const b = e.semiMajorAxisM * (1 - e.flattening);
    const k = (b * e.gammaPoleMPerS2) / (e.semiMajorAxisM * e.gammaEquatorMPerS2) - 1;
    // γ_e and γ_p are printed to 1e-10 m/s², which bounds k to about 1e-8 relative.
    expect(relative(k, e.somiglianaK)).toBeLessThan(1e-8);
    expect(relative(e.flattening * (2 - e.flattening), e.eccentricitySquared)).toBeLessThan(1e-10);
  });

  it("GRS80 agrees with Moritz's series expansion", () => {
    // Moritz, GRS80: γ = γ_e(1 + 0.0052790414 s² + 0.0000232718 s⁴ + 0.0000001262 s⁶
    // + 0.0000000007 s⁸), s = sin φ (memory; stated there as accurate to 1e-9 m/s²)
    for (const lat of [0, 10, 25, 37.5, 45, 52, 68, 80, 90]) {
      const s2 = Math.sin((lat * Math.PI) / 180) ** 2;
      const series =
        GRS80.gammaEquatorMPerS2 *
        (1 +
          0.0052790414 * s2 +
          0.0000232718 * s2 ** 2 +
          0.0000001262 * s2 ** 3 +
          0.0000000007 * s2 ** 4);
      expect(Math.abs(normalGravity(lat) - series)).toBeLessThan(2e-9);
    }
  });

  it("WGS84 differs from GRS80 as their equator and pole values do", () => {
    // computed from the published γ_e, γ_p of both systems: Δγ ≈ Δγ_e cos²φ + Δγ_p sin²φ
    const de = WGS84.gammaEquatorMPerS2 - GRS80.gammaEquatorMPerS2;
    const dp = WGS84.gammaPoleMPerS2 - GRS80.gammaPoleMPerS2;
    for (const lat of [15, 45, 70]) {
      const s2 = Math.sin((lat * Math.PI) / 180) ** 2;
      const diff = normalGravity(lat, 0, "WGS84") - normalGravity(lat, 0, "GRS80");
      expect(Math.abs(diff - (de * (1 - s2) + dp * s2))).toBeLessThan(1e-9);
    }
  });

  it("second-order height correction: −308.48 mGal at 45°, 1000 m", () => {
    // REFERENCES.md §3 (computed from TR8350.2 eq. 4-3); 1 mGal = 1e-5 m/s²
    const delta = (normalGravity(45, 1000) - normalGravity(45, 0)) / 1e-5;
    expect(delta).toBeCloseTo(-308.48, 2);
  });

  it("free-air gradient about 0.3086 mGal/m", () => {
    // practice
    const gradient = (normalGravity(45, 0) - normalGravity(45, 100)) / 100 / 1e-5;
    expect(gradient).toBeCloseTo(0.3086, 3);
  });

  it("mean gravity along the plumb line is the height average of normal gravity", () => {
    // computed: Simpson's rule over normalGravity (exact for the quadratic height profile)
    for (const [from, to] of [
      [0, 2000],
      [400, 4800],
      [1200, -300],
    ] as const) {
      const mid = (from + to) / 2;
      const simpson =
        (normalGravity(52, from) + 4 * normalGravity(52, mid) + normalGravity(52, to)) / 6;
      expect(Math.abs(meanNormalGravity(52, from, to) - simpson)).toBeLessThan(1e-12);
    }
    expect(meanNormalGravity(45, 300, 300)).toBeCloseTo(normalGravity(45, 300), 14);
  });

  it("refuses latitude outside ±90°, non-finite height and unknown models", () => {
    expect(() => normalGravity(90.5)).toThrow(expect.objectContaining({ field: "latitudeDeg" }));
    expect(() => normalGravity(-91)).toThrow(ScienceInputError);
    expect(() => normalGravity(NaN)).toThrow(ScienceInputError);
    expect(() => normalGravity(45, Infinity)).toThrow(
      expect.objectContaining({ field: "heightM" }),
    );
    expect(() => normalGravity(45, 0, "GRS67" as "GRS80")).toThrow(
      expect.objectContaining({ field: "model" }),
    );
  });
});

describe("constants", () => {
  it("c is exact and L_G·c² is the 2010 W0, not the 2015 one", () => {
    // SI (published); IAU 2000 B1.9 and IERS Conventions (2010) Table 1.1; IAG 2015 Res. 1
    expect(SPEED_OF_LIGHT_M_PER_S).toBe(299_792_458);
    expect(Math.abs(L_G * SPEED_OF_LIGHT_M_PER_S ** 2 - W0_IERS_2010_M2_PER_S2)).toBeLessThan(0.01);
    expect(W0_IERS_2010_M2_PER_S2 - W0_IAG_2015_M2_PER_S2).toBeCloseTo(2.6, 6);
  });
});

describe("redshift and heights", () => {
  it("1e-18 in fractional frequency is 0.0899 m²/s² and about 9.2 mm", () => {
    // REFERENCES.md §2 (computed: c² × 1e-18, ÷ 9.80665)
    expect(fractionalFrequencyToPotential(1e-18)).toBeCloseTo(0.0899, 4);
    expect(fractionalFrequencyToPotential(1e-18) / STANDARD_GRAVITY_M_PER_S2).toBeCloseTo(
      0.0092,
      4,
    );
    const r = heightDifferenceFromFrequency({
      fractionalFrequency: 1e-18,
      latitudeDeg: 45,
      heightM: 0,
    });
    expect(Math.abs(r.heightDifference - 0.0092)).toBeLessThan(0.00005);
    // computed with γ(45°) = 9.8061992 m/s² instead of g_n: 0.0898755 / 9.8061992
    expect(r.heightDifference).toBeCloseTo(0.0898755179 / 9.8061992025, 9);
    // practice: "1e-18 ≈ 1 cm of height"
    expect(Math.abs(r.heightDifference - 0.01)).toBeLessThan(0.001);
  });

  it("the higher clock runs faster: positive y, positive height difference", () => {
    // sign convention of REFERENCES.md §2
    const up = heightDifferenceFromFrequency({
      fractionalFrequency: 1.09e-13,
      latitudeDeg: 47,
      heightM: 400,
    });
    expect(up.heightDifference).toBeGreaterThan(990);
    expect(up.heightDifference).toBeLessThan(1010);
    const down = heightDifferenceFromFrequency({
      fractionalFrequency: -1.09e-13,
      latitudeDeg: 47,
      heightM: 400,
    });
    expect(down.heightDifference).toBeLessThan(0);
    // The mean gravity over [400, 1400] m sits below the value at 400 m by about half a kilometre
    // of free-air gradient (0.3086 mGal/m, practice).
    expect((normalGravity(47, 400) - up.meanGravity) / 1e-5).toBeCloseTo(0.3086 * 500, -1);
  });

  it("frequencyFromHeightDifference inverts heightDifferenceFromFrequency", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e-12, max: 1e-12, noNaN: true }),
        fc.double({ min: -90, max: 90, noNaN: true }),
        fc.double({ min: -400, max: 5000, noNaN: true }),
        (y, latitudeDeg, heightM) => {
          const h = heightDifferenceFromFrequency({ fractionalFrequency: y, latitudeDeg, heightM });
          const back = frequencyFromHeightDifference({
            heightDifferenceM: h.heightDifference,
            latitudeDeg,
            heightM,
          });
          expect(Math.abs(back.fractionalFrequency - y)).toBeLessThanOrEqual(
            1e-12 * Math.abs(y) + 1e-30,
          );
          expect(
            relative(potentialToFractionalFrequency(h.geopotentialDifference), y) || 0,
          ).toBeLessThan(1e-12);
        },
      ),
      { numRuns: runs(50, 1000), seed: 11 },
    );
  });

  it("refuses non-finite input and bad latitudes", () => {
    expect(() => heightPerFractionalFrequency(95, 0)).toThrow(
      expect.objectContaining({ field: "latitudeDeg" }),
    );
    expect(() => heightPerFractionalFrequency(45, -2e4)).toThrow(
      expect.objectContaining({ field: "heightM" }),
    );
    expect(() => fractionalFrequencyToPotential(NaN)).toThrow(
      expect.objectContaining({ field: "fractionalFrequency" }),
    );
    expect(() => potentialToFractionalFrequency(Infinity)).toThrow(ScienceInputError);
    expect(() =>
      heightDifferenceFromFrequency({ fractionalFrequency: 1e-16, latitudeDeg: 100, heightM: 0 }),
    ).toThrow(expect.objectContaining({ field: "latitudeDeg" }));
    expect(() =>
      heightDifferenceFromFrequency({ fractionalFrequency: 1e-16, latitudeDeg: 10, heightM: NaN }),
    ).toThrow(expect.objectContaining({ field: "heightM" }));
    expect(() =>
      frequencyFromHeightDifference({ heightDifferenceM: Infinity, latitudeDeg: 10, heightM: 0 }),
    ).toThrow(expect.objectContaining({ field: "heightDifferenceM" }));
  });
});
