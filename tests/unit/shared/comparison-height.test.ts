import { describe, expect, it } from "vitest";
import {
  analyseSeries,
  computeHeightResult,
  type HeightResultInput,
} from "../../../shared/comparison";
import { officialHeightsCaution, type ComparisonRunView } from "../../../shared/schemas/comparison";
import type { AdjustmentView } from "../../../shared/schemas/height-network";
import { heightUncertaintyAt, timeToTarget } from "../../../shared/science";
import { seededGaussian } from "../science/helpers/random";

const run: ComparisonRunView = {
  id: "00000000-0000-4000-8000-000000000001",
  campaignId: "00000000-0000-4000-8000-000000000002",
  name: "Test run",
  remoteSiteId: "00000000-0000-4000-8000-000000000003",
  remoteClockId: "00000000-0000-4000-8000-000000000004",
  referenceClockId: "00000000-0000-4000-8000-000000000005",
  linkId: null,
  linkName: "fibre",
  remoteMark: "KR-CRP",
  referenceHeightM: 100,
  referenceHeightSigmaM: 0.002,
  targetHeightUncertaintyM: 0.05,
  plannedUptime: 0.7,
  notes: "",
  dataRevision: 1,
  version: 1,
  createdAt: "2026-03-01T00:00:00.000Z",
  updatedAt: "2026-03-01T00:00:00.000Z",
};

const adjustment: AdjustmentView = {
  id: "00000000-0000-4000-8000-000000000009",
  computedAt: "2026-03-02T00:00:00.000Z",
  computedByName: null,
  options: { sigmaPerSqrtKmMm: 1, significance: 0.05, excluded: [] },
  points: [
    {
      mark: "BM1",
      heightM: 100,
      sigmaM: 0,
      fixed: true,
      benchmarkId: run.id,
      benchmarkSigmaM: 0.003,
    },
    {
      mark: "BM2",
      heightM: 90,
      sigmaM: 0,
      fixed: true,
      benchmarkId: run.id,
      benchmarkSigmaM: 0.004,
    },
    {
      mark: "KR-CRP",
      heightM: 100.01,
      sigmaM: 0.001,
      fixed: false,
      benchmarkId: null,
      benchmarkSigmaM: null,
    },
  ],
  observations: [],
  dof: 0,
  sigma0: null,
  globalTest: null,
  unconnected: [],
  observationCount: 2,
};

const base: HeightResultInput = {
  run,
  site: { latitudeDeg: 45, approxHeightM: 0 },
  remoteClock: {
    name: "Remote",
    instabilityAt1s: 1e-15,
    systematic: [
      { name: "bbr", value: 3e-18 },
      { name: "lattice", value: 4e-18 },
    ],
  },
  referenceClock: { name: "Reference", instabilityAt1s: 5e-16, systematic: [] },
  link: null,
  analysis: null,
  analysisState: { state: "none", dataRevision: null, error: null },
  adjustment,
  now: new Date("2026-03-05T00:00:00Z"),
};

describe("computeHeightResult", () => {
  it("before data: stated instabilities, the levelled ΔH and the caution", () => {
    const r = computeHeightResult(base);
    expect(r.clock).toBeNull();
    expect(r.timeToTarget.instabilitySource).toBe("stated");
    expect(r.timeToTarget.input.instabilityAt1s.map((t) => t.value)).toEqual([1e-15, 5e-16]);
    // One row per instrument with its terms in quadrature: √(3² + 4²)e-18 = 5e-18 (by hand).
    expect(r.budget.find((b) => b.term === "Remote systematic")?.fractional).toBeCloseTo(5e-18, 30);
    expect(r.levelled?.heightDifferenceM).toBeCloseTo(0.01, 12);
    // The benchmark term is the largest published σ of the fixed points (conservative).
    expect(r.levelled?.benchmarkSigmaM).toBe(0.004);
    expect(r.timeToTarget.reachable).toBe(true);
    expect(r.caution).toBe(officialHeightsCaution);
  });

  it("from data: ΔH from the mean (1e-18 ≈ 9.2 mm) and σ from the core", () => {
    const g = seededGaussian(3);
    // y = 1e-16 ≈ 0.92 m (REFERENCES.md §2: 1e-18 ≈ 9.2 mm, computed as c²·1e-18/9.80665).
    const values = new Float64Array(50_000).map(() => 1e-16 + 1e-15 * g());
    const analysis = { dataRevision: 1, ...analyseSeries({ t0: 1.77e9, tau0S: 10, values }) };
    const r = computeHeightResult({
      ...base,
      analysis,
      analysisState: { state: "done", dataRevision: 1, error: null },
    });
    const expectedM = (analysis.meanFractional * 299_792_458 ** 2) / 9.80665;
    expect(Math.abs((r.clock?.heightDifferenceM ?? 0) - expectedM) / expectedM).toBeLessThan(3e-3);
    expect(r.timeToTarget.instabilitySource).toBe("data");
    expect(r.clock?.sigmaM).toBe(heightUncertaintyAt(r.timeToTarget.input, analysis.validTimeS));
    // The budget rows add in quadrature to the core's σ at the time accumulated.
    expect(r.combinedHeightUncertaintyM).toBeCloseTo(r.clock?.sigmaM ?? 0, 12);
    expect(r.comparison?.z).toBeCloseTo(
      Math.abs(r.comparison?.differenceM ?? 0) / r.combinedHeightUncertaintyM,
      12,
    );
    expect(r.timeToTarget.neededS).toBe(timeToTarget(r.timeToTarget.input).neededS);
  });

  it("names the blocking term when the systematic floor is above the target", () => {
    // Remote systematic 5e-18 ≈ 46 mm (c²/γ ≈ 9.2e15 m) against a 40 mm target; the height terms
    // (1, 4, 2 mm) leave room, so only that term has to improve.
    const r = computeHeightResult({ ...base, run: { ...run, targetHeightUncertaintyM: 0.04 } });
    expect(r.timeToTarget.reachable).toBe(false);
    expect(r.timeToTarget.dominant).toBe("Remote systematic");
    expect(r.timeToTarget.reason).toMatch(/above the target 40.0 mm.*Remote systematic/);
    expect(r.timeToTarget.improve).toMatch(/Remote systematic would have to be below 39\.[0-9] mm/);
    const worse = computeHeightResult({
      ...base,
      run: { ...run, targetHeightUncertaintyM: 0.01 },
      referenceClock: {
        name: "Reference",
        instabilityAt1s: 5e-16,
        systematic: [{ name: "bbr", value: 2e-18 }],
      },
    });
    expect(worse.timeToTarget.improve).toMatch(/other floor terms alone/);
  });

  it("says why there is no levelled value", () => {
    expect(computeHeightResult({ ...base, adjustment: null }).levelledMissing).toMatch(
      /No levelling adjustment/,
    );
    expect(
      computeHeightResult({ ...base, run: { ...run, remoteMark: "X" } }).levelledMissing,
    ).toMatch(/not in the latest/);
  });
});
