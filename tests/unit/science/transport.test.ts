import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  dewPoint,
  meanKineticTemperature,
  ScienceInputError,
  shockExceedances,
  temperatureStatistics,
  unpackingCheck,
} from "../../../shared/science";
import { allFinite, runs } from "./helpers/runs";

const field = (name: string) => expect.objectContaining({ field: name });

describe("shockExceedances", () => {
  const events = [
    { peakG: 12, axis: "x" },
    { peakG: 35, axis: "z" },
    { peakG: 30, axis: "y" },
    { peakG: 45, axis: "z", time: "2030-05-01T10:00:00Z", durationS: 0.011 },
    { peakG: 31 },
  ];

  it("lists events above the crate's limits, with per-axis limits", () => {
    const r = shockExceedances(events, { maxPeakG: 30, maxPeakGByAxis: { z: 40 } });
    expect(r.checked).toBe(5);
    expect(r.exceedances.map((e) => e.index)).toEqual([3, 4]);
    expect(r.exceedances[0]).toMatchObject({
      limitG: 40,
      excessG: 5,
      ratio: 1.125,
      axis: "z",
      time: "2030-05-01T10:00:00Z",
    });
    expect(r.exceedances[1]).toMatchObject({ limitG: 30, axis: null, time: null });
    expect(r.worst?.index).toBe(3);
    expect(r.maxPeakG).toBe(45);
  });

  it("a peak equal to the limit is within it; no events, no exceedance", () => {
    expect(shockExceedances([{ peakG: 30 }], { maxPeakG: 30 }).exceedances).toEqual([]);
    expect(shockExceedances([], { maxPeakG: 30 })).toMatchObject({
      checked: 0,
      worst: null,
      maxPeakG: 0,
    });
  });

  it("refuses bad events and limits", () => {
    expect(() => shockExceedances(events, { maxPeakG: 0 })).toThrow(field("limits.maxPeakG"));
    expect(() => shockExceedances(events, { maxPeakG: 30, maxPeakGByAxis: { z: -1 } })).toThrow(
      field("limits.maxPeakGByAxis.z"),
    );
    expect(() => shockExceedances([{ peakG: -3 }], { maxPeakG: 30 })).toThrow(
      field("events[0].peakG"),
    );
    expect(() => shockExceedances([{ peakG: NaN }], { maxPeakG: 30 })).toThrow(ScienceInputError);
    expect(() => shockExceedances([{ peakG: 3, durationS: -1 }], { maxPeakG: 30 })).toThrow(
      field("events[0].durationS"),
    );
  });
});

describe("temperatureStatistics", () => {
  // Worked by hand (computed): 0–100 s rising 20 → 30 °C, 100–400 s at 30 °C, 400–500 s falling
  // to 10 °C; band 15 … 25 °C. Mean (25·100 + 30·300 + 20·100)/500 = 27 °C; above 25 °C from
  // 50 s to 425 s; below 15 °C from 475 s to 500 s.
  const series = { timeS: [0, 100, 400, 500], temperatureC: [20, 30, 30, 10] };
  const band = { minC: 15, maxC: 25 };

  it("time-weighted mean and time outside the band", () => {
    const s = temperatureStatistics(series, band);
    expect(s.meanC).toBeCloseTo(27, 12);
    expect(s.aboveS).toBeCloseTo(375, 9);
    expect(s.belowS).toBeCloseTo(25, 9);
    expect(s.outsideS).toBeCloseTo(400, 9);
    expect(s.fractionOutside).toBeCloseTo(0.8, 12);
    expect([s.minC, s.maxC, s.durationS, s.coveredS, s.gapS]).toEqual([10, 30, 500, 500, 0]);
    expect(s.excursions).toEqual([
      { side: "above", startS: 50, endS: 425, extremeC: 30 },
      { side: "below", startS: 475, endS: 500, extremeC: 10 },
    ]);
  });

  it("does not bridge intervals longer than maxGapS", () => {
    const s = temperatureStatistics(
      { timeS: [0, 10, 1000, 1010], temperatureC: [20, 20, 40, 40] },
      band,
      { maxGapS: 100 },
    );
    expect(s.gapS).toBe(990);
    expect(s.coveredS).toBe(20);
    expect(s.aboveS).toBe(10);
    expect(s.meanC).toBeCloseTo(30, 12);
  });

  it("a single sample is its own mean", () => {
    const s = temperatureStatistics({ timeS: [5], temperatureC: [21] }, band);
    expect([s.meanC, s.durationS, s.outsideS, s.fractionOutside]).toEqual([21, 0, 0, 0]);
    expect(s.meanKineticC).toBeCloseTo(21, 9);
  });

  it("refuses unsorted times, mismatched lengths, non-finite values and an empty band", () => {
    expect(() => temperatureStatistics({ timeS: [0, 0], temperatureC: [1, 2] }, band)).toThrow(
      field("timeS[1]"),
    );
    expect(() => temperatureStatistics({ timeS: [0, 1], temperatureC: [1] }, band)).toThrow(
      field("temperatureC"),
    );
    expect(() => temperatureStatistics({ timeS: [], temperatureC: [] }, band)).toThrow(
      field("timeS"),
    );
    expect(() => temperatureStatistics({ timeS: [0, 1], temperatureC: [1, NaN] }, band)).toThrow(
      field("temperatureC[1]"),
    );
    expect(() => temperatureStatistics(series, { minC: 25, maxC: 15 })).toThrow(field("band"));
    expect(() => temperatureStatistics(series, band, { maxGapS: 0 })).toThrow(field("maxGapS"));
  });
});

describe("meanKineticTemperature", () => {
  it("{20, 30} °C gives 26.2599 °C", () => {
    // REFERENCES.md §5 (computed from Haynes 1971 / USP <1079> with ΔH/R = 10 000 K)
    expect(meanKineticTemperature([20, 30])).toBeCloseTo(26.2599, 4);
  });

  it("weights act as repetitions", () => {
    // computed: weight 3 on 20 °C equals three samples of 20 °C
    expect(meanKineticTemperature([20, 30], [3, 1])).toBeCloseTo(
      meanKineticTemperature([20, 20, 20, 30]),
      12,
    );
    expect(meanKineticTemperature([20, 30], [2, 2])).toBeCloseTo(26.2599, 4);
  });

  it("is at least the arithmetic mean, equal for a constant temperature (fast-check)", () => {
    // REFERENCES.md §5 property (Jensen's inequality for the convex exp(−ΔH/RT))
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -40, max: 60, noNaN: true }), { minLength: 1, maxLength: 50 }),
        (t) => {
          const mean = t.reduce((s, v) => s + v, 0) / t.length;
          expect(meanKineticTemperature(t)).toBeGreaterThanOrEqual(mean - 1e-9);
        },
      ),
      { numRuns: runs(50), seed: 23 },
    );
    expect(meanKineticTemperature([18.5, 18.5, 18.5])).toBeCloseTo(18.5, 10);
  });

  it("refuses bad input", () => {
    expect(() => meanKineticTemperature([])).toThrow(field("samplesC"));
    expect(() => meanKineticTemperature([20, NaN])).toThrow(field("samplesC[1]"));
    expect(() => meanKineticTemperature([-300])).toThrow(field("samplesC[0]"));
    expect(() => meanKineticTemperature([20, 30], [1])).toThrow(field("weights"));
    expect(() => meanKineticTemperature([20, 30], [1, -1])).toThrow(field("weights[1]"));
    expect(() => meanKineticTemperature([20, 30], [0, 0])).toThrow(field("weights"));
  });
});

describe("dewPoint (Magnus, Alduchov & Eskridge constants)", () => {
  it("25 °C, 60 % gives 16.698 °C", () => {
    // REFERENCES.md §5 (computed from Alduchov & Eskridge 1996)
    expect(dewPoint(25, 60)).toBeCloseTo(16.698, 3);
  });

  it("at 100 % the dew point is the temperature, and it rises with humidity (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -40, max: 60, noNaN: true }),
        fc.double({ min: 1, max: 99, noNaN: true }),
        (t, rh) => {
          expect(dewPoint(t, 100)).toBeCloseTo(t, 9);
          expect(dewPoint(t, rh)).toBeLessThan(t);
          expect(dewPoint(t, rh + 1)).toBeGreaterThan(dewPoint(t, rh));
        },
      ),
      { numRuns: runs(50), seed: 29 },
    );
  });

  it("refuses humidity outside (0, 100] % and temperatures outside −40 … 60 °C", () => {
    expect(() => dewPoint(20, 0)).toThrow(field("relativeHumidityPct"));
    expect(() => dewPoint(20, 101)).toThrow(field("relativeHumidityPct"));
    expect(() => dewPoint(20, NaN)).toThrow(field("relativeHumidityPct"));
    expect(() => dewPoint(61, 50)).toThrow(field("temperatureC"));
    expect(() => dewPoint(-41, 50)).toThrow(field("temperatureC"));
  });
});

describe("unpackingCheck", () => {
  it("a cold crate must wait until its surface is 3 K above the room's dew point", () => {
    const r = unpackingCheck({
      surfaceTemperatureC: 5,
      roomTemperatureC: 22,
      roomRelativeHumidityPct: 55,
      timeConstantS: 3600,
    });
    expect(r.mayOpen).toBe(false);
    expect(r.status).toBe("wait");
    expect(r.dewPointC).toBeCloseTo(dewPoint(22, 55), 12);
    expect(r.requiredSurfaceC).toBeCloseTo(r.dewPointC + 3, 12);
    // computed: the exponential approach T(t) = T_room + (T0 − T_room)·e^(−t/τ) reaches the
    // required temperature at waitS, and the dew point of room air at that surface is 100 %.
    const reached = 22 + (5 - 22) * Math.exp(-(r.waitS ?? NaN) / 3600);
    expect(reached).toBeCloseTo(r.requiredSurfaceC, 9);
    // Room air touching the surface then stays below saturation: its relative humidity there,
    // RH·e_s(T_room)/e_s(T_surface) with the Magnus e_s ∝ exp(aT/(b + T)), is under 100 %.
    const es = (t: number) => Math.exp((17.625 * t) / (243.04 + t));
    expect((55 * es(22)) / es(reached)).toBeLessThan(100);
    expect((55 * es(22)) / es(r.dewPointC)).toBeCloseTo(100, 9);
  });

  it("a warm crate may open now", () => {
    const r = unpackingCheck({
      surfaceTemperatureC: 20,
      roomTemperatureC: 22,
      roomRelativeHumidityPct: 55,
    });
    expect(r).toMatchObject({ mayOpen: true, status: "may-open", waitS: 0 });
  });

  it("a room too humid for the margin is never safe by waiting; no time constant, no time", () => {
    const humid = unpackingCheck({
      surfaceTemperatureC: 10,
      roomTemperatureC: 22,
      roomRelativeHumidityPct: 90,
      timeConstantS: 600,
    });
    expect(humid).toMatchObject({ mayOpen: false, status: "room-too-humid", waitS: null });
    const unknown = unpackingCheck({
      surfaceTemperatureC: 5,
      roomTemperatureC: 22,
      roomRelativeHumidityPct: 50,
    });
    expect(unknown).toMatchObject({ status: "wait-time-unknown", waitS: null });
    expect(allFinite(humid)).toBe(true);
  });

  it("refuses bad input", () => {
    const ok = { surfaceTemperatureC: 5, roomTemperatureC: 22, roomRelativeHumidityPct: 55 };
    expect(() => unpackingCheck({ ...ok, timeConstantS: 0 })).toThrow(field("timeConstantS"));
    expect(() => unpackingCheck({ ...ok, marginC: -1 })).toThrow(field("marginC"));
    expect(() => unpackingCheck({ ...ok, surfaceTemperatureC: NaN })).toThrow(
      field("surfaceTemperatureC"),
    );
    expect(() => unpackingCheck({ ...ok, roomRelativeHumidityPct: 0 })).toThrow(
      field("roomRelativeHumidityPct"),
    );
    expect(() => unpackingCheck({ ...ok, roomTemperatureC: 80 })).toThrow(
      field("roomTemperatureC"),
    );
  });
});
