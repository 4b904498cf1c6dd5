// Temperature statistics of a logger series against an allowed band, time-weighted so that
// uneven sampling does not bias them: the temperature is taken as linear between samples
// (trapezoidal rule), and the time outside the band comes from where each segment crosses it.
// Intervals longer than maxGapS are gaps: counted, never bridged.
import { ScienceInputError } from "../errors";
import { requireFinite, requireNonEmpty, requirePositive } from "../validate";
import { meanKineticTemperature } from "./mkt";

export interface TemperatureBand {
  readonly minC: number;
  readonly maxC: number;
}

export interface Excursion {
  readonly side: "above" | "below";
  readonly startS: number;
  readonly endS: number;
  /** Highest (above) or lowest (below) sample temperature reached. */
  readonly extremeC: number;
}

export interface TemperatureStatistics {
  readonly samples: number;
  readonly minC: number;
  readonly maxC: number;
  /** Time-weighted mean (the sample when there is a single one). */
  readonly meanC: number;
  readonly meanKineticC: number;
  readonly durationS: number;
  readonly coveredS: number;
  readonly gapS: number;
  readonly aboveS: number;
  readonly belowS: number;
  readonly outsideS: number;
  /** outsideS / coveredS (0 when nothing is covered). */
  readonly fractionOutside: number;
  readonly excursions: readonly Excursion[];
}

interface Series {
  readonly t: Float64Array;
  readonly c: Float64Array;
}

function readSeries(timeS: ArrayLike<number>, temperatureC: ArrayLike<number>): Series {
  requireNonEmpty(timeS, "timeS");
  if (temperatureC.length !== timeS.length) {
    throw new ScienceInputError(
      "temperatureC",
      `must have one value per time (${timeS.length}), got ${temperatureC.length}`,
    );
  }
  const t = Float64Array.from(timeS, (v, i) => requireFinite(v, `timeS[${i}]`));
  const c = Float64Array.from(temperatureC, (v, i) => requireFinite(v, `temperatureC[${i}]`));
  for (let i = 1; i < t.length; i++) {
    if (!((t[i] ?? 0) > (t[i - 1] ?? 0)))
      throw new ScienceInputError(`timeS[${i}]`, "times must increase strictly");
  }
  return { t, c };
}

/** The part [from, to] (s) of a linear segment where the temperature is beyond a limit. */
function beyond(t0: number, t1: number, c0: number, c1: number, limit: number, above: boolean) {
  const out0 = above ? c0 > limit : c0 < limit;
  const out1 = above ? c1 > limit : c1 < limit;
  if (!out0 && !out1) return null;
  if (out0 && out1) return { from: t0, to: t1 };
  const cross = t0 + ((limit - c0) / (c1 - c0)) * (t1 - t0);
  return out0 ? { from: t0, to: cross } : { from: cross, to: t1 };
}

function addExcursion(
  list: Excursion[],
  side: "above" | "below",
  from: number,
  to: number,
  extremeC: number,
) {
  const last = list[list.length - 1];
  if (last !== undefined && last.side === side && last.endS === from) {
    const extreme =
      side === "above" ? Math.max(last.extremeC, extremeC) : Math.min(last.extremeC, extremeC);
    list[list.length - 1] = { ...last, endS: to, extremeC: extreme };
  } else list.push({ side, startS: from, endS: to, extremeC });
}

interface Totals {
  coveredS: number;
  gapS: number;
  integral: number;
  aboveS: number;
  belowS: number;
  weights: Float64Array;
  excursions: Excursion[];
}

function integrate(s: Series, band: TemperatureBand, maxGapS: number): Totals {
  const n = s.t.length;
  const r: Totals = {
    coveredS: 0,
    gapS: 0,
    integral: 0,
    aboveS: 0,
    belowS: 0,
    weights: new Float64Array(n),
    excursions: [],
  };
  for (let i = 0; i + 1 < n; i++) {
    const [t0, t1, c0, c1] = [s.t[i] ?? 0, s.t[i + 1] ?? 0, s.c[i] ?? 0, s.c[i + 1] ?? 0];
    const dt = t1 - t0;
    if (dt > maxGapS) {
      r.gapS += dt;
      continue;
    }
    r.coveredS += dt;
    r.integral += ((c0 + c1) / 2) * dt;
    r.weights[i] = (r.weights[i] ?? 0) + dt / 2;
    r.weights[i + 1] = (r.weights[i + 1] ?? 0) + dt / 2;
    const up = beyond(t0, t1, c0, c1, band.maxC, true);
    if (up !== null) {
      r.aboveS += up.to - up.from;
      addExcursion(r.excursions, "above", up.from, up.to, Math.max(c0, c1));
    }
    const down = beyond(t0, t1, c0, c1, band.minC, false);
    if (down !== null) {
      r.belowS += down.to - down.from;
      addExcursion(r.excursions, "below", down.from, down.to, Math.min(c0, c1));
    }
  }
  return r;
}

export function temperatureStatistics(
  series: { readonly timeS: ArrayLike<number>; readonly temperatureC: ArrayLike<number> },
  band: TemperatureBand,
  options: { readonly maxGapS?: number } = {},
): TemperatureStatistics {
  const s = readSeries(series.timeS, series.temperatureC);
  requireFinite(band.minC, "band.minC");
  requireFinite(band.maxC, "band.maxC");
  if (!(band.maxC > band.minC)) throw new ScienceInputError("band", "maxC must be above minC");
  const maxGapS =
    options.maxGapS === undefined ? Infinity : requirePositive(options.maxGapS, "maxGapS");
  const r = integrate(s, band, maxGapS);
  let minC = Infinity;
  let maxC = -Infinity;
  let plain = 0;
  for (const v of s.c) {
    minC = Math.min(minC, v);
    maxC = Math.max(maxC, v);
    plain += v;
  }
  const timed = r.coveredS > 0;
  const outsideS = r.aboveS + r.belowS;
  return {
    samples: s.t.length,
    minC,
    maxC,
    meanC: timed ? r.integral / r.coveredS : plain / s.c.length,
    meanKineticC: meanKineticTemperature(s.c, timed ? r.weights : undefined),
    durationS: (s.t[s.t.length - 1] ?? 0) - (s.t[0] ?? 0),
    coveredS: r.coveredS,
    gapS: r.gapS,
    aboveS: r.aboveS,
    belowS: r.belowS,
    outsideS,
    fractionOutside: timed ? outsideS / r.coveredS : 0,
    excursions: r.excursions,
  };
}
