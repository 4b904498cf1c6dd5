import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  heightPerFractionalFrequency,
  heightUncertaintyAt,
  ScienceInputError,
  timeToTarget,
  type TimeToTargetInput,
} from "../../../shared/science";
import { allFinite, relative, runs } from "./helpers/runs";

const SITE = { latitudeDeg: 45, heightM: 0 };
/** 1e-18 of fractional frequency as a height at the site (c²/γ, REFERENCES.md §2, computed). */
const ONE_E18_M = heightPerFractionalFrequency(45, 0) * 1e-18;

describe("timeToTarget", () => {
  it("a 1e-15/√τ clock needs about 10⁶ s for 1e-18", () => {
    // practice (DESIGN.md §1, REFERENCES.md §6): (1e-15/1e-18)² = 1e6 s, about 11.6 days
    const r = timeToTarget({
      targetHeightUncertaintyM: ONE_E18_M,
      instabilityAt1s: [1e-15],
      ...SITE,
    });
    expect(r.reachable).toBe(true);
    expect(relative(r.neededS ?? NaN, 1e6)).toBeLessThan(1e-9);
    expect(r.dominant).toBe("statistical");
    expect(r.floorM).toBe(0);
  });

  it("instabilities add in quadrature, and uptime stretches the wall-clock time", () => {
    // computed: σ = √(0.6² + 0.8²)·1e-15 = 1e-15
    const r = timeToTarget({
      targetHeightUncertaintyM: ONE_E18_M,
      instabilityAt1s: [6e-16, { name: "fibre link", value: 8e-16 }],
      accumulatedS: 2.5e5,
      uptime: 0.5,
      now: "2031-03-01T00:00:00Z",
      ...SITE,
    });
    expect(r.combinedInstabilityAt1s).toBeCloseTo(1e-15, 25);
    expect(relative(r.leftS ?? NaN, 7.5e5)).toBeLessThan(1e-9);
    expect(relative(r.wallClockLeftS ?? NaN, 1.5e6)).toBeLessThan(1e-9);
    // 1.5e6 s = 17 d 8 h 40 min after now
    expect(r.eta).toBe("2031-03-18T08:40:00.000Z");
  });

  it("height terms and systematics use up the target in quadrature", () => {
    // computed: target 5 cm, height terms 3 cm → 4 cm left for the clock terms; a 2e-18
    // systematic (1.83 cm) leaves √(4² − 1.833²) cm for the statistics.
    const sysM = 2e-18 * heightPerFractionalFrequency(45, 0);
    const r = timeToTarget({
      targetHeightUncertaintyM: 0.05,
      instabilityAt1s: [1e-15],
      systematic: [2e-18],
      heightTermsM: [{ name: "levelling tie", value: 0.03 }],
      ...SITE,
    });
    const statM = Math.sqrt(0.04 ** 2 - sysM ** 2);
    const expected = (1e-15 / (statM / heightPerFractionalFrequency(45, 0))) ** 2;
    expect(relative(r.neededS ?? NaN, expected)).toBeLessThan(1e-9);
    expect(r.budget.map((b) => b.term)).toEqual([
      "statistical",
      "systematic clock 1",
      "levelling tie",
    ]);
    // At the time the target is reached the total is the target.
    const total = Math.sqrt(r.budget.reduce((s, b) => s + b.heightM ** 2, 0));
    expect(relative(total, 0.05)).toBeLessThan(1e-9);
    expect(
      relative(
        heightUncertaintyAt(
          {
            targetHeightUncertaintyM: 0.05,
            instabilityAt1s: [1e-15],
            systematic: [2e-18],
            heightTermsM: [0.03],
            ...SITE,
          },
          r.neededS ?? 1,
        ),
        0.05,
      ),
    ).toBeLessThan(1e-9);
  });

  it("not reachable when the floor is at or above the target, naming the blocking term", () => {
    const r = timeToTarget({
      targetHeightUncertaintyM: 0.01,
      instabilityAt1s: [1e-15],
      flickerFloor: 5e-19,
      systematic: [
        { name: "clock A", value: 1e-18 },
        { name: "clock B", value: 2e-18 },
      ],
      ...SITE,
    });
    expect(r.reachable).toBe(false);
    expect([r.neededS, r.leftS, r.wallClockLeftS, r.eta]).toEqual([null, null, null, null]);
    expect(r.dominant).toBe("clock B");
    expect(r.floorM).toBeGreaterThan(0.01);
    expect(r.budgetAtS).toBeNull();
    expect(r.budget.find((b) => b.term === "statistical")?.heightM).toBe(0);
    expect(r.budget.find((b) => b.term === "flicker floor")?.fractional).toBe(5e-19);
  });

  it("a floor exactly at the target is not reachable", () => {
    const r = timeToTarget({
      targetHeightUncertaintyM: 0.02,
      instabilityAt1s: [1e-15],
      heightTermsM: [0.02],
      ...SITE,
    });
    expect(r.reachable).toBe(false);
    expect(r.dominant).toBe("height term 1");
  });

  it("once enough data is in, nothing is left and the budget is the current one", () => {
    const r = timeToTarget({
      targetHeightUncertaintyM: 0.05,
      instabilityAt1s: [1e-15],
      accumulatedS: 1e7,
      now: new Date(0),
      ...SITE,
    });
    expect(r.leftS).toBe(0);
    expect(r.eta).toBe("1970-01-01T00:00:00.000Z");
    expect(r.budgetAtS).toBe(1e7);
  });

  it("heightUncertaintyAt falls as 1/√τ without a floor", () => {
    // white FM averaging (IEEE Std 1139-2008)
    const input: TimeToTargetInput = {
      targetHeightUncertaintyM: 0.01,
      instabilityAt1s: [1e-15],
      ...SITE,
    };
    expect(
      relative(heightUncertaintyAt(input, 1e4) / heightUncertaintyAt(input, 4e4), 2),
    ).toBeLessThan(1e-12);
  });
});

describe("timeToTarget properties (fast-check)", () => {
  const instability = fc.double({ min: 1e-17, max: 1e-13, noNaN: true });
  const target = fc.double({ min: 0.001, max: 10, noNaN: true });
  const systematic = fc.array(fc.double({ min: 0, max: 1e-17, noNaN: true }), { maxLength: 3 });
  const base = (t: number, s: number[], sys: number[]): TimeToTargetInput => ({
    targetHeightUncertaintyM: t,
    instabilityAt1s: s,
    systematic: sys,
    heightTermsM: [0.002],
    ...SITE,
  });
  const needed = (i: TimeToTargetInput) => timeToTarget(i).neededS ?? Infinity;

  it("never needs less time when the target tightens", () => {
    fc.assert(
      fc.property(
        target,
        fc.double({ min: 0.1, max: 1, noNaN: true }),
        instability,
        systematic,
        (t, k, s, sys) => {
          expect(needed(base(t * k, [s], sys))).toBeGreaterThanOrEqual(needed(base(t, [s], sys)));
        },
      ),
      { numRuns: runs(50), seed: 5 },
    );
  });

  it("never needs less time when an instability grows", () => {
    fc.assert(
      fc.property(
        target,
        instability,
        fc.double({ min: 1, max: 10, noNaN: true }),
        systematic,
        (t, s, k, sys) => {
          expect(needed(base(t, [s * k, 1e-16], sys))).toBeGreaterThanOrEqual(
            needed(base(t, [s, 1e-16], sys)),
          );
        },
      ),
      { numRuns: runs(50), seed: 6 },
    );
  });

  it("never returns NaN or Infinity", () => {
    fc.assert(
      fc.property(
        target,
        instability,
        systematic,
        fc.double({ min: 0.01, max: 1, noNaN: true }),
        (t, s, sys, uptime) => {
          expect(
            allFinite(timeToTarget({ ...base(t, [s], sys), uptime, now: "2030-01-01T00:00:00Z" })),
          ).toBe(true);
        },
      ),
      { numRuns: runs(50), seed: 8 },
    );
  });
});

describe("timeToTarget refuses bad input", () => {
  const ok: TimeToTargetInput = {
    targetHeightUncertaintyM: 0.01,
    instabilityAt1s: [1e-15],
    ...SITE,
  };
  const field = (name: string) => expect.objectContaining({ field: name });

  it.each([
    [{ targetHeightUncertaintyM: 0 }, "targetHeightUncertaintyM"],
    [{ targetHeightUncertaintyM: -0.01 }, "targetHeightUncertaintyM"],
    [{ instabilityAt1s: [] }, "instabilityAt1s"],
    [{ instabilityAt1s: [0] }, "instabilityAt1s"],
    [{ instabilityAt1s: [-1e-15] }, "instabilityAt1s[0]"],
    [{ instabilityAt1s: [{ name: "", value: 1e-15 }] }, "instabilityAt1s[0].name"],
    [{ systematic: [NaN] }, "systematic[0]"],
    [{ heightTermsM: [{ name: "tie", value: -0.001 }] }, "heightTermsM[0].value"],
    [{ flickerFloor: Infinity }, "flickerFloor"],
    [{ latitudeDeg: 91 }, "latitudeDeg"],
    [{ heightM: NaN }, "heightM"],
    [{ heightM: 5e5 }, "heightM"],
    [{ accumulatedS: -1 }, "accumulatedS"],
    [{ uptime: 0 }, "uptime"],
    [{ uptime: 1.2 }, "uptime"],
    [{ now: "yesterday" }, "now"],
  ] as const)("%o", (patch, name) => {
    expect(() => timeToTarget({ ...ok, ...patch } as TimeToTargetInput)).toThrow(field(name));
  });

  it("heightUncertaintyAt refuses a non-positive averaging time", () => {
    expect(() => heightUncertaintyAt(ok, 0)).toThrow(ScienceInputError);
    expect(() => heightUncertaintyAt(ok, NaN)).toThrow(field("averagingS"));
  });
});
