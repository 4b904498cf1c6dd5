import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { adjustLevellingNetwork, ScienceInputError } from "../../../shared/science";
import { gridNetwork } from "./helpers/network";
import { runs } from "./helpers/runs";

// Ghilani & Wolf, "Adjustment Computations", 4th ed., Example 12.1 (REFERENCES.md §4).
const EXAMPLE_12_1 = {
  fixed: [{ point: "A", heightM: 437.596 }],
  observations: [
    { from: "A", to: "B", deltaM: 10.509, sigmaM: 0.006 },
    { from: "B", to: "C", deltaM: 5.36, sigmaM: 0.004 },
    { from: "C", to: "D", deltaM: -8.523, sigmaM: 0.005 },
    { from: "D", to: "A", deltaM: -7.348, sigmaM: 0.003 },
    { from: "B", to: "D", deltaM: -3.167, sigmaM: 0.004 },
    { from: "A", to: "C", deltaM: 15.881, sigmaM: 0.012 },
  ],
};

const heightOf = (r: ReturnType<typeof adjustLevellingNetwork>, p: string) =>
  r.heights.find((h) => h.point === p);

describe("adjustLevellingNetwork: Ghilani & Wolf Example 12.1", () => {
  const r = adjustLevellingNetwork(EXAMPLE_12_1);

  it("adjusted heights", () => {
    // published: B 448.1087, C 453.4685, D 444.9436 m (reproduced)
    expect(heightOf(r, "B")?.heightM).toBeCloseTo(448.1087, 4);
    expect(heightOf(r, "C")?.heightM).toBeCloseTo(453.4685, 4);
    expect(heightOf(r, "D")?.heightM).toBeCloseTo(444.9436, 4);
    expect(heightOf(r, "A")).toMatchObject({ heightM: 437.596, sigmaM: 0, fixed: true });
  });

  it("vᵀWv, degrees of freedom and S0", () => {
    // computed in REFERENCES.md §4: vᵀWv = 1.2721, 3 dof, S0 = 0.6512
    expect(r.globalTest?.statistic).toBeCloseTo(1.2721, 4);
    expect(r.dof).toBe(3);
    expect(r.sigma0).toBeCloseTo(0.6512, 4);
  });

  it("standard deviations of the heights", () => {
    // Ghilani & Wolf Example 12.1 print S_B ±0.0023, S_C ±0.0026, S_D ±0.0018 m (memory)
    expect(heightOf(r, "B")?.sigmaM).toBeCloseTo(0.0023, 4);
    expect(heightOf(r, "C")?.sigmaM).toBeCloseTo(0.0026, 4);
    expect(heightOf(r, "D")?.sigmaM).toBeCloseTo(0.0018, 4);
  });

  it("passes the global test at 5 % and flags no blunder", () => {
    // χ²(0.025, 3) = 0.2158 and χ²(0.975, 3) = 9.348 (statistical tables, e.g. Abramowitz &
    // Stegun Table 26.8, memory); quantiles by @stdlib/stats-base-dists-chisquare-quantile
    expect(r.globalTest?.lower).toBeCloseTo(0.2158, 4);
    expect(r.globalTest?.upper).toBeCloseTo(9.348, 3);
    expect(r.globalTest?.passed).toBe(true);
    expect(r.suspect).toBeNull();
  });

  it("redundancy numbers sum to the degrees of freedom", () => {
    // Σ r_i = tr(Qvv W) = n − u (standard least-squares identity)
    expect(r.residuals.reduce((s, x) => s + x.redundancy, 0)).toBeCloseTo(3, 9);
    // residual = adjusted − observed
    const b = heightOf(r, "B")?.heightM ?? NaN;
    expect(r.residuals[0]?.residualM).toBeCloseTo(b - 437.596 - 10.509, 12);
  });
});

describe("adjustLevellingNetwork on seeded networks", () => {
  it("finds a 5 cm blunder among 1 mm/√km observations", () => {
    // Baarda data snooping: |w| > 3.29 (common practice) on the blundered observation (computed)
    const net = gridNetwork(5, 5, 21);
    const observations = net.observations.map((o, i) =>
      i === 17 ? { ...o, deltaM: o.deltaM + 0.05 } : o,
    );
    const r = adjustLevellingNetwork({ fixed: net.fixed, observations });
    expect(r.globalTest?.passed).toBe(false);
    expect(r.suspect?.index).toBe(17);
    expect(Math.abs(r.suspect?.standardized ?? 0)).toBeGreaterThan(3.29);
    const clean = adjustLevellingNetwork({ fixed: net.fixed, observations: net.observations });
    expect(clean.globalTest?.passed).toBe(true);
    expect(clean.suspect).toBeNull();
  });

  it("heights land within 4σ of the truth", () => {
    const net = gridNetwork(8, 8, 4);
    const r = adjustLevellingNetwork(net);
    for (const h of r.heights) {
      expect(Math.abs(h.heightM - (net.truth.get(h.point) ?? NaN))).toBeLessThanOrEqual(
        4 * h.sigmaAPrioriM + 1e-12,
      );
    }
  });

  it("weights from lengths equal weights from σ = 1 mm·√K", () => {
    // 1/σ² ∝ 1/length: both give the same heights (computed)
    const net = gridNetwork(4, 6, 9);
    const bySigma = adjustLevellingNetwork(net);
    const byLength = adjustLevellingNetwork({
      fixed: net.fixed,
      observations: net.observations.map(({ from, to, deltaM, lengthKm }) => ({
        from,
        to,
        deltaM,
        lengthKm,
      })),
    });
    bySigma.heights.forEach((h, i) =>
      expect(byLength.heights[i]?.heightM).toBeCloseTo(h.heightM, 10),
    );
    expect(byLength.sigma0).toBeCloseTo(bySigma.sigma0 ?? NaN, 9);
  });

  it("error-free observations leave zero residuals (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 6 }),
        fc.integer({ min: 2, max: 6 }),
        fc.integer(),
        (rows, cols, seed) => {
          const net = gridNetwork(rows, cols, seed, 0);
          const r = adjustLevellingNetwork(net, { test: false });
          for (const v of r.residuals) expect(Math.abs(v.residualM)).toBeLessThan(1e-9);
          for (const h of r.heights)
            expect(h.heightM).toBeCloseTo(net.truth.get(h.point) ?? NaN, 9);
        },
      ),
      { numRuns: runs(20), seed: 17 },
    );
  });
});

describe("adjustLevellingNetwork refuses what it cannot adjust", () => {
  const field = (name: string) => expect.objectContaining({ field: name });

  it("a point not joined to any fixed point", () => {
    const observations = [
      ...EXAMPLE_12_1.observations,
      { from: "X", to: "Y", deltaM: 1, sigmaM: 0.002 },
    ];
    expect(() => adjustLevellingNetwork({ ...EXAMPLE_12_1, observations })).toThrow(/X, Y/);
  });

  it("no redundancy where the global test needs it, unless tests are off", () => {
    const tree = {
      fixed: [{ point: "A", heightM: 100 }],
      observations: [{ from: "A", to: "B", deltaM: 1.5, sigmaM: 0.001 }],
    };
    expect(() => adjustLevellingNetwork(tree)).toThrow(/no redundancy/);
    const r = adjustLevellingNetwork(tree, { test: false });
    expect(r.dof).toBe(0);
    expect(r.globalTest).toBeNull();
    expect(r.sigma0).toBeNull();
    expect(heightOf(r, "B")).toMatchObject({ heightM: 101.5, sigmaM: 0.001 });
  });

  it.each([
    [{ fixed: [] }, "fixed"],
    [
      {
        fixed: [
          { point: "A", heightM: 1 },
          { point: "A", heightM: 2 },
        ],
      },
      "fixed[1].point",
    ],
    [{ fixed: [{ point: "A", heightM: NaN }] }, "fixed[0].heightM"],
    [{ observations: [] }, "observations"],
    [{ observations: [{ from: "A", to: "A", deltaM: 1, sigmaM: 0.001 }] }, "observations[0]"],
    [{ observations: [{ from: "A", to: "B", deltaM: 1 }] }, "observations[0]"],
    [
      { observations: [{ from: "A", to: "B", deltaM: 1, sigmaM: -0.001 }] },
      "observations[0].sigmaM",
    ],
    [
      { observations: [{ from: "A", to: "B", deltaM: 1, lengthKm: 0 }] },
      "observations[0].lengthKm",
    ],
    [
      { observations: [{ from: "A", to: "B", deltaM: Infinity, sigmaM: 0.001 }] },
      "observations[0].deltaM",
    ],
    [{ observations: [{ from: "", to: "B", deltaM: 1, sigmaM: 0.001 }] }, "observations[0].from"],
    [{ observations: [{ from: "A", to: "B", deltaM: 1, sigmaM: 1e-300 }] }, "observations[0]"],
  ])("%o", (patch, name) => {
    expect(() =>
      adjustLevellingNetwork({ ...EXAMPLE_12_1, ...patch } as typeof EXAMPLE_12_1),
    ).toThrow(field(name));
  });

  it("bad options", () => {
    expect(() => adjustLevellingNetwork(EXAMPLE_12_1, { significance: 0 })).toThrow(
      field("significance"),
    );
    expect(() => adjustLevellingNetwork(EXAMPLE_12_1, { criticalStandardized: -1 })).toThrow(
      ScienceInputError,
    );
    expect(() => adjustLevellingNetwork(EXAMPLE_12_1, { sigmaPerSqrtKmM: 0 })).toThrow(
      field("sigmaPerSqrtKmM"),
    );
  });
});
