// Shaping a crate's temperatures for the screen: merging manual readings and imported parts,
// the gap threshold, the chart's columns and the statistics (checked by hand, trapezoidal rule).
import { describe, expect, it } from "vitest";
import {
  formatHoursMinutes,
  gapThresholdS,
  mergeTemperatureEntries,
  seriesStatistics,
  toChartColumns,
  type TemperatureEntryLike,
} from "../../../../src/features/temperatures/series";

const crateA = "0b6f5b7e-1d8c-4a55-8f3e-2a4c6d8e0f12";
const crateB = "1c7a6c8f-2e9d-4b66-9a4f-3b5d7e9f1a23";
const t0 = Date.UTC(2026, 5, 3, 0, 0, 0);
const at = (minutes: number) => new Date(t0 + minutes * 60_000).toISOString();
const importPart = (part: number) => ({
  importId: "5f1e2d3c-4b5a-4697-8877-665544332211",
  fileName: "a.csv",
  part,
  parts: 2,
});

function entry(
  id: string,
  crateId: string | null,
  source: "manual" | "logger",
  readings: [number, number][],
  recordedAt = at(1000),
): TemperatureEntryLike {
  return {
    id,
    crateId,
    recordedAt,
    data: {
      kind: "temperatures",
      source,
      loggerModel: "",
      import: source === "logger" ? importPart(id === "p1" ? 1 : 2) : null,
      samples: readings.map(([m, c]) => ({ at: at(m), celsius: c, humidityPct: null })),
    },
  };
}

describe("mergeTemperatureEntries", () => {
  it("merges a crate's imported parts and manual readings by time, leaving out other crates and kinds", () => {
    const entries: TemperatureEntryLike[] = [
      entry("p2", crateA, "logger", [
        [20, 22],
        [25, 23],
      ]),
      entry("m1", crateA, "manual", [[12, 30]]),
      entry("p1", crateA, "logger", [
        [0, 20],
        [5, 21],
        [10, 21.5],
      ]),
      entry("other", crateB, "logger", [[1, 99]]),
      {
        id: "obs",
        crateId: crateA,
        recordedAt: at(0),
        data: { kind: "observation", text: "lid scratched" },
      },
    ];
    const merged = mergeTemperatureEntries(entries, crateA);
    expect(merged.entries).toBe(3);
    expect(merged.duplicates).toBe(0);
    expect(merged.samples.map((s) => [(s.atS * 1000 - t0) / 60_000, s.celsius, s.source])).toEqual([
      [0, 20, "logger"],
      [5, 21, "logger"],
      [10, 21.5, "logger"],
      [12, 30, "manual"],
      [20, 22, "logger"],
      [25, 23, "logger"],
    ]);
  });

  it("keeps the newest recorded reading when two share an instant", () => {
    const merged = mergeTemperatureEntries(
      [
        entry(
          "old",
          crateA,
          "logger",
          [
            [0, 20],
            [5, 21],
          ],
          at(100),
        ),
        entry("new", crateA, "manual", [[5, 24]], at(200)),
      ],
      crateA,
    );
    expect(merged.duplicates).toBe(1);
    expect(merged.samples.map((s) => s.celsius)).toEqual([20, 24]);
  });
});

describe("gapThresholdS", () => {
  it("is ten median intervals, at least an hour", () => {
    expect(gapThresholdS([0, 600, 1200, 1800, 99_999])).toBe(6000);
    expect(gapThresholdS([0, 60, 120, 10_000])).toBe(3600);
    expect(gapThresholdS([0])).toBe(3600);
    // Even count: median of 600 and 1200 is 900.
    expect(gapThresholdS([0, 600, 1800])).toBe(9000);
  });
});

describe("toChartColumns", () => {
  it("gives x in Unix seconds, the band as constant lines, the series and the outside markers", () => {
    const { samples } = mergeTemperatureEntries(
      [
        entry("m", crateA, "manual", [
          [0, 10],
          [1, 20],
          [2, 31],
        ]),
      ],
      crateA,
    );
    const [x, min, max, c, outside] = toChartColumns(samples, { minC: 15, maxC: 25 });
    expect(x).toEqual([t0 / 1000, t0 / 1000 + 60, t0 / 1000 + 120]);
    expect(c).toEqual([10, 20, 31]);
    expect(outside).toEqual([10, null, 31]);
    expect(min).toEqual([15, 15, 15]);
    expect(max).toEqual([25, 25, 25]);
  });

  it("breaks the line halfway through a gap longer than the threshold", () => {
    const { samples } = mergeTemperatureEntries(
      [
        entry("m", crateA, "manual", [
          [0, 20],
          [1, 20],
          [121, 30],
        ]),
      ],
      crateA,
    );
    const [x, , , c, outside] = toChartColumns(samples, { minC: 15, maxC: 25 }, 3600);
    const s0 = t0 / 1000;
    expect(x).toEqual([s0, s0 + 60, s0 + 60 + 3600, s0 + 121 * 60]);
    expect(c).toEqual([20, 20, null, 30]);
    expect(outside).toEqual([null, null, null, 30]);
  });
});

describe("seriesStatistics", () => {
  it("matches a hand calculation: 20 → 30 → 20 °C over two hours against 15 … 25 °C", () => {
    const { samples } = mergeTemperatureEntries(
      [
        entry("m", crateA, "manual", [
          [0, 20],
          [60, 30],
          [120, 20],
        ]),
      ],
      crateA,
    );
    const result = seriesStatistics(samples, { minC: 15, maxC: 25 });
    if (result === null) throw new Error("expected statistics");
    const s = result.statistics;
    // Linear between samples: above 25 °C from 0:30 to 1:30, i.e. one hour of two.
    expect(s.outsideS).toBeCloseTo(3600, 9);
    expect(s.fractionOutside).toBeCloseTo(0.5, 12);
    // Trapezoids: (25 + 25) °C·h / 2 h = 25 °C.
    expect(s.meanC).toBeCloseTo(25, 12);
    expect(s.excursions).toEqual([
      { side: "above", startS: t0 / 1000 + 1800, endS: t0 / 1000 + 5400, extremeC: 30 },
    ]);
    expect(s.gapS).toBe(0);
    expect(formatHoursMinutes(s.outsideS)).toBe("1:00");
  });

  it("reports a gap longer than the threshold and leaves it out of the covered time", () => {
    const { samples } = mergeTemperatureEntries(
      [
        entry("m", crateA, "manual", [
          [0, 20],
          [1, 20],
          [2, 20],
          [300, 20],
        ]),
      ],
      crateA,
    );
    const result = seriesStatistics(samples, { minC: 15, maxC: 25 });
    expect(result?.maxGapS).toBe(3600);
    expect(result?.statistics.gapS).toBe(298 * 60);
    expect(result?.statistics.coveredS).toBe(120);
  });

  it("gives nothing without samples", () => {
    expect(seriesStatistics([], { minC: 15, maxC: 25 })).toBeNull();
  });
});

describe("formatHoursMinutes", () => {
  it("rounds to the minute", () => {
    expect(formatHoursMinutes(3 * 3600 + 7 * 60 + 29)).toBe("3:07");
    expect(formatHoursMinutes(59)).toBe("0:01");
    expect(formatHoursMinutes(26 * 3600)).toBe("26:00");
  });
});
