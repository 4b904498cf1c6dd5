import { describe, expect, it } from "vitest";
import {
  frequencyToPhase,
  phaseToFrequency,
  ScienceInputError,
  summarizeSamples,
} from "../../../shared/science";
import { NBS_140_FREQUENCY, NBS_140_PHASE } from "./helpers/sp1065";

describe("phase and frequency", () => {
  it("the NBS 140 frequency data integrate to the printed phase form", () => {
    // NIST SP 1065 (Riley 2008) §12.3: phase = running sum of y − mean (reproduced, 5 decimals)
    const mean = summarizeSamples(NBS_140_FREQUENCY).mean;
    const x = frequencyToPhase(
      NBS_140_FREQUENCY.map((v) => v - mean),
      1,
    );
    expect(x.length).toBe(NBS_140_PHASE.length);
    x.forEach((v, i) => expect(Math.abs(v - (NBS_140_PHASE[i] ?? NaN))).toBeLessThan(1e-5));
  });

  it("phase differences give back the frequency, scaled by τ0", () => {
    // SP 1065 §4: y_i = (x_{i+1} − x_i)/τ0
    const y = [1e-13, -2e-13, 3.5e-13, 0];
    const tau0 = 10;
    const x = frequencyToPhase(y, tau0, 5e-9);
    expect(x[0]).toBe(5e-9);
    expect(x[1]).toBeCloseTo(5e-9 + 1e-12, 24);
    phaseToFrequency(x, tau0).forEach((v, i) => expect(v).toBeCloseTo(y[i] ?? NaN, 24));
  });

  it("a missing phase point makes the two frequency samples beside it missing", () => {
    const y = phaseToFrequency([0, 1, NaN, 3, 4], 1);
    expect(Array.from(y, (v) => Number.isNaN(v))).toEqual([false, true, true, false]);
  });

  it("refuses to integrate across a gap, with the index of the missing sample", () => {
    expect(() => frequencyToPhase([1, NaN, 2], 1)).toThrow(
      expect.objectContaining({ field: "y[1]" }),
    );
  });

  it("refuses bad input", () => {
    expect(() => phaseToFrequency([1], 1)).toThrow(ScienceInputError);
    expect(() => phaseToFrequency([], 1)).toThrow(ScienceInputError);
    expect(() => phaseToFrequency([1, 2], -1)).toThrow(expect.objectContaining({ field: "tau0" }));
    expect(() => phaseToFrequency([1, Infinity], 1)).toThrow(
      expect.objectContaining({ field: "x[1]" }),
    );
    expect(() => frequencyToPhase([1, 2], 1, NaN)).toThrow(
      expect.objectContaining({ field: "x0" }),
    );
    expect(() => summarizeSamples([NaN, NaN])).toThrow(ScienceInputError);
  });
});
