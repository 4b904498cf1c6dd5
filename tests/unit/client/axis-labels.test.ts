import { describe, expect, it } from "vitest";
import {
  decadeLabels,
  decadeMmLabels,
  exponentLabels,
  utcTimeLabels,
} from "../../../src/features/comparison/lib/axis-labels";
import { powerOfTen } from "../../../src/lib/format";

describe("axis labels", () => {
  it("labels only the decades of a log axis and leaves hidden splits empty", () => {
    expect(decadeLabels([1e-15, 2e-15, null, 1e-16, 0])).toEqual(["10⁻¹⁵", "", "", "10⁻¹⁶", ""]);
    expect(powerOfTen(3)).toBe("10³");
  });

  it("shows metres as millimetres at the decades", () => {
    // By hand: 1 m = 1000 mm, 1e-4 m = 0.1 mm; 0.002 m is not a decade.
    expect(decadeMmLabels([1, 0.002, 1e-4, null, 0.01])).toEqual(["1,000", "", "0.1", "", "10"]);
  });

  it("prints a linear axis of small numbers with an exponent", () => {
    expect(exponentLabels([null, 0, -2e-15, 4.25e-15])).toEqual(["", "0", "-2.0e-15", "4.3e-15"]);
  });

  it("adds digits until neighbouring ticks differ", () => {
    expect(exponentLabels([2.898e-13, 2.9e-13, 2.902e-13])).toEqual([
      "2.898e-13",
      "2.900e-13",
      "2.902e-13",
    ]);
  });

  it("writes UTC times in 24 hours and the date at midnight", () => {
    // 2027-07-13T00:00:00Z is 1815436800 s (GNU date -u -d @1815436800); 15:30 UTC is 55,800 s later.
    expect(Date.UTC(2027, 6, 13) / 1000).toBe(1815436800);
    expect(utcTimeLabels([1815436800, 1815436800 + 55_800, null])).toEqual(["07-13", "15:30", ""]);
  });
});
