import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  FGCC_1984_LEVELLING_CLASSES,
  findLevellingClass,
  loopMisclosure,
  misclosureToleranceM,
  reduceLevellingLine,
  runningReduction,
  ScienceInputError,
  sectionMisclosure,
  sightBalance,
} from "../../../shared/science";
import { runs } from "./helpers/runs";

// A made-up line BM-A → M1 → BM-B; expected values worked by hand (computed):
// section 1: (1.234 − 0.987) + (2.001 − 1.456) = 0.792 m over 30 + 31 + 40 + 38 = 139 m;
// section 2: (0.876 − 1.999) + (1.111 − 0.555) = −0.567 m over 25 + 27 + 35 + 36 = 123 m.
const LINE = {
  startPoint: "BM-A",
  setups: [
    { backsightM: 1.234, foresightM: 0.987, backsightDistanceM: 30, foresightDistanceM: 31 },
    {
      backsightM: 2.001,
      foresightM: 1.456,
      backsightDistanceM: 40,
      foresightDistanceM: 38,
      foresightPoint: "M1",
    },
    { backsightM: 0.876, foresightM: 1.999, backsightDistanceM: 25, foresightDistanceM: 27 },
    {
      backsightM: 1.111,
      foresightM: 0.555,
      backsightDistanceM: 35,
      foresightDistanceM: 36,
      foresightPoint: "BM-B",
    },
  ],
};

describe("reduceLevellingLine", () => {
  it("gives section differences, lengths and imbalances", () => {
    const r = reduceLevellingLine(LINE);
    expect(r.sections.map((s) => [s.from, s.to, s.setupCount])).toEqual([
      ["BM-A", "M1", 2],
      ["M1", "BM-B", 2],
    ]);
    expect(r.sections[0]?.deltaM).toBeCloseTo(0.792, 12);
    expect(r.sections[1]?.deltaM).toBeCloseTo(-0.567, 12);
    expect(r.sections[0]?.lengthKm).toBeCloseTo(0.139, 12);
    expect(r.sections[1]?.imbalanceM).toBeCloseTo(-3, 12);
    expect(r.totalDeltaM).toBeCloseTo(0.225, 12);
    expect(r.totalLengthKm).toBeCloseTo(0.262, 12);
  });

  it("passes the arithmetic check ΣBS − ΣFS = ΣRise − ΣFall", () => {
    // rise-and-fall booking check (standard practice); sums by hand: 5.222 − 4.997 = 1.348 − 1.123
    const c = reduceLevellingLine(LINE).check;
    expect(c.sumBacksightM).toBeCloseTo(5.222, 12);
    expect(c.sumForesightM).toBeCloseTo(4.997, 12);
    expect(c.sumRiseM).toBeCloseTo(1.348, 12);
    expect(c.sumFallM).toBeCloseTo(1.123, 12);
    expect(c.discrepancyM).toBeLessThan(1e-12);
  });

  it("refuses a line that does not end on a mark, readings out of range and empty lines", () => {
    const open = { ...LINE, setups: LINE.setups.slice(0, 3) };
    expect(() => reduceLevellingLine(open)).toThrow(
      expect.objectContaining({ field: "setups[2].foresightPoint" }),
    );
    expect(() => reduceLevellingLine({ startPoint: "A", setups: [] })).toThrow(ScienceInputError);
    expect(() => reduceLevellingLine({ startPoint: "", setups: LINE.setups })).toThrow(
      expect.objectContaining({ field: "startPoint" }),
    );
    const bad = [{ ...LINE.setups[1], foresightM: NaN }];
    expect(() =>
      reduceLevellingLine({ startPoint: "A", setups: bad as typeof LINE.setups }),
    ).toThrow(expect.objectContaining({ field: "setups[0].foresightM" }));
    const negative = [{ ...LINE.setups[1], backsightDistanceM: -2 }];
    expect(() =>
      reduceLevellingLine({ startPoint: "A", setups: negative as typeof LINE.setups }),
    ).toThrow(expect.objectContaining({ field: "setups[0].backsightDistanceM" }));
    const loop = [{ ...LINE.setups[1], foresightPoint: "A" }];
    expect(() =>
      reduceLevellingLine({ startPoint: "A", setups: loop as typeof LINE.setups }),
    ).toThrow(ScienceInputError);
  });
});

describe("runningReduction (field book)", () => {
  it("keeps cumulative rise/fall and distance sums while a setup is being typed", () => {
    const r = runningReduction([
      ...LINE.setups.slice(0, 3),
      { backsightM: 1.111, backsightDistanceM: 35 }, // foresight not read yet
    ]);
    expect(r.completeSetups).toBe(3);
    // 0.792 − 1.123 (computed by hand above)
    expect(r.cumulativeM).toBeCloseTo(-0.331, 12);
    expect(r.rows[2]?.fallM).toBeCloseTo(1.123, 12);
    expect(r.rows[2]?.riseM).toBe(0);
    expect(r.rows[3]?.deltaM).toBeNull();
    expect(r.rows[3]?.complete).toBe(false);
    // BS distances 30 + 40 + 25 + 35, FS 31 + 38 + 27
    expect(r.rows[3]?.backsightDistanceSumM).toBe(130);
    expect(r.imbalanceM).toBe(34);
    expect(r.lengthKm).toBeCloseTo(0.226, 12);
  });

  it("an empty book is a zero state; bad readings are refused", () => {
    expect(runningReduction([]).cumulativeM).toBe(0);
    expect(() => runningReduction([{ backsightM: Infinity }])).toThrow(
      expect.objectContaining({ field: "entries[0].backsightM" }),
    );
    expect(() => runningReduction([{ foresightDistanceM: -1 }])).toThrow(ScienceInputError);
  });
});

describe("sightBalance", () => {
  it("flags long sights and imbalances against the default limits", () => {
    // defaults: 50 m sights (practice), 5 m per setup and 10 m cumulative (FGCC 1984, memory)
    const b = sightBalance([
      { backsightDistanceM: 48, foresightDistanceM: 45 },
      { backsightDistanceM: 52, foresightDistanceM: 46 },
      { backsightDistanceM: 40, foresightDistanceM: 38 },
    ]);
    expect(b.rows.map((r) => r.imbalanceM)).toEqual([3, 6, 2]);
    expect(b.rows.map((r) => r.cumulativeImbalanceM)).toEqual([3, 9, 11]);
    expect(b.rows.map((r) => r.longSight)).toEqual([false, true, false]);
    expect(b.rows.map((r) => r.setupImbalanceExceeded)).toEqual([false, true, false]);
    expect(b.rows.map((r) => r.cumulativeImbalanceExceeded)).toEqual([false, false, true]);
    expect(b.ok).toBe(false);
    expect(b.longestSightM).toBe(52);
    expect(
      sightBalance([{ backsightDistanceM: 30, foresightDistanceM: 31 }], { maxSightM: 60 }).ok,
    ).toBe(true);
  });

  it("refuses bad distances and limits", () => {
    expect(() => sightBalance([])).toThrow(ScienceInputError);
    expect(() => sightBalance([{ backsightDistanceM: -1, foresightDistanceM: 2 }])).toThrow(
      expect.objectContaining({ field: "setups[0].backsightDistanceM" }),
    );
    expect(() =>
      sightBalance([{ backsightDistanceM: 1, foresightDistanceM: 2 }], { maxSightM: 0 }),
    ).toThrow(expect.objectContaining({ field: "limits.maxSightM" }));
  });
});

describe("misclosure tolerances (FGCC 1984)", () => {
  const third = findLevellingClass("fgcc-1984-third-order");

  it("third-order loop of 4 km allows 24 mm", () => {
    // FGCC 1984 (reproduced, REFERENCES.md §4)
    expect(misclosureToleranceM(third, 4, "loop")).toBeCloseTo(0.024, 12);
  });

  it("k for second- and third-order classes", () => {
    // FGCC 1984: Second-order Class I 6, Class II 8, Third-order 12 mm·√K (reproduced)
    const k = (id: string) => misclosureToleranceM(findLevellingClass(id), 1, "section") * 1000;
    expect(k("fgcc-1984-second-order-class-i")).toBeCloseTo(6, 12);
    expect(k("fgcc-1984-second-order-class-ii")).toBeCloseTo(8, 12);
    expect(k("fgcc-1984-third-order")).toBeCloseTo(12, 12);
  });

  it("first-order classes (memory: 3/4 and 4/5 mm·√K for section/loop)", () => {
    // FGCC 1984, First-order Class I and II (memory, REFERENCES.md §4)
    const one = findLevellingClass("fgcc-1984-first-order-class-i");
    const two = findLevellingClass("fgcc-1984-first-order-class-ii");
    expect([one.sectionKMm, one.loopKMm, two.sectionKMm, two.loopKMm]).toEqual([3, 4, 4, 5]);
    expect(FGCC_1984_LEVELLING_CLASSES).toHaveLength(5);
  });

  it("section and loop checks", () => {
    // computed: 6·√2.25 = 9 mm for a second-order class I section of 2.25 km
    const c2 = findLevellingClass("fgcc-1984-second-order-class-i");
    const s = sectionMisclosure(
      { forwardDeltaM: 1.2345, backwardDeltaM: -1.2265, lengthKm: 2.25 },
      c2,
    );
    expect(s.misclosureM).toBeCloseTo(0.008, 12);
    expect(s.toleranceM).toBeCloseTo(0.009, 12);
    expect(s.withinTolerance).toBe(true);
    const loop = loopMisclosure(
      [
        { deltaM: 1.5, lengthKm: 1.5 },
        { deltaM: -0.7, lengthKm: 1 },
        { deltaM: -0.775, lengthKm: 1.5 },
      ],
      third,
    );
    expect(loop.lengthKm).toBe(4);
    expect(loop.misclosureM).toBeCloseTo(0.025, 12);
    expect(loop.withinTolerance).toBe(false);
    expect(loop.usedFraction).toBeCloseTo(25 / 24, 9);
  });

  it("classes are data: a campaign's own class works the same way", () => {
    const own = {
      id: "own",
      name: "Campaign class",
      sectionKMm: 2,
      loopKMm: 2,
      source: "campaign",
    };
    expect(misclosureToleranceM(own, 9, "section")).toBeCloseTo(0.006, 12);
    expect(findLevellingClass("own", [own])).toBe(own);
  });

  it("refuses unknown classes and bad lengths", () => {
    expect(() => findLevellingClass("zeroth-order")).toThrow(
      expect.objectContaining({ field: "class" }),
    );
    expect(() => misclosureToleranceM(third, 0, "loop")).toThrow(
      expect.objectContaining({ field: "lengthKm" }),
    );
    expect(() => loopMisclosure([], third)).toThrow(ScienceInputError);
    expect(() =>
      sectionMisclosure({ forwardDeltaM: NaN, backwardDeltaM: 1, lengthKm: 1 }, third),
    ).toThrow(expect.objectContaining({ field: "forwardDeltaM" }));
    expect(() =>
      sectionMisclosure({ forwardDeltaM: 1, backwardDeltaM: -1, lengthKm: -1 }, third),
    ).toThrow(expect.objectContaining({ field: "lengthKm" }));
    expect(() => loopMisclosure([{ deltaM: NaN, lengthKm: 1 }], third)).toThrow(
      expect.objectContaining({ field: "legs[0].deltaM" }),
    );
    expect(() => misclosureToleranceM({ ...third, loopKMm: -1 }, 1, "loop")).toThrow(
      expect.objectContaining({ field: "class.loopKMm" }),
    );
  });
});

describe("running sums stay consistent (fast-check)", () => {
  it("the running total equals the line reduction's total", () => {
    const setup = fc.record({
      backsightM: fc.double({ min: 0, max: 4, noNaN: true }),
      foresightM: fc.double({ min: 0, max: 4, noNaN: true }),
      backsightDistanceM: fc.double({ min: 0, max: 60, noNaN: true }),
      foresightDistanceM: fc.double({ min: 0, max: 60, noNaN: true }),
    });
    fc.assert(
      fc.property(fc.array(setup, { minLength: 1, maxLength: 30 }), (setups) => {
        const line = {
          startPoint: "S",
          setups: setups.map((s, i) =>
            i === setups.length - 1 ? { ...s, foresightPoint: "E" } : s,
          ),
        };
        const reduced = reduceLevellingLine(line);
        const running = runningReduction(setups);
        expect(running.cumulativeM).toBeCloseTo(reduced.totalDeltaM, 9);
        expect(running.lengthKm).toBeCloseTo(reduced.totalLengthKm, 9);
        expect(reduced.check.discrepancyM).toBeLessThan(1e-9);
      }),
      { numRuns: runs(30), seed: 13 },
    );
  });
});
