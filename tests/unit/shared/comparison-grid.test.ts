import { describe, expect, it } from "vitest";
import { buildSeriesGrid, createSeriesReader, medianInterval } from "../../../shared/comparison";

const T0 = Date.UTC(2026, 2, 1) / 1000;
const iso = (t: number) => new Date(t * 1000).toISOString();

function read(times: number[], tau0S?: number) {
  const got: number[] = [];
  const r = createSeriesReader({
    valueKind: "fractional",
    ...(tau0S !== undefined ? { tau0S } : {}),
    onSample: (t) => got.push(t),
  });
  r.line("time,y", 1);
  times.forEach((t, i) => r.line(`${iso(t)},1e-16`, i + 2));
  return { summary: r.finish(), got };
}

describe("sample interval and gaps", () => {
  it("takes τ0 as the median of the intervals", () => {
    // Intervals 10, 10, 30, 10: median 10 (by hand).
    expect(medianInterval([0, 10, 20, 50, 60])).toBe(10);
  });

  it("lists a gap of round(Δt/τ0) − 1 missing samples", () => {
    const times = [0, 10, 20, 30, 80, 90].map((s) => T0 + s);
    const { summary, got } = read(times);
    expect(summary.errors).toEqual([]);
    expect(summary.tau0S).toBe(10);
    // 30 → 80 s at 10 s: round(50/10) − 1 = 4 missing (by hand).
    expect(summary.gaps).toEqual({
      count: 1,
      missingSamples: 4,
      list: [{ fromAt: iso(T0 + 30), toAt: iso(T0 + 80), missing: 4 }],
    });
    expect(got).toEqual(times);
  });

  it("calls two samples in one interval a row error and hands nothing on", () => {
    const { summary, got } = read(
      [0, 10, 13, 20].map((s) => T0 + s),
      10,
    );
    expect(summary.errors).toEqual([expect.objectContaining({ line: 4, field: "time" })]);
    expect(summary.badRows).toBe(1);
    expect(got).toEqual([T0, T0 + 10]);
  });

  it("builds the grid with NaN for missing samples", () => {
    const g = buildSeriesGrid(
      [
        { times: [0, 1, 2], values: [1, 2, 3] },
        { times: [5, 6], values: [6, NaN] },
      ],
      1,
    );
    expect(Array.from(g.values)).toEqual([1, 2, 3, NaN, NaN, 6, NaN]);
    expect(g.gaps.missingSamples).toBe(2);
  });

  it("refuses a file without data or with an interval out of range", () => {
    expect(read([]).summary.problem).toMatch(/no data rows/);
    expect(read([T0, T0 + 100_000]).summary.problem).toMatch(/outside/);
  });
});
