import { describe, expect, test } from "vitest";
import { createLineSplitter, readLines } from "../../../src/features/comparison/lib/line-slicer";
import { formatDuration, formatMm } from "../../../src/features/comparison/lib/durations";
import { formatScientific } from "../../../src/lib/format";
import { tauGrid, tauGridEnd } from "../../../src/features/comparison/lib/tau-grid";
import { draftFromRun, fieldsFromDraft } from "../../../src/features/comparison/lib/run-draft";

describe("formatDuration", () => {
  // Expected values worked by hand: 1 d = 86 400 s, 1 h = 3600 s.
  test.each([
    [42, "42 s"],
    [59.6, "60 s"],
    [150, "3 min"],
    [3600, "1 h"],
    [3600 + 25 * 60, "1 h 25 min"],
    [2 * 3600 + 59.7 * 60, "3 h"],
    [86_400 * 3 + 3600 * 4, "3 d 4 h"],
    [86_400 * 2 + 3600 * 23.6, "3 d"],
  ])("%d s reads %j", (seconds, text) => expect(formatDuration(seconds)).toBe(text));

  test("refuses what is not a duration", () => {
    expect(formatDuration(Number.NaN)).toBe("—");
    expect(formatDuration(-1)).toBe("—");
  });
});

describe("number formats", () => {
  test("scientific with superscript exponent", () => {
    expect(formatScientific(1.234e-15)).toBe("1.23 × 10⁻¹⁵");
    expect(formatScientific(-5e-17)).toBe("−5.00 × 10⁻¹⁷");
    expect(formatScientific(0)).toBe("0");
  });
  test("metres in millimetres", () => {
    expect(formatMm(0.0123)).toBe("12.3 mm");
    expect(formatMm(-0.0005, 2)).toBe("−0.50 mm");
  });
});

describe("tauGrid", () => {
  test("spans 1 s to a decade past the needed time, log-spaced", () => {
    // needed 3.2e6 s → log10 = 6.5 → ceil(7.5) = 8 → 1e8 s.
    expect(tauGridEnd({ neededS: 3.2e6, accumulatedS: 1e4 })).toBe(1e8);
    const grid = tauGrid({ neededS: 3.2e6, accumulatedS: 1e4 }, 10);
    expect(grid).toHaveLength(8 * 10 + 1);
    expect(grid[0]).toBe(1);
    expect(grid.at(-1)).toBeCloseTo(1e8, -1);
    // Equal ratios between neighbours: 10^(1/10).
    expect((grid[11] ?? 0) / (grid[10] ?? 1)).toBeCloseTo(10 ** 0.1, 12);
  });
  test("reaches past now when the target cannot be reached", () => {
    expect(tauGridEnd({ neededS: null, accumulatedS: 5e6 })).toBe(1e8);
    expect(tauGridEnd({ neededS: null, accumulatedS: 0 })).toBe(1e6);
  });
});

describe("line slicing", () => {
  test("joins lines split across pushes and drops CR", () => {
    const lines: [string, number][] = [];
    const s = createLineSplitter((text, n) => lines.push([text, n]));
    s.push("time,value\r\n2027-06-0");
    s.push("1T00:00:00Z,1e-16\r");
    s.push("\nlast");
    s.end();
    expect(lines).toEqual([
      ["time,value", 1],
      ["2027-06-01T00:00:00Z,1e-16", 2],
      ["last", 3],
    ]);
  });

  test("reads a blob in tiny slices, multi-byte characters intact", async () => {
    const text = "# τ0 = 1 s\nα,1\n\nβ,2\n";
    const lines: string[] = [];
    const progress: number[] = [];
    await readLines(
      new Blob([text]),
      (line) => lines.push(line),
      (b) => progress.push(b),
      3,
    );
    expect(lines).toEqual(["# τ0 = 1 s", "α,1", "", "β,2"]);
    const size = new TextEncoder().encode(text).length;
    expect(progress.at(-1)).toBe(size);
    expect(progress).toHaveLength(Math.ceil(size / 3));
  });
});

describe("run form units", () => {
  const id = "0b1d7c3e-2f4a-4d5b-9c6e-7a8b9c0d1e2f";
  test("σ and target typed in mm are stored in m, uptime % as a fraction", () => {
    const fields = fieldsFromDraft({
      ...draftFromRun(null),
      remoteSiteId: id,
      referenceHeightM: "412,5",
      referenceHeightSigmaM: "0.1",
      targetHeightUncertaintyM: "20",
      plannedUptime: "65",
    });
    expect(fields.referenceHeightM).toBe(412.5);
    expect(fields.referenceHeightSigmaM).toBe(0.0001);
    expect(fields.targetHeightUncertaintyM).toBe(0.02);
    expect(fields.plannedUptime).toBe(0.65);
    expect(fields.linkId).toBeNull();
  });
  test("empty optional heights stay null; the round trip shows what was typed", () => {
    const draft = { ...draftFromRun(null), targetHeightUncertaintyM: "15" };
    const fields = fieldsFromDraft(draft);
    expect(fields.referenceHeightSigmaM).toBeNull();
    expect(draftFromRun(null).plannedUptime).toBe("70");
  });
});
