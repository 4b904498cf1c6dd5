// The field book: corrections replace the setup with the same number, warnings name the setup
// and field, and the misclosure is judged against the FGCC 1984 classes.
import { describe, expect, it } from "vitest";
import {
  currentSetups,
  describeMisclosure,
  formatMillimetres,
  summariseSection,
  type BookSetup,
} from "../../../shared/levelling-book";
import { findLevellingClass } from "../../../shared/science/levelling/misclosure";

const SECOND_I = "fgcc-1984-second-order-class-i";
const THIRD = "fgcc-1984-third-order";

let counter = 0;
function setup(
  run: BookSetup["run"],
  number: number,
  backsightM: number,
  foresightM: number,
  backsightDistanceM = 30,
  foresightDistanceM = 30,
  recordedAt = "2026-06-01T08:00:00Z",
): BookSetup {
  counter++;
  return {
    id: `00000000-0000-4000-8000-${String(counter).padStart(12, "0")}`,
    run,
    number,
    backsightM,
    foresightM,
    backsightDistanceM,
    foresightDistanceM,
    recordedAt,
  };
}

// A book computed by hand (rise and fall), A → B and back.
//   forward  BS      FS      rise    fall    dist
//   1        1.5234  0.8123  0.7111          30.0 / 29.0
//   2        0.9876  1.4321          0.4445  35.0 / 34.0
//   3        1.2000  1.1000  0.1000          25.0 / 26.0
//   Σ        3.7110  3.3444  0.8111  0.4445  → ΔH = +0.3666 m, 179 m
//   backward
//   1        1.3000  1.4000          0.1000  27.0 / 28.0
//   2        1.4000  0.9560  0.4440          33.0 / 33.0
//   3        0.8000  1.5100          0.7100  30.0 / 30.0
//   Σ        3.5000  3.8660  0.4440  0.8100  → ΔH = −0.3660 m, 181 m
// Misclosure +0.6 mm; K = (0.179 + 0.181)/2 = 0.180 km; second-order I allows 6·√0.18 = 2.546 mm.
function handBook(backwardFs2 = 0.956): BookSetup[] {
  return [
    setup("forward", 1, 1.5234, 0.8123, 30, 29),
    setup("forward", 2, 0.9876, 1.4321, 35, 34),
    setup("forward", 3, 1.2, 1.1, 25, 26),
    setup("backward", 1, 1.3, 1.4, 27, 28),
    setup("backward", 2, 1.4, backwardFs2, 33, 33),
    setup("backward", 3, 0.8, 1.51, 30, 30),
  ];
}

describe("currentSetups", () => {
  it("keeps the latest setup per run and number, sorted by number", () => {
    const first = setup("forward", 2, 1.1, 1.0, 30, 30, "2026-06-01T08:00:00Z");
    const correction = setup("forward", 2, 1.2, 1.0, 30, 30, "2026-06-01T08:05:00Z");
    const one = setup("forward", 1, 1.3, 1.0);
    const back = setup("backward", 2, 1.0, 1.1);
    const got = currentSetups([correction, back, first, one]);
    expect(got.forward.map((s) => s.id)).toEqual([one.id, correction.id]);
    expect(got.backward.map((s) => s.id)).toEqual([back.id]);
  });

  it("compares times as instants, not as text, and breaks a tie by id", () => {
    // 10:00+02:00 is 08:00 UTC: earlier than 09:30 UTC although it sorts later as text.
    const later = setup("forward", 1, 1.2, 1.0, 30, 30, "2026-06-01T09:30:00Z");
    const earlier = setup("forward", 1, 1.1, 1.0, 30, 30, "2026-06-01T10:00:00+02:00");
    expect(currentSetups([later, earlier]).forward[0]?.id).toBe(later.id);
    const a = { ...later, id: "00000000-0000-4000-8000-00000000000a" };
    const b = { ...later, id: "00000000-0000-4000-8000-00000000000b" };
    expect(currentSetups([b, a]).forward[0]?.id).toBe(b.id);
    expect(currentSetups([a, b]).forward[0]?.id).toBe(b.id);
  });
});

describe("summariseSection", () => {
  it("reduces a hand-computed book and passes the arithmetic check ΣBS − ΣFS = ΣRise − ΣFall", () => {
    const summary = summariseSection(SECOND_I, handBook());
    const rows = summary.forward.rows;
    expect(rows.map((r) => r.riseM)).toEqual([
      expect.closeTo(0.7111, 9),
      0,
      expect.closeTo(0.1, 9),
    ]);
    expect(rows[1]?.fallM).toBeCloseTo(0.4445, 9);
    // Arithmetic check (field-book practice), from the hand sums in the table above.
    const sumBs = 1.5234 + 0.9876 + 1.2;
    const sumFs = 0.8123 + 1.4321 + 1.1;
    const rise = rows.reduce((s, r) => s + (r.riseM ?? 0), 0);
    const fall = rows.reduce((s, r) => s + (r.fallM ?? 0), 0);
    expect(sumBs - sumFs).toBeCloseTo(rise - fall, 12);
    expect(summary.forward.cumulativeM).toBeCloseTo(0.3666, 9);
    expect(summary.backward.cumulativeM).toBeCloseTo(-0.366, 9);
    expect(summary.forward.imbalanceM).toBeCloseTo(1, 9);
    expect(summary.backward.imbalanceM).toBeCloseTo(-1, 9);
    expect(summary.misclosure?.misclosureM).toBeCloseTo(0.0006, 9);
    expect(summary.misclosure?.lengthKm).toBeCloseTo(0.18, 12);
    expect(summary.misclosure?.toleranceM).toBeCloseTo(0.006 * Math.sqrt(0.18), 12);
    expect(summary.misclosure?.withinTolerance).toBe(true);
    expect(summary.closure).toEqual({
      forwardDeltaM: expect.closeTo(0.3666, 9),
      backwardDeltaM: expect.closeTo(-0.366, 9),
      lengthKm: expect.closeTo(0.18, 12),
      misclosureM: expect.closeTo(0.0006, 9),
      toleranceM: expect.closeTo(0.0025456, 7),
      withinTolerance: true,
    });
    expect(summary.warnings).toEqual([]);
  });

  it("goes out of tolerance with a misread foresight and back within after a correction", () => {
    // FS 0.9460 instead of 0.9560: backward ΔH −0.3560, misclosure +10.6 mm > 2.55 mm.
    const book = handBook(0.946);
    const bad = summariseSection(SECOND_I, book);
    expect(bad.misclosure?.misclosureM).toBeCloseTo(0.0106, 9);
    expect(bad.misclosure?.withinTolerance).toBe(false);
    expect(bad.closure?.withinTolerance).toBe(false);
    const fixed = setup("backward", 2, 1.4, 0.956, 33, 33, "2026-06-01T09:00:00Z");
    const good = summariseSection(SECOND_I, [...book, fixed]);
    expect(good.misclosure?.misclosureM).toBeCloseTo(0.0006, 9);
    expect(good.misclosure?.withinTolerance).toBe(true);
    expect(good.backward.rows).toHaveLength(3);
  });

  it("has no misclosure until both runs have a setup", () => {
    const forwardOnly = handBook().filter((s) => s.run === "forward");
    const summary = summariseSection(SECOND_I, forwardOnly);
    expect(summary.misclosure).toBeNull();
    expect(summary.closure).toBeNull();
    expect(summary.backward.rows).toEqual([]);
    expect(summariseSection(SECOND_I, []).misclosure).toBeNull();
  });

  it("has no misclosure when no sight length was entered (K = 0 has no tolerance)", () => {
    const book = [setup("forward", 1, 1.2, 1.1, 0, 0), setup("backward", 1, 1.1, 1.2, 0, 0)];
    expect(summariseSection(SECOND_I, book).misclosure).toBeNull();
  });

  it("allows 24 mm on a third-order section of K = 4 km, and not 24.1 mm (FGCC 1984, REFERENCES.md §4)", () => {
    // 40 setups of 50 m + 50 m per run: 4.000 km each way; 12·√4 = 24 mm (reproduced).
    const run = (kind: BookSetup["run"], bs: number, fs: number, lastFs: number) =>
      Array.from({ length: 40 }, (_, i) => setup(kind, i + 1, bs, i === 39 ? lastFs : fs, 50, 50));
    // Forward +0.1 m × 40 = +4.0000 m; backward −0.1 m × 39 and −0.0760 m = −3.9760 m.
    const at = summariseSection(THIRD, [
      ...run("forward", 1.5, 1.4, 1.4),
      ...run("backward", 1.4, 1.5, 1.476),
    ]);
    expect(at.misclosure?.lengthKm).toBe(4);
    expect(at.misclosure?.toleranceM).toBeCloseTo(0.024, 12);
    expect(at.misclosure?.misclosureM).toBeCloseTo(0.024, 9);
    expect(at.misclosure?.withinTolerance).toBe(true);
    const beyond = summariseSection(THIRD, [
      ...run("forward", 1.5, 1.4, 1.4),
      ...run("backward", 1.4, 1.5, 1.4759),
    ]);
    expect(beyond.misclosure?.misclosureM).toBeCloseTo(0.0241, 9);
    expect(beyond.misclosure?.withinTolerance).toBe(false);
    // Second-order Class I at the same length: 6·√4 = 12 mm (REFERENCES.md §4, reproduced).
    expect(
      summariseSection(SECOND_I, [
        ...run("forward", 1.5, 1.4, 1.4),
        ...run("backward", 1.4, 1.5, 1.476),
      ]).misclosure?.toleranceM,
    ).toBeCloseTo(0.012, 12);
  });

  it("refuses an unknown class, naming it", () => {
    expect(() => summariseSection("no-such-class", handBook())).toThrow(/no-such-class/);
  });
});

describe("warnings", () => {
  it("warns on a sight over 50 m, and not at 50 m (practice)", () => {
    const long = setup("forward", 1, 1.5, 1.4, 50.1, 50);
    const summary = summariseSection(SECOND_I, [long, setup("forward", 2, 1.5, 1.4, 50, 50)]);
    expect(summary.warnings).toEqual([
      {
        setupId: long.id,
        run: "forward",
        number: 1,
        field: "backsightDistanceM",
        message: "Backsight of 50.1 m is longer than 50 m",
      },
    ]);
  });

  it("warns when the two sights of a setup differ by more than 5 m, and not at 5 m (memory)", () => {
    const uneven = setup("backward", 4, 1.5, 1.4, 24.9, 30);
    const summary = summariseSection(SECOND_I, [uneven, setup("backward", 5, 1.5, 1.4, 35, 30)]);
    expect(summary.warnings).toHaveLength(1);
    expect(summary.warnings[0]).toMatchObject({ setupId: uneven.id, number: 4, field: null });
    expect(summary.warnings[0]?.message).toBe(
      "Backsight and foresight distances differ by 5.1 m (more than 5 m)",
    );
  });

  it("warns on a staff reading below 0.3 m, and not at 0.3 m (common practice)", () => {
    const low = setup("forward", 1, 1.5, 0.2999);
    const summary = summariseSection(SECOND_I, [low, setup("forward", 2, 0.3, 1.4)]);
    expect(summary.warnings).toHaveLength(1);
    expect(summary.warnings[0]).toMatchObject({ setupId: low.id, field: "foresightM" });
    expect(summary.warnings[0]?.message).toMatch(/^Foresight reading 0\.2999 m is below 0\.3 m/);
  });

  it("warns once for the run when the running imbalance exceeds 10 m (memory)", () => {
    // +4 m at each of three setups: 8 m is fine, 12 m is not; no setup is over 5 m by itself.
    const book = [1, 2, 3].map((n) => setup("forward", n, 1.5, 1.4, 34, 30));
    expect(summariseSection(SECOND_I, book.slice(0, 2)).warnings).toEqual([]);
    const summary = summariseSection(SECOND_I, book);
    expect(summary.warnings).toEqual([
      {
        setupId: "",
        run: "forward",
        number: 0,
        field: null,
        message:
          "Forward run: backsight distances total 12.0 m more than foresight distances (more than 10 m apart)",
      },
    ]);
  });

  it("judges only the current setups: a corrected sight no longer warns", () => {
    const long = setup("forward", 1, 1.5, 1.4, 60, 60, "2026-06-01T08:00:00Z");
    const fixed = setup("forward", 1, 1.5, 1.4, 40, 40, "2026-06-01T08:10:00Z");
    expect(summariseSection(SECOND_I, [long]).warnings).toHaveLength(2);
    expect(summariseSection(SECOND_I, [long, fixed]).warnings).toEqual([]);
  });
});

describe("describeMisclosure", () => {
  it("reads like the field book panel", () => {
    // K = 1 km; forward +1.0000 m; backward −1.0032 m → −3.2 mm of 6·√1 = 6.0 mm.
    const forward = Array.from({ length: 10 }, (_, i) => setup("forward", i + 1, 1.5, 1.4, 50, 50));
    const backward = Array.from({ length: 10 }, (_, i) =>
      setup("backward", i + 1, 1.4, i === 0 ? 1.5032 : 1.5, 50, 50),
    );
    const summary = summariseSection(SECOND_I, [...forward, ...backward]);
    if (summary.misclosure === null) throw new Error("expected a misclosure");
    expect(describeMisclosure(summary.misclosure, findLevellingClass(SECOND_I))).toBe(
      "Misclosure −3.2 mm of ±6.0 mm allowed (Second-order, Class I, K = 1.00 km)",
    );
    expect(formatMillimetres(0.00004)).toBe("0.0 mm");
    expect(formatMillimetres(-0.00004)).toBe("0.0 mm");
  });
});
