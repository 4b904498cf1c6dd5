import { describe, expect, it } from "vitest";
import {
  decadeLabels,
  decadeMmLabels,
  exponentLabels,
  powerOfTen,
} from "../../../src/features/comparison/lib/axis-labels";

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
});
