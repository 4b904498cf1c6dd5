import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  allanDeviation,
  confidenceInterval,
  modifiedAllanDeviation,
  overlappingAllanDeviation,
  overlappingHadamardDeviation,
  timeDeviation,
  type StabilityCurve,
} from "../../../shared/science";
import { exactMoments } from "./helpers/quadratic";
import { whiteNoise } from "./helpers/random";
import { allFinite, relative, runs } from "./helpers/runs";

// Coverage of the 68 % intervals on seeded white FM of known σ. The true values are exact for
// independent samples: AVAR = HVAR = σ²/m (IEEE Std 1139-2008, white FM); MVAR from the exact
// quadratic form (helpers/quadratic.ts, computed).
const SIGMA = 1e-15;
const N = 512;
const FACTORS = [1, 4, 16];
const SEEDS = Array.from({ length: runs(400, 4000) }, (_, i) => 1000 + i);

type Fn = (y: ArrayLike<number>, tau0: number, f?: readonly number[]) => StabilityCurve;

function coverage(fn: Fn, truth: (m: number) => number): { in68: number; in95: number } {
  let in68 = 0;
  let in95 = 0;
  let total = 0;
  for (const seed of SEEDS) {
    for (const p of fn(whiteNoise(N, SIGMA, seed), 1, FACTORS)) {
      const t = truth(p.factor);
      total++;
      if (t >= p.low68 && t <= p.high68) in68++;
      const wide = confidenceInterval(p.deviation, p.edf, 0.95);
      if (t >= wide.low && t <= wide.high) in95++;
    }
  }
  return { in68: in68 / total, in95: in95 / total };
}

describe("68 % intervals cover the true deviation of white FM in about 68 % of seeds", () => {
  const mvarTerm = new Map(
    FACTORS.map((m) => [m, exactMoments("mdev", "white-fm", m, 128).meanTerm]),
  );
  const mvar = (m: number) => SIGMA * Math.sqrt((mvarTerm.get(m) ?? NaN) / (2 * m ** 4));
  it.each([
    ["overlapping ADEV", overlappingAllanDeviation, (m: number) => SIGMA / Math.sqrt(m)],
    ["ADEV", allanDeviation, (m: number) => SIGMA / Math.sqrt(m)],
    ["overlapping HDEV", overlappingHadamardDeviation, (m: number) => SIGMA / Math.sqrt(m)],
    ["MDEV", modifiedAllanDeviation, mvar],
  ] as const)("%s", (_name, fn, truth) => {
    const c = coverage(fn, truth);
    expect(c.in68).toBeGreaterThan(0.62);
    expect(c.in68).toBeLessThan(0.74);
    expect(c.in95).toBeGreaterThanOrEqual(0.9);
  });
});

const ALL = [
  allanDeviation,
  overlappingAllanDeviation,
  modifiedAllanDeviation,
  timeDeviation,
  overlappingHadamardDeviation,
];

describe("properties (fast-check)", () => {
  const series = fc
    .integer({ min: 1, max: 2 ** 31 - 1 })
    .map((seed) => whiteNoise(64, 1e-15, seed));
  const scale = fc
    .double({ min: 1e-6, max: 1e6, noNaN: true })
    .chain((a) => fc.constantFrom(a, -a));

  it("every deviation and interval scales by |a| when y does", () => {
    fc.assert(
      fc.property(series, scale, (y, a) => {
        const scaled = y.map((v) => a * v);
        for (const fn of ALL) {
          const p = fn(y, 1);
          const q = fn(scaled, 1);
          expect(q.length).toBe(p.length);
          q.forEach((point, i) => {
            const ref = p[i];
            expect(relative(point.deviation, Math.abs(a) * (ref?.deviation ?? NaN))).toBeLessThan(
              1e-9,
            );
            expect(relative(point.high68, Math.abs(a) * (ref?.high68 ?? NaN))).toBeLessThan(1e-9);
          });
        }
      }),
      { numRuns: runs(20, 300), seed: 42 },
    );
  });

  it("a constant frequency offset changes nothing", () => {
    // The second (and third) differences of phase cancel a constant y (SP 1065 §5.2).
    fc.assert(
      fc.property(series, fc.double({ min: -1e-12, max: 1e-12, noNaN: true }), (y, offset) => {
        const p = overlappingAllanDeviation(y, 1);
        const q = overlappingAllanDeviation(
          y.map((v) => v + offset),
          1,
        );
        q.forEach((point, i) =>
          expect(relative(point.deviation, p[i]?.deviation ?? NaN)).toBeLessThan(1e-6),
        );
      }),
      { numRuns: runs(20, 300), seed: 7 },
    );
  });

  it("results never contain NaN or Infinity, gaps or not", () => {
    const holed = fc.tuple(series, fc.array(fc.integer({ min: 0, max: 63 }), { maxLength: 20 }));
    fc.assert(
      fc.property(holed, ([y, holes]) => {
        const z = Float64Array.from(y);
        for (const h of holes) z[h] = NaN;
        if (z.filter((v) => !Number.isNaN(v)).length < 2) return;
        for (const fn of ALL) {
          try {
            const curve = fn(z, 1);
            expect(allFinite(curve)).toBe(true);
          } catch (e) {
            // A series whose gaps leave no factor is refused, never answered with NaN.
            expect(e).toHaveProperty("field");
          }
        }
      }),
      { numRuns: runs(30, 500), seed: 3 },
    );
  });
});
