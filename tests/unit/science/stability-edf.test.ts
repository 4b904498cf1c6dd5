import { describe, expect, it } from "vitest";
import { edfFor, greenhallEdf, simpleOverlappingAllanEdf } from "../../../shared/science";
import { exactMoments, type Estimator, type Innovation } from "./helpers/quadratic";
import { relative } from "./helpers/runs";

// The reference here is the definition of edf (NIST SP 1065 §5.3: edf = 2E²/Var of the variance
// estimate), evaluated exactly for Gaussian noise by quadratic forms in helpers/quadratic.ts
// (computed). Greenhall & Riley (2003) model the phase in continuous time; for point-sampled
// white FM and white PM the unmodified forms used are exact, for the others the model converges
// to the discrete value as m grows.
const ALPHA: Record<Innovation, number> = { "white-fm": 0, "white-pm": 2, "random-walk-fm": -2 };
const N = 128;

function compare(estimator: Estimator, noise: Innovation, m: number): number {
  const exact = exactMoments(estimator, noise, m, N);
  return relative(edfFor(estimator, ALPHA[noise], m, exact.terms), exact.edf);
}

describe("Greenhall–Riley edf against the exact edf of Gaussian noise", () => {
  it.each([
    ["adev", "white-fm"],
    ["adev", "white-pm"],
    ["ohdev", "white-fm"],
    ["ohdev", "white-pm"],
    ["mdev", "white-pm"],
  ] as const)("%s, %s: exact at every factor", (estimator, noise) => {
    for (const m of [1, 2, 3, 5, 8, 13]) expect(compare(estimator, noise, m)).toBeLessThan(1e-6);
  });

  it.each([
    ["adev", "random-walk-fm"],
    ["mdev", "white-fm"],
    ["mdev", "random-walk-fm"],
    ["ohdev", "random-walk-fm"],
  ] as const)("%s, %s: within 1 %% from m = 8 on", (estimator, noise) => {
    for (const m of [8, 10, 16]) expect(compare(estimator, noise, m)).toBeLessThan(0.01);
  });

  it("MDEV at m = 1 has the edf of the overlapping ADEV (the two estimators coincide)", () => {
    // SP 1065 §5.2.5: Mod σ_y(τ0) = σ_y(τ0)
    for (const noise of ["white-fm", "random-walk-fm"] as const) {
      const terms = N - 1;
      expect(edfFor("mdev", ALPHA[noise], 1, terms)).toBeCloseTo(
        greenhallEdf({
          alpha: ALPHA[noise],
          d: 2,
          m: 1,
          modified: false,
          overlapping: true,
          terms,
        }),
        9,
      );
    }
  });

  it("the asymptotic tables join the exact sums at the J_max boundary", () => {
    // Greenhall & Riley (2003) Tables 1–3 are used when the exact sum needs more than 100 terms;
    // edf·m is nearly constant in m there, so both sides of the boundary must agree (computed).
    const cases = [
      { modified: true, d: 2 },
      { modified: false, d: 3 },
      { modified: false, d: 2 },
    ];
    for (const { modified, d } of cases) {
      for (const alpha of [1, 0, -1, -2]) {
        const last = Math.floor(100 / (d + 1));
        const edfTimesM = [last, last + 1].map((m) => {
          const terms = 20_000 - (modified ? 3 * m : d * m + 1) + 1;
          return greenhallEdf({ alpha, d, m, modified, overlapping: true, terms }) * m;
        });
        expect(relative(edfTimesM[1] ?? NaN, edfTimesM[0] ?? NaN)).toBeLessThan(0.02);
      }
    }
  });
});

describe("SP 1065 Table 5 simple edf (overlapping ADEV)", () => {
  it("agrees with the exact edf for white FM and white PM within 3 %", () => {
    // Howe, Allan & Barnes (1981) approximations, as tabulated in SP 1065 Table 5
    for (const noise of ["white-fm", "white-pm"] as const) {
      for (const m of [1, 2, 4, 8, 16]) expect(compare("oadev", noise, m)).toBeLessThan(0.03);
    }
  });

  it("random-walk FM at m = 1 is exact and within 7 % up to m = 16", () => {
    expect(compare("oadev", "random-walk-fm", 1)).toBeLessThan(1e-9);
    for (const m of [2, 4, 8, 16]) expect(compare("oadev", "random-walk-fm", m)).toBeLessThan(0.07);
  });

  it("Greenhall's overlapping white FM edf agrees with Table 5 for a long series", () => {
    // Two published approximations of the same quantity (SP 1065 Table 5; Greenhall & Riley 2003)
    for (const m of [4, 16, 64]) {
      const n = 100_001;
      const g = greenhallEdf({
        alpha: 0,
        d: 2,
        m,
        modified: false,
        overlapping: true,
        terms: n - 2 * m,
      });
      expect(relative(g, simpleOverlappingAllanEdf(n, m, 0))).toBeLessThan(0.02);
    }
  });

  it("every edf stays within [1, number of terms]", () => {
    // A variance of M correlated χ²₁ terms has 1 ≤ edf ≤ M (Cauchy–Schwarz; SP 1065 §5.3)
    for (const statistic of ["adev", "oadev", "mdev", "tdev", "ohdev"] as const) {
      for (const alpha of [2, 1, 0, -1, -2]) {
        for (const [m, terms] of [
          [1, 1],
          [1, 2],
          [2, 3],
          [4, 5],
          [64, 1],
          [1000, 40_000],
        ] as const) {
          const edf = edfFor(statistic, alpha, m, terms);
          expect(edf).toBeGreaterThanOrEqual(1);
          expect(edf).toBeLessThanOrEqual(terms);
        }
      }
    }
  });
});
