// What a field entry says against its crate's limits, the same on the tablet (shown at once) and on
// the server (kept with the entry, and what alerts are raised from). Computed with the science core.
import { unpackingCheck } from "./science/transport/dewpoint";
import { shockExceedances, type ShockEvent } from "./science/transport/shock";
import { temperatureStatistics } from "./science/transport/temperature";
import type { EntryFlags, FieldEntryData, ShockEventInput } from "./schemas/field-entries";

/** The limits of the crate an entry is about (crates table). */
export interface CrateLimits {
  readonly label: string;
  readonly maxShockG: number;
  readonly temperatureMinC: number;
  readonly temperatureMaxC: number;
}

const g = (v: number) => `${Number(v.toFixed(1))} g`;
const celsius = (v: number) => `${Number(v.toFixed(1))} °C`;
const events = (n: number) => (n === 1 ? "1 event" : `${n} events`);

/** One event per axis with a peak, as the science core takes them. */
export function axisPeaks(events: readonly ShockEventInput[]): ShockEvent[] {
  const peaks: ShockEvent[] = [];
  for (const e of events) {
    const durationS = e.durationMs === null ? undefined : e.durationMs / 1000;
    for (const [axis, peakG] of [
      ["x", e.xG],
      ["y", e.yG],
      ["z", e.zG],
    ] as const) {
      if (peakG !== null) peaks.push({ peakG, axis, time: e.at, durationS });
    }
  }
  return peaks;
}

/** A one-line summary per kind; `exceeded` marks what needs someone's attention. */
export function assessEntry(data: FieldEntryData, crate: CrateLimits | null): EntryFlags {
  switch (data.kind) {
    case "shock-indicator":
      return data.tripped
        ? { exceeded: true, summary: `Indicator tripped (rated ${g(data.ratingG)})` }
        : { exceeded: false, summary: `Indicator not tripped (rated ${g(data.ratingG)})` };
    case "shock-log": {
      const peaks = axisPeaks(data.events);
      const highest = Math.max(...peaks.map((p) => p.peakG));
      if (!crate)
        return { exceeded: false, summary: `${events(data.events.length)}, peak ${g(highest)}` };
      const { exceedances, worst } = shockExceedances(peaks, { maxPeakG: crate.maxShockG });
      if (worst === null)
        return {
          exceeded: false,
          summary: `${events(data.events.length)}, peak ${g(highest)}, within ${g(crate.maxShockG)}`,
        };
      return {
        exceeded: true,
        summary: `${exceedances.length} ${exceedances.length === 1 ? "peak" : "peaks"} above ${g(crate.maxShockG)}; highest ${g(worst.peakG)} on ${worst.axis ?? "an axis"}`,
      };
    }
    case "temperatures": {
      const samples = [...data.samples].sort((a, b) => a.at.localeCompare(b.at));
      const minC = Math.min(...samples.map((s) => s.celsius));
      const maxC = Math.max(...samples.map((s) => s.celsius));
      const count = samples.length === 1 ? "1 reading" : `${samples.length} readings`;
      const range = `${count}, ${celsius(minC)} … ${celsius(maxC)}`;
      if (!crate) return { exceeded: false, summary: range };
      const outside = minC < crate.temperatureMinC || maxC > crate.temperatureMaxC;
      if (!outside)
        return {
          exceeded: false,
          summary: `${range}, within ${celsius(crate.temperatureMinC)} … ${celsius(crate.temperatureMaxC)}`,
        };
      // A single reading covers no time: say it is outside, not for how long.
      const stats =
        samples.length > 1 && uniqueTimes(samples)
          ? temperatureStatistics(
              {
                timeS: samples.map((s) => Date.parse(s.at) / 1000),
                temperatureC: samples.map((s) => s.celsius),
              },
              { minC: crate.temperatureMinC, maxC: crate.temperatureMaxC },
            )
          : null;
      const minutes = stats ? `, ${Math.round(stats.outsideS / 60)} min outside` : "";
      return {
        exceeded: true,
        summary: `${range}: outside ${celsius(crate.temperatureMinC)} … ${celsius(crate.temperatureMaxC)}${minutes}`,
      };
    }
    case "dew-point": {
      const check = dewPointVerdict(data);
      if (check.mayOpen)
        return {
          exceeded: false,
          summary: `May open: surface ${celsius(data.surfaceTemperatureC)}, needs ${celsius(check.requiredSurfaceC)}`,
        };
      const overridden = data.overrideReason !== "";
      return {
        exceeded: !overridden,
        summary: `${overridden ? "Opened against the check" : "Do not open yet"}: surface ${celsius(data.surfaceTemperatureC)}, needs ${celsius(check.requiredSurfaceC)} (dew point ${celsius(check.dewPointC)})`,
      };
    }
    case "observation":
      return { exceeded: false, summary: data.text.slice(0, 120) };
  }
}

function uniqueTimes(samples: readonly { at: string }[]): boolean {
  for (let i = 1; i < samples.length; i++)
    if (Date.parse(samples[i]?.at ?? "") <= Date.parse(samples[i - 1]?.at ?? "")) return false;
  return true;
}

/** The unpacking check of a dew-point entry (Magnus formula, shared/science/transport/dewpoint.ts). */
export const dewPointVerdict = (data: Extract<FieldEntryData, { kind: "dew-point" }>) =>
  unpackingCheck({
    surfaceTemperatureC: data.surfaceTemperatureC,
    roomTemperatureC: data.roomTemperatureC,
    roomRelativeHumidityPct: data.roomHumidityPct,
    marginC: data.marginK,
  });

/** A dew-point entry lets an unpacking checklist be signed off when it passed or was overridden. */
export const dewPointClears = (data: Extract<FieldEntryData, { kind: "dew-point" }>) =>
  dewPointVerdict(data).mayOpen || data.overrideReason !== "";
