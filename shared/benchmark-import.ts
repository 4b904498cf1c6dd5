// Benchmarks from a file: CSV rows or GeoJSON Point features into benchmarkFields, every bad row
// kept with its line (CSV, the header is line 1) or feature number, the field and zod's message.
// Pure: the same checks run wherever the file is read.
import Papa from "papaparse";
import { z } from "zod";
import { benchmarkFields, type BenchmarkFields, type ImportRowError } from "./schemas/benchmarks";

export type BenchmarkFileFormat = "csv" | "geojson";
export type ImportedBenchmark = z.output<typeof benchmarkFields> & { row: number };
export type BenchmarkFileResult =
  | { ok: true; benchmarks: ImportedBenchmark[] }
  | { ok: false; errors: ImportRowError[]; errorCount: number };

/** A few thousand marks at most: a campaign ties to tens; the JSON body limit is near anyway. */
export const maxBenchmarkRows = 5000;
/** The first problems are listed; the count says how many there were in all. */
export const keptImportErrors = 200;

/** Asks to save the file again: what a spreadsheet calls "CSV UTF-8" is what Equipot reads. */
export const saveAsUtf8 = "save the file as UTF-8 and import again";

/**
 * Text that arrived from bytes which were not UTF-8. A decoder turns each such byte into U+FFFD;
 * a UTF-16 file also brings NUL characters (and its byte-order mark, FF FE, as two U+FFFD). Each
 * line with a bad byte is one error at that line; `fieldAt` names the column it lies in. Without
 * it (GeoJSON, whose rows count features) the error is the file's and the message names the line.
 */
export function textEncodingErrors(
  text: string,
  fieldAt?: (line: string, index: number) => string,
): ImportRowError[] {
  if (text.includes("\u0000") || text.startsWith("\uFFFD\uFFFD")) {
    const message = `The file is UTF-16 text (or not text); ${saveAsUtf8}`;
    return [{ row: fieldAt ? 1 : 0, field: "file", message }];
  }
  if (!text.includes("\uFFFD")) return [];
  const errors: ImportRowError[] = [];
  text.split(/\r\n|\n|\r/).forEach((line, i) => {
    const at = line.indexOf("\uFFFD");
    if (at < 0) return;
    const what = `not valid UTF-8 text at character ${at + 1}; ${saveAsUtf8}`;
    errors.push(
      fieldAt
        ? { row: i + 1, field: fieldAt(line, at), message: `N${what.slice(1)}` }
        : { row: 0, field: "file", message: `Line ${i + 1}: ${what}` },
    );
  });
  return errors;
}

/** Where JSON.parse stopped, from its message (engines word it differently), or null. */
export function jsonErrorAt(
  text: string,
  error: unknown,
): { line: number; column: number; atEnd: boolean } | null {
  const message = error instanceof Error ? error.message : "";
  const lineColumn = /line (\d+) column (\d+)/.exec(message);
  const position = /position (\d+)/.exec(message);
  let at: number | null = null;
  if (lineColumn) {
    const lines = text.split(/\r\n|\n|\r/).slice(0, Number(lineColumn[1]) - 1);
    at = lines.reduce((n, l) => n + l.length + 1, 0) + Number(lineColumn[2]) - 1;
  } else if (position) at = Number(position[1]);
  else if (/end of (JSON )?(input|data)/i.test(message)) at = text.length;
  if (at === null) return null;
  const before = text.slice(0, at).split(/\r\n|\n|\r/);
  const column = (before.at(-1)?.length ?? 0) + 1;
  return { line: before.length, column, atEnd: at >= text.trimEnd().length };
}

export const benchmarkColumns = [
  "code",
  "description",
  "latitude_deg",
  "longitude_deg",
  "height_m",
  "height_sigma_mm",
  "height_sigma_m",
  "height_system",
  "datum",
  "source",
] as const;
type Column = (typeof benchmarkColumns)[number];
const requiredColumns: Column[] = [
  "code",
  "latitude_deg",
  "longitude_deg",
  "height_m",
  "height_system",
];

/** The file's column for each field of benchmarkFields, so errors name what the user wrote. */
const columnOfField: Record<keyof BenchmarkFields, Column> = {
  code: "code",
  description: "description",
  latitudeDeg: "latitude_deg",
  longitudeDeg: "longitude_deg",
  heightM: "height_m",
  heightSigmaM: "height_sigma_m",
  heightSystem: "height_system",
  datum: "datum",
  source: "source",
};

type RawRow = Partial<Record<Column, unknown>>;

/** "12.5" → 12.5; "" → undefined (zod: "must be a number"); words → NaN (the same message). */
function toNumber(value: unknown, decimalComma: boolean): unknown {
  if (typeof value !== "string") return value;
  const trimmed = value.trim();
  if (trimmed === "") return undefined;
  const normal =
    decimalComma && /^[-+]?\d*,\d+$/.test(trimmed) ? trimmed.replace(",", ".") : trimmed;
  return /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(normal) ? Number(normal) : Number.NaN;
}

const toText = (value: unknown) =>
  value === undefined || value === null
    ? undefined
    : typeof value === "number"
      ? String(value)
      : value;

function sigmaM(raw: RawRow, decimalComma: boolean): { value: unknown; column: Column } | string {
  const mm = toNumber(raw.height_sigma_mm, decimalComma);
  const m = toNumber(raw.height_sigma_m, decimalComma);
  if (mm !== undefined && m !== undefined)
    return "Give height_sigma_mm or height_sigma_m, not both";
  if (mm !== undefined)
    return { value: typeof mm === "number" ? mm / 1000 : mm, column: "height_sigma_mm" };
  if (m !== undefined) return { value: m, column: "height_sigma_m" };
  return "Height uncertainty is required (height_sigma_mm or height_sigma_m)";
}

/** One row or feature through benchmarkFields; each zod issue becomes a row error. */
export function checkBenchmarkRow(
  raw: RawRow,
  row: number,
  decimalComma = false,
): { benchmark: ImportedBenchmark } | { errors: ImportRowError[] } {
  const sigma = sigmaM(raw, decimalComma);
  if (typeof sigma === "string")
    return { errors: [{ row, field: "height_sigma_mm", message: sigma }] };
  const parsed = benchmarkFields.safeParse({
    code: toText(raw.code),
    description: toText(raw.description),
    latitudeDeg: toNumber(raw.latitude_deg, decimalComma),
    longitudeDeg: toNumber(raw.longitude_deg, decimalComma),
    heightM: toNumber(raw.height_m, decimalComma),
    heightSigmaM: sigma.value,
    heightSystem: toText(raw.height_system),
    datum: toText(raw.datum),
    source: toText(raw.source),
  });
  if (parsed.success) return { benchmark: { ...parsed.data, row } };
  return {
    errors: parsed.error.issues.map((issue) => {
      const key = issue.path[0] as keyof BenchmarkFields | undefined;
      const column = key === undefined ? "row" : columnOfField[key];
      return {
        row,
        field: column === "height_sigma_m" ? sigma.column : column,
        message: issue.message,
      };
    }),
  };
}

/** Semicolon when the header has more of them than commas (spreadsheets set to a decimal comma). */
function delimiterOf(text: string): "," | ";" {
  const header = text.split(/\r\n|\n|\r/, 1)[0] ?? "";
  const count = (c: string) => header.split(c).length - 1;
  return count(";") > count(",") ? ";" : ",";
}

/** Line of each character offset, counting forward only (quoted fields may span lines). */
function lineCounter(text: string) {
  let pos = 0;
  let line = 1;
  return (index: number) => {
    for (; pos < index && pos < text.length; pos++) {
      const c = text.charCodeAt(pos);
      if (c === 10 || (c === 13 && text.charCodeAt(pos + 1) !== 10)) line++;
    }
    return line;
  };
}

/** Rows read from the file with their line or feature number; `fatal` when the file as a whole is wrong. */
interface ReadRows {
  rows: { raw: RawRow; row: number }[];
  errors: ImportRowError[];
  fatal: boolean;
}
const fatal = (errors: ImportRowError[]): ReadRows => ({ rows: [], errors, fatal: true });

interface CsvRecord {
  line: number;
  cells: string[];
  /** A quote opened and never closed: the file was cut short, or a quote is stray. */
  unclosed: boolean;
}

function readCsvRecords(text: string, delimiter: string): CsvRecord[] {
  const lineOf = lineCounter(text);
  const records: CsvRecord[] = [];
  let start = 0;
  Papa.parse<string[]>(text, {
    delimiter,
    skipEmptyLines: false,
    step(results) {
      let first = start;
      while (text[first] === "\n" || text[first] === "\r") first++;
      start = results.meta.cursor;
      const cells = results.data;
      if (cells.every((c) => c.trim() === "")) return;
      const unclosed = results.errors.some((e) => e.code === "MissingQuotes");
      records.push({ line: lineOf(first), cells, unclosed });
    },
  });
  return records;
}

function headerProblems(header: string[]): ImportRowError[] {
  const errors: ImportRowError[] = [];
  for (const column of requiredColumns) {
    if (!header.includes(column))
      errors.push({ row: 1, field: column, message: `The column "${column}" is missing` });
  }
  if (!header.includes("height_sigma_mm") && !header.includes("height_sigma_m"))
    errors.push({
      row: 1,
      field: "height_sigma_mm",
      message: 'The column "height_sigma_mm" (or "height_sigma_m") is missing',
    });
  const seen = new Set<string>();
  for (const name of header) {
    if (name !== "" && seen.has(name))
      errors.push({ row: 1, field: name, message: `The column "${name}" appears twice` });
    seen.add(name);
  }
  return errors;
}

function rowsFromCsv(content: string): ReadRows {
  const text = content.replace(/^\uFEFF/, "");
  const delimiter = delimiterOf(text);
  const records = readCsvRecords(text, delimiter);
  const head = records[0];
  if (!head) return fatal([{ row: 1, field: "file", message: "The file has no header line" }]);
  const header = head.cells.map((h) => h.trim().toLowerCase());
  const problems = headerProblems(header);
  if (problems.length > 0) return fatal(problems);
  const known = new Set<string>(benchmarkColumns);
  const read: ReadRows = { rows: [], errors: [], fatal: false };
  // A last line without its line break and with too few columns: the file was cut short.
  const last = records.at(-1);
  const cutShort = last !== head && /[^\r\n]$/.test(text);
  for (const record of records.slice(1)) {
    if (record.unclosed) {
      const message = "A quoted value is not closed (is the file complete?)";
      read.errors.push({ row: record.line, field: "row", message });
      continue;
    }
    if (record === last && cutShort && record.cells.length < header.length) {
      const message = `The last line is cut short: ${record.cells.length} of ${header.length} columns (is the file complete?)`;
      read.errors.push({ row: record.line, field: "row", message });
      continue;
    }
    const raw: RawRow = {};
    header.forEach((name, i) => {
      if (known.has(name)) raw[name as Column] = record.cells[i] ?? "";
    });
    read.rows.push({ raw, row: record.line });
  }
  return read;
}

const isRecord = (v: unknown): v is Record<string, unknown> =>
  typeof v === "object" && v !== null && !Array.isArray(v);

function featureToRow(feature: unknown, n: number): { raw: RawRow } | { error: ImportRowError } {
  if (!isRecord(feature) || feature.type !== "Feature")
    return {
      error: { row: n, field: "feature", message: "Each entry of features must be a Feature" },
    };
  const geometry = feature.geometry;
  if (!isRecord(geometry) || geometry.type !== "Point" || !Array.isArray(geometry.coordinates))
    return { error: { row: n, field: "geometry", message: "The geometry must be a Point" } };
  const [lon, lat] = geometry.coordinates as unknown[];
  const raw: RawRow = { longitude_deg: lon, latitude_deg: lat };
  const properties = isRecord(feature.properties) ? feature.properties : {};
  const known = new Set<string>(benchmarkColumns);
  for (const [key, value] of Object.entries(properties)) {
    const name = key.trim().toLowerCase();
    if (known.has(name) && name !== "latitude_deg" && name !== "longitude_deg")
      raw[name as Column] = value;
  }
  return { raw };
}

function rowsFromGeoJson(content: string): ReadRows {
  const text = content.replace(/^\uFEFF/, "");
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (error) {
    const at = jsonErrorAt(text, error);
    const where =
      at === null
        ? ""
        : at.atEnd
          ? `: it ends early, at line ${at.line}, column ${at.column} (is the file complete?)`
          : ` at line ${at.line}, column ${at.column}`;
    return fatal([{ row: 0, field: "file", message: `The file is not valid JSON${where}` }]);
  }
  if (!isRecord(data) || data.type !== "FeatureCollection" || !Array.isArray(data.features))
    return fatal([
      { row: 0, field: "file", message: "The file must be a GeoJSON FeatureCollection" },
    ]);
  const read: ReadRows = { rows: [], errors: [], fatal: false };
  data.features.forEach((feature: unknown, i: number) => {
    const shaped = featureToRow(feature, i + 1);
    if ("error" in shaped) read.errors.push(shaped.error);
    else read.rows.push({ raw: shaped.raw, row: i + 1 });
  });
  return read;
}

/** Bad bytes, each at its line and, in a CSV, under its column's name from the header. */
function encodingErrorsOf(format: BenchmarkFileFormat, content: string): ImportRowError[] {
  const text = content.replace(/^\uFEFF/, "");
  if (format === "geojson") return textEncodingErrors(text);
  const delimiter = delimiterOf(text);
  const header = (text.split(/\r\n|\n|\r/, 1)[0] ?? "")
    .split(delimiter)
    .map((h) => h.trim().toLowerCase());
  return textEncodingErrors(text, (line, index) => {
    const column = line.slice(0, index).split(delimiter).length - 1;
    return header[column] || "row";
  });
}

const codeKey = (code: string) => code.toLowerCase();

/** Every row checked; any problem means no benchmarks, only the errors in file order. */
export function readBenchmarkFile(
  format: BenchmarkFileFormat,
  content: string,
): BenchmarkFileResult {
  const broken = encodingErrorsOf(format, content);
  if (broken.length > 0)
    return { ok: false, errors: broken.slice(0, keptImportErrors), errorCount: broken.length };
  const read = format === "csv" ? rowsFromCsv(content) : rowsFromGeoJson(content);
  if (read.fatal) return { ok: false, errors: read.errors, errorCount: read.errors.length };
  const errors = [...read.errors];
  const total = read.rows.length + errors.length;
  if (total === 0) {
    const row = format === "csv" ? 1 : 0;
    return {
      ok: false,
      errors: [{ row, field: "file", message: "The file has no benchmarks" }],
      errorCount: 1,
    };
  }
  if (total > maxBenchmarkRows) {
    const message = `The file has ${total} benchmarks; at most ${maxBenchmarkRows} can be imported at once`;
    return { ok: false, errors: [{ row: 0, field: "file", message }], errorCount: 1 };
  }
  const decimalComma = format === "csv" && delimiterOf(content) === ";";
  const benchmarks: ImportedBenchmark[] = [];
  const firstRowOfCode = new Map<string, number>();
  read.rows.forEach(({ raw, row }) => {
    const checked = checkBenchmarkRow(raw, row, decimalComma);
    if ("errors" in checked) {
      errors.push(...checked.errors);
      return;
    }
    const key = codeKey(checked.benchmark.code);
    const earlier = firstRowOfCode.get(key);
    if (earlier !== undefined) {
      const where = format === "csv" ? `line ${earlier}` : `feature ${earlier}`;
      errors.push({
        row,
        field: "code",
        message: `Code "${checked.benchmark.code}" is also on ${where}`,
      });
      return;
    }
    firstRowOfCode.set(key, row);
    benchmarks.push(checked.benchmark);
  });
  if (errors.length > 0) {
    errors.sort((a, b) => a.row - b.row);
    return { ok: false, errors: errors.slice(0, keptImportErrors), errorCount: errors.length };
  }
  return { ok: true, benchmarks };
}

/** Case does not make a different mark: "kr-01" and "KR-01" are one code. */
export const sameBenchmarkCode = (a: string, b: string) => codeKey(a) === codeKey(b);
