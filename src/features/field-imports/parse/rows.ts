// One CSV row to one reading, with every problem named by what it is and its value. The caller
// prefixes the line number. Ranges are the shared ones (fieldEntryLimits).
import {
  fieldEntryLimits,
  type ShockEventInput,
  type TemperatureSample,
} from "../../../../shared/schemas/field-entries";
import type { ColumnMapping, ShockColumns, TemperatureColumns } from "./mapping";
import { parseTime } from "./time";
import {
  accelerationUnitLabels,
  temperatureUnitLabels,
  toCelsius,
  toG,
  type AccelerationUnit,
  type TemperatureUnit,
} from "./units";

export type Row = Record<string, string | undefined>;

const pointNumber = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;
const commaNumber = /^[-+]?(\d+,?\d*|,\d+)(e[-+]?\d+)?$/i;

/** A number as the file writes it; NaN when it is not one (a dot in a decimal-comma file too). */
export function parseNumber(text: string, decimalSeparator: "." | ","): number {
  const v = text.trim().replace(/^\u2212/, "-");
  if (decimalSeparator === ",") return commaNumber.test(v) ? Number(v.replace(",", ".")) : NaN;
  return pointNumber.test(v) ? Number(v) : NaN;
}

/** Converted values keep 0.1 m°C / 0.1 mg: far below any logger's resolution, shorter to store. */
const tidy = (v: number) => Math.round(v * 1e4) / 1e4;
const shown = (v: number) => String(Number(v.toFixed(2)));
const range = ({ min, max }: { min: number; max: number }, unit: string) =>
  `${String(min).replace("-", "−")} … ${max} ${unit}`;

type Value<T> = { value: T } | { problem: string };

function readValue(
  row: Row,
  column: string,
  what: string,
  decimalSeparator: "." | ",",
): Value<number | null> {
  const text = (row[column] ?? "").trim();
  if (text === "") return { value: null };
  const n = parseNumber(text, decimalSeparator);
  return Number.isFinite(n) ? { value: n } : { problem: `${what} "${text}" is not a number` };
}

function inRange(
  what: string,
  raw: number,
  converted: number,
  limits: { min: number; max: number },
  fileUnit: string,
  unit: string,
): string | null {
  if (converted >= limits.min && converted <= limits.max) return null;
  const value =
    fileUnit === unit
      ? `${shown(raw)} ${unit}`
      : `${shown(raw)} ${fileUnit} (${shown(converted)} ${unit})`;
  return `${what} ${value} is outside ${range(limits, unit)}`;
}

export interface RowOutcome<T> {
  reading: T | null;
  /** The row's time in ms when it could be read (for the order check), else null. */
  timeMs: number | null;
  problems: string[];
}

function readTime(row: Row, mapping: ColumnMapping, problems: string[]): number | null {
  const text = (row[mapping.time.column] ?? "").trim();
  if (text === "") {
    problems.push("time is empty");
    return null;
  }
  const t = parseTime(text, mapping.time.format, mapping.time.utcOffsetMinutes);
  if (!t.ok) {
    problems.push(`time "${text}" ${t.reason}`);
    return null;
  }
  return t.ms;
}

function temperature(
  row: Row,
  columns: TemperatureColumns,
  decimal: "." | ",",
  problems: string[],
): { celsius: number | null; humidityPct: number | null } {
  const unit: TemperatureUnit = columns.temperatureUnit;
  const t = readValue(row, columns.temperature, "temperature", decimal);
  let celsius: number | null = null;
  if ("problem" in t) problems.push(t.problem);
  else if (t.value === null) problems.push("temperature is empty");
  else {
    celsius = unit === "degC" ? t.value : tidy(toCelsius(t.value, unit));
    const out = inRange(
      "temperature",
      t.value,
      celsius,
      fieldEntryLimits.temperatureC,
      temperatureUnitLabels[unit],
      "°C",
    );
    if (out !== null) problems.push(out);
  }
  let humidityPct: number | null = null;
  if (columns.humidity !== null) {
    const h = readValue(row, columns.humidity, "humidity", decimal);
    if ("problem" in h) problems.push(h.problem);
    else if (h.value !== null) {
      humidityPct = h.value;
      const out = inRange("humidity", h.value, h.value, fieldEntryLimits.humidityPct, "%", "%");
      if (out !== null) problems.push(out);
    }
  }
  return { celsius, humidityPct };
}

export function readTemperatureRow(
  row: Row,
  mapping: ColumnMapping,
): RowOutcome<TemperatureSample> {
  const columns = mapping.values as TemperatureColumns;
  const problems: string[] = [];
  const timeMs = readTime(row, mapping, problems);
  const { celsius, humidityPct } = temperature(row, columns, mapping.decimalSeparator, problems);
  const reading =
    problems.length === 0 && timeMs !== null && celsius !== null
      ? { at: new Date(timeMs).toISOString(), celsius, humidityPct }
      : null;
  return { reading, timeMs, problems };
}

function peak(
  row: Row,
  column: string | null,
  axis: string,
  unit: AccelerationUnit,
  decimal: "." | ",",
  problems: string[],
): number | null {
  if (column === null) return null;
  const v = readValue(row, column, `peak ${axis}`, decimal);
  if ("problem" in v) {
    problems.push(v.problem);
    return null;
  }
  if (v.value === null) return null;
  const peakG = unit === "g" ? v.value : tidy(toG(v.value, unit));
  const out = inRange(
    `peak ${axis}`,
    v.value,
    peakG,
    fieldEntryLimits.shockG,
    accelerationUnitLabels[unit],
    "g",
  );
  if (out !== null) problems.push(out);
  return peakG;
}

export function readShockRow(row: Row, mapping: ColumnMapping): RowOutcome<ShockEventInput> {
  const columns = mapping.values as ShockColumns;
  const problems: string[] = [];
  const timeMs = readTime(row, mapping, problems);
  const unit = columns.accelerationUnit;
  const d = mapping.decimalSeparator;
  const xG = peak(row, columns.x, "x", unit, d, problems);
  const yG = peak(row, columns.y, "y", unit, d, problems);
  const zG = peak(row, columns.z, "z", unit, d, problems);
  if (xG === null && yG === null && zG === null && problems.length === 0)
    problems.push("no peak on any axis");
  let durationMs: number | null = null;
  if (columns.duration !== null) {
    const v = readValue(row, columns.duration, "duration", d);
    if ("problem" in v) problems.push(v.problem);
    else if (v.value !== null) {
      durationMs = v.value;
      const out = inRange("duration", v.value, v.value, fieldEntryLimits.durationMs, "ms", "ms");
      if (out !== null) problems.push(out);
    }
  }
  const reading =
    problems.length === 0 && timeMs !== null
      ? { at: new Date(timeMs).toISOString(), xG, yG, zG, durationMs }
      : null;
  return { reading, timeMs, problems };
}
