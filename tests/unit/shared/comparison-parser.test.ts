import { describe, expect, it } from "vitest";
import {
  createSeriesParser,
  fractionalFromRatio,
  parseExactDecimal,
} from "../../../shared/comparison";

function parse(
  text: string,
  options: Parameters<typeof createSeriesParser>[0] = { valueKind: "fractional" },
) {
  const p = createSeriesParser(options);
  const samples = text.split("\n").map((line, i) => p.line(line, i + 1));
  return { p, samples: samples.filter((s) => s !== null) };
}

describe("series parser", () => {
  it("reads a header, comments, ISO times with Z or offset, and a validity column", () => {
    const { p, samples } = parse(
      [
        "# remote minus reference",
        "time,y,valid",
        "2026-03-01T00:00:00Z,1.5e-16,1",
        "2026-03-01T01:00:10+01:00,2e-16,true",
        "2026-03-01T00:00:20.5Z,9e-16,0",
        "",
      ].join("\n"),
    );
    expect(p.errors).toEqual([]);
    expect(p.rows).toBe(3);
    expect(p.validRows).toBe(2);
    // 2026-03-01T00:00:00Z is 1772323200 Unix seconds (Date.UTC, independent of the parser).
    const t0 = Date.UTC(2026, 2, 1) / 1000;
    expect(samples.map((s) => s.t)).toEqual([t0, t0 + 10, t0 + 20.5]);
    expect(samples[0]?.y).toBe(1.5e-16);
    expect(Number.isNaN(samples[2]?.y)).toBe(true);
  });

  it("reads MJD without a header, with semicolons, tabs or spaces", () => {
    // MJD 61000 = 1970-01-01 + (61000 − 40587) days (MJD of the Unix epoch is 40587).
    const t = (61000 - 40587) * 86400;
    for (const sep of [";", "\t", "   "]) {
      const { p, samples } = parse(`61000${sep}1e-17\n61000.5${sep}-2e-17`);
      expect(p.errors).toEqual([]);
      expect(samples.map((s) => s.t)).toEqual([t, t + 43200]);
    }
  });

  it("records every bad row with its line, field and problem, and keeps going", () => {
    const { p } = parse(
      [
        "time,y",
        "2026-03-01T00:00:00Z,1e-16",
        "2026-03-01T00:00:10,1e-16", // no zone
        "2026-03-01T00:00:20Z,abc",
        "2026-03-01T00:00:30Z,2e-12", // beyond 1e-12
        "2026-03-01T00:00:00Z,1e-16", // not increasing
        "2026-03-01T00:00:40Z,1e-16",
      ].join("\n"),
    );
    expect(p.badRows).toBe(4);
    expect(p.rows).toBe(6);
    expect(p.errors.map((e) => [e.line, e.field])).toEqual([
      [3, "time"],
      [4, "y"],
      [5, "y"],
      [6, "time"],
    ]);
    expect(p.errors[0]?.message).toMatch(/no time zone/);
    expect(p.errors[2]?.message).toMatch(/1e-12/);
    expect(p.errors[3]?.message).toMatch(/increase strictly/);
  });

  it("refuses Unix seconds given as MJD", () => {
    const { p } = parse("1772323200,1e-16");
    expect(p.errors[0]?.message).toMatch(/Unix seconds are not accepted/);
  });
});

describe("exact frequency ratios", () => {
  it("keeps the 18th digit a double would lose", () => {
    // By hand: (1.000000000000000001 − 1)/1 = 1e-18; in doubles 1.000000000000000001 is 1, so 0.
    expect(Number("1.000000000000000001") / 1 - 1).toBe(0);
    const one = parseExactDecimal("1");
    const ratio = parseExactDecimal("1.000000000000000001");
    if (one === null || ratio === null) throw new Error("not read");
    expect(fractionalFromRatio(ratio, one)).toBe(1e-18);
  });

  it("divides by a nominal that is not 1", () => {
    // By hand: (2.000000000000000003 − 2)/2 = 3e-18/2 = 1.5e-18;
    // (1.1000000000000000011 − 1.1)/1.1 = 1.1e-18/1.1 = 1e-18.
    const { samples } = parse("2026-03-01T00:00:00Z,2.000000000000000003", {
      valueKind: "ratio",
      nominalRatio: "2",
    });
    expect(samples[0]?.y).toBe(1.5e-18);
    const a = parseExactDecimal("1.1000000000000000011");
    const b = parseExactDecimal("1.1");
    if (a === null || b === null) throw new Error("not read");
    expect(fractionalFromRatio(a, b)).toBe(1e-18);
  });

  it("needs a nominal ratio for ratio files", () => {
    expect(() => createSeriesParser({ valueKind: "ratio" })).toThrow(/nominal ratio/);
  });
});
