// A crate's temperature series from the site's entries (manual and imported parts, merged and sorted
// by time), its statistics from the science core and the arrays the chart draws.
import type { FieldEntryView } from "../../../shared/schemas/field-entries";
import {
  temperatureStatistics,
  type TemperatureBand,
  type TemperatureStatistics,
} from "../../../shared/science/transport/temperature";

export type TemperatureEntryLike = Pick<FieldEntryView, "id" | "crateId" | "recordedAt" | "data">;

export interface MergedSample {
  atS: number;
  celsius: number;
  humidityPct: number | null;
  entryId: string;
  source: "manual" | "logger";
}

export interface MergedSeries {
  samples: MergedSample[];
  /** Readings at the same instant as another, left out (the newer entry's reading is kept). */
  duplicates: number;
  /** Entries that went in (the parts of an import count one each). */
  entries: number;
}

/**
 * One series per crate. Entries are append-only, so a reading recorded again (a file imported twice,
 * a manual reading typed at a logger's instant) is a correction: the newest recorded one wins.
 */
export function mergeTemperatureEntries(
  entries: readonly TemperatureEntryLike[],
  crateId: string,
): MergedSeries {
  const mine = entries.filter((e) => e.crateId === crateId && e.data.kind === "temperatures");
  const all: (MergedSample & { recordedAt: string })[] = [];
  for (const e of mine) {
    if (e.data.kind !== "temperatures") continue;
    for (const s of e.data.samples)
      all.push({
        atS: Date.parse(s.at) / 1000,
        celsius: s.celsius,
        humidityPct: s.humidityPct,
        entryId: e.id,
        source: e.data.source,
        recordedAt: e.recordedAt,
      });
  }
  all.sort(
    (a, b) =>
      a.atS - b.atS ||
      b.recordedAt.localeCompare(a.recordedAt) ||
      b.entryId.localeCompare(a.entryId),
  );
  const samples: MergedSample[] = [];
  let duplicates = 0;
  for (const { recordedAt: _recordedAt, ...s } of all) {
    if (samples.length > 0 && samples[samples.length - 1]?.atS === s.atS) duplicates++;
    else samples.push(s);
  }
  return { samples, duplicates, entries: mine.length };
}

/**
 * Longer intervals are gaps, never bridged: ten typical sampling intervals (the median), and at
 * least an hour so that sparse manual readings still join up.
 */
export function gapThresholdS(timesS: readonly number[]): number {
  const steps = timesS.slice(1).map((t, i) => t - (timesS[i] ?? t));
  if (steps.length === 0) return 3600;
  const sorted = [...steps].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  const median =
    sorted.length % 2 === 1
      ? (sorted[mid] ?? 0)
      : ((sorted[mid - 1] ?? 0) + (sorted[mid] ?? 0)) / 2;
  return Math.max(10 * median, 3600);
}

export function seriesStatistics(
  samples: readonly MergedSample[],
  band: TemperatureBand,
): { statistics: TemperatureStatistics; maxGapS: number } | null {
  if (samples.length === 0 || !(band.maxC > band.minC)) return null;
  const timeS = samples.map((s) => s.atS);
  const maxGapS = gapThresholdS(timeS);
  const statistics = temperatureStatistics(
    { timeS, temperatureC: samples.map((s) => s.celsius) },
    band,
    { maxGapS },
  );
  return { statistics, maxGapS };
}

/** uPlot's columns: x (Unix s), band min, band max, the temperature, readings outside the band (else null). */
export type ChartColumns = [number[], number[], number[], (number | null)[], (number | null)[]];

/**
 * The chart's columns. A gap longer than maxGapS gets an empty point halfway, so the line breaks
 * there as the statistics do instead of bridging it.
 */
export function toChartColumns(
  samples: readonly MergedSample[],
  band: TemperatureBand,
  maxGapS = Infinity,
): ChartColumns {
  const columns: ChartColumns = [[], [], [], [], []];
  const push = (x: number, c: number | null) => {
    const outside = c !== null && (c < band.minC || c > band.maxC);
    columns[0].push(x);
    columns[1].push(band.minC);
    columns[2].push(band.maxC);
    columns[3].push(c);
    columns[4].push(outside ? c : null);
  };
  let previous: number | null = null;
  for (const s of samples) {
    if (previous !== null && s.atS - previous > maxGapS) push((previous + s.atS) / 2, null);
    push(s.atS, s.celsius);
    previous = s.atS;
  }
  return columns;
}

/** "3:07" for 3 h 7 min (seconds rounded to the minute). */
export function formatHoursMinutes(durationS: number): string {
  const minutes = Math.round(durationS / 60);
  return `${Math.floor(minutes / 60)}:${String(minutes % 60).padStart(2, "0")}`;
}
