// A first guess of the mapping from the start of a file: where the header is, the delimiter, which
// column is which (by name, case-insensitive), the time format and the units. The user checks it.
import Papa from "papaparse";
import type { ColumnMapping, Delimiter, ImportKind, TimeFormat } from "./mapping";
import type { AccelerationUnit, TemperatureUnit } from "./units";

export interface Sniffed {
  headerLine: number;
  delimiter: Delimiter;
  headers: string[];
  /** The first few data rows, as text, for the guess and for choosing columns. */
  rows: string[][];
}

const lineBreak = /\r\n|\n|\r/;

function tokens(header: string): string[] {
  return header
    .toLowerCase()
    .replace(/[[(][^\])]*[\])]/g, " ")
    .split(/[^a-z0-9°%]+/)
    .filter((t) => t !== "");
}

function timeScore(header: string): number {
  const t = tokens(header);
  if (t.includes("timestamp") || t.includes("datetime")) return 3;
  if (t.includes("time") || t.includes("zeit")) return 2;
  if (t.includes("date") || t.includes("utc")) return 1;
  return 0;
}

const isTemperature = (h: string) =>
  /°\s?[cf]\b|\bdeg\s?[cf]\b/i.test(h) ||
  tokens(h).some((t) => ["temp", "temperature", "celsius", "fahrenheit", "t"].includes(t));
const isHumidity = (h: string) =>
  /%\s?rh|rh\s?%/i.test(h) || tokens(h).some((t) => ["rh", "humidity", "hum"].includes(t));
const isDuration = (h: string) =>
  tokens(h).some((t) => ["duration", "dur", "ms", "pulse", "width"].includes(t));
const isAxis = (h: string, axis: "x" | "y" | "z") =>
  tokens(h).some(
    (t) =>
      t === axis ||
      new RegExp(`^(acc|accel|peak|axis|a|g)${axis}$`).test(t) ||
      new RegExp(`^${axis}(peak|axis|g|acc)$`).test(t),
  );

function chooseDelimiter(line: string): Delimiter {
  const counts = (["\t", ";", ","] as const).map((d) => ({ d, n: line.split(d).length - 1 }));
  const best = counts.reduce((a, b) => (b.n > a.n ? b : a));
  return best.n > 0 ? best.d : ",";
}

/** Reads the header and a few rows from the beginning of a file (the first 64 kB are plenty). */
export function sniff(start: string): Sniffed {
  const lines = start.replace(/^\uFEFF/, "").split(lineBreak);
  let headerIndex = lines.slice(0, 30).findIndex((line) => {
    const cells = line.split(chooseDelimiter(line));
    return cells.length > 1 && cells.some((cell) => timeScore(cell) > 0);
  });
  if (headerIndex < 0) headerIndex = 0;
  const delimiter = chooseDelimiter(lines[headerIndex] ?? "");
  const parsed = Papa.parse<string[]>(lines.slice(headerIndex, headerIndex + 7).join("\n"), {
    delimiter,
    skipEmptyLines: true,
  });
  const [headers = [], ...rows] = parsed.data;
  return { headerLine: headerIndex + 1, delimiter, headers: headers.map((h) => h.trim()), rows };
}

function guessTimeFormat(sample: string): TimeFormat {
  const v = sample.trim();
  if (/^\d{9,11}([.,]\d+)?$/.test(v)) return "unix-s";
  if (/(z|[+-]\d{2}:?\d{2})$/i.test(v)) return "iso";
  return "local";
}

const pick = (headers: string[], test: (h: string) => boolean) => headers.find(test) ?? null;

/** The mapping Equipot proposes; columns it cannot find are left empty (or null when optional). */
export function guessMapping(
  kind: ImportKind,
  sniffed: Sniffed,
  localOffsetMinutes: number,
): ColumnMapping {
  const { headers, rows } = sniffed;
  const byTime = [...headers].sort((a, b) => timeScore(b) - timeScore(a));
  const timeColumn = byTime[0] !== undefined && timeScore(byTime[0]) > 0 ? byTime[0] : "";
  const timeIndex = headers.indexOf(timeColumn);
  const firstTime = rows[0]?.[timeIndex] ?? "";
  const rest = headers.filter((h) => h !== timeColumn);
  const decimalComma =
    sniffed.delimiter !== "," &&
    rows.some((row) =>
      row.some((cell, i) => i !== timeIndex && /^[-+]?\d+,\d+$/.test(cell.trim())),
    );
  const temperature = pick(rest, isTemperature);
  const temperatureUnit: TemperatureUnit =
    temperature !== null && /°\s?f\b|\bdeg\s?f\b|fahrenheit|[([]f[\])]/i.test(temperature)
      ? "degF"
      : "degC";
  const axes = rest.filter((h) => !isDuration(h));
  const x = pick(axes, (h) => isAxis(h, "x"));
  const accelerationUnit: AccelerationUnit = [x, ...axes].some(
    (h) => h !== null && /m\s?\/\s?s(²|2|\^2)|m\s?s-2|ms\^-2/i.test(h),
  )
    ? "m/s2"
    : "g";
  return {
    headerLine: sniffed.headerLine,
    delimiter: sniffed.delimiter,
    decimalSeparator: decimalComma ? "," : ".",
    time: {
      column: timeColumn,
      format: guessTimeFormat(firstTime),
      utcOffsetMinutes: localOffsetMinutes,
    },
    values:
      kind === "temperatures"
        ? {
            kind,
            temperature: temperature ?? "",
            humidity: pick(rest, isHumidity),
            temperatureUnit,
          }
        : {
            kind,
            x,
            y: pick(axes, (h) => isAxis(h, "y")),
            z: pick(axes, (h) => isAxis(h, "z")),
            duration: pick(rest, isDuration),
            accelerationUnit,
          },
  };
}

/** The header cells on a given line with a given delimiter (after the user changed either). */
export function headersAt(start: string, headerLine: number, delimiter: Delimiter): string[] {
  const line = start.replace(/^\uFEFF/, "").split(lineBreak)[headerLine - 1] ?? "";
  const parsed = Papa.parse<string[]>(line, { delimiter, preview: 1 });
  return (parsed.data[0] ?? []).map((h) => h.trim());
}
