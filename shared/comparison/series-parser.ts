// Reads a comparison series line by line (so a file of 10⁷ rows is never held whole): an optional
// header, '#' comments, separator comma, semicolon, tab or runs of spaces; columns time, value and
// an optional validity flag. Bad rows are recorded (the first comparisonLimits.errorsListed) and
// counted, never thrown, so one pass reports every problem.
import { comparisonLimits, type SeriesRowError, type SeriesValueKind } from "../schemas/comparison";
import { fractionalFromRatio, parseExactDecimal, type ExactDecimal } from "./exact-ratio";
import { isPlainNumber, readAnyTime, readIsoTime, readMjdTime, type TimeRead } from "./series-time";

/** DOMAIN.md §3: between two sites on Earth |y| stays below about 1e-12 (≈ 9 km of height). */
export const MAX_ABS_FRACTIONAL = 1e-12;

export interface SeriesSample {
  /** Unix seconds. */
  readonly t: number;
  /** Fractional frequency; NaN for a sample flagged invalid (kept as a gap). */
  readonly y: number;
}

export interface SeriesParserOptions {
  readonly valueKind: SeriesValueKind;
  /** Needed for valueKind "ratio": y = ratio/nominal − 1. */
  readonly nominalRatio?: string;
}

export interface SeriesParser {
  /** The sample of a data line; null for a header, comment or blank line, and for a bad row. */
  line(text: string, lineNo: number): SeriesSample | null;
  readonly errors: SeriesRowError[];
  readonly badRows: number;
  /** Data rows read (good and bad). */
  readonly rows: number;
  /** Good rows flagged valid. */
  readonly validRows: number;
}

type Separator = "," | ";" | "\t" | " ";
type TimeKind = "iso" | "mjd" | "any";

interface Columns {
  time: number;
  value: number;
  valid: number | null;
  timeKind: TimeKind;
  names: { time: string; value: string; valid: string };
  count: number;
}

const POSITIONAL: Columns = {
  time: 0,
  value: 1,
  valid: 2,
  timeKind: "any",
  names: { time: "time", value: "value", valid: "valid" },
  count: 3,
};

const TIME_NAMES = /^(time|timestamp|datetime|date|utc|epoch|t)\b/i;
const MJD_NAMES = /^mjd\b/i;
const VALID_NAMES = /^(valid|validity|flag|ok)\b/i;
const VALUE_NAMES = /^(y|value|fractional|frac|frequency|freq|ratio|offset)/i;

function separatorOf(text: string): Separator {
  if (text.includes("\t")) return "\t";
  if (text.includes(";")) return ";";
  if (text.includes(",")) return ",";
  return " ";
}

function split(text: string, sep: Separator): string[] {
  const parts = sep === " " ? text.split(/ +/) : text.split(sep);
  return parts.map((p) => p.trim());
}

/** A header names columns; a data line starts with a digit (a time or an MJD). */
const looksLikeHeader = (first: string) => !/^[+-]?[\d.]/.test(first);

function columnsFromHeader(names: string[]): Columns | string {
  const clean = names.map((n) => n.replace(/^"|"$/g, ""));
  const mjd = clean.findIndex((n) => MJD_NAMES.test(n));
  const iso = clean.findIndex((n) => TIME_NAMES.test(n));
  const time = mjd >= 0 ? mjd : iso;
  if (time < 0) return "the header names no time column (time, timestamp, utc or mjd)";
  const valid = clean.findIndex((n, i) => i !== time && VALID_NAMES.test(n));
  let value = clean.findIndex((n, i) => i !== time && i !== valid && VALUE_NAMES.test(n));
  if (value < 0) value = clean.findIndex((_, i) => i !== time && i !== valid);
  if (value < 0) return "the header names no value column";
  const name = (i: number) => clean[i] ?? "";
  return {
    time,
    value,
    valid: valid >= 0 ? valid : null,
    timeKind: mjd >= 0 ? "mjd" : "any",
    names: { time: name(time), value: name(value), valid: valid >= 0 ? name(valid) : "valid" },
    count: clean.length,
  };
}

const TIME_READERS: Record<TimeKind, (text: string) => TimeRead> = {
  iso: readIsoTime,
  mjd: readMjdTime,
  any: readAnyTime,
};

function readValidity(text: string): boolean | null {
  switch (text.toLowerCase()) {
    case "1":
    case "true":
    case "valid":
    case "yes":
      return true;
    case "0":
    case "false":
    case "invalid":
    case "no":
      return false;
    default:
      return null;
  }
}

function nominalOf(options: SeriesParserOptions): ExactDecimal | null {
  if (options.valueKind !== "ratio") return null;
  const nominal =
    options.nominalRatio === undefined ? null : parseExactDecimal(options.nominalRatio);
  if (nominal === null || nominal.mantissa <= 0n) {
    throw new RangeError("A frequency-ratio file needs a positive nominal ratio (nominalRatio)");
  }
  return nominal;
}

type Read = { ok: true; sample: SeriesSample } | { ok: false; field: string; message: string };

export function createSeriesParser(options: SeriesParserOptions): SeriesParser {
  const nominal = nominalOf(options);
  const errors: SeriesRowError[] = [];
  let sep: Separator | null = null;
  let columns: Columns | null = null;
  let lastT = -Infinity;
  let rows = 0;
  let badRows = 0;
  let validRows = 0;
  // A UTF-16 file: its first line says so, the others are counted but not listed.
  let utf16 = false;

  function bad(line: number, field: string, message: string): null {
    badRows++;
    if (errors.length < comparisonLimits.errorsListed) errors.push({ line, field, message });
    return null;
  }

  function readValue(text: string, field: string): Read | number {
    if (!isPlainNumber(text)) return { ok: false, field, message: `"${text}" is not a number` };
    let y: number;
    if (nominal === null) y = Number(text);
    else {
      const ratio = parseExactDecimal(text);
      if (ratio === null) return { ok: false, field, message: `"${text}" is not a number` };
      y = fractionalFromRatio(ratio, nominal);
    }
    if (!(Math.abs(y) <= MAX_ABS_FRACTIONAL)) {
      const what = nominal === null ? "" : " (ratio/nominal − 1)";
      return {
        ok: false,
        field,
        message: `fractional frequency${what} ${y.toExponential(3)} is outside ±${MAX_ABS_FRACTIONAL} (about ±9 km of height)`,
      };
    }
    return y;
  }

  function readRow(parts: string[], c: Columns): Read {
    if (parts.length < 2 || (columns === POSITIONAL && parts.length > 3)) {
      return {
        ok: false,
        field: "row",
        message: `expected time, value and an optional validity flag; found ${parts.length} column(s)`,
      };
    }
    const time = TIME_READERS[c.timeKind](parts[c.time] ?? "");
    if (!time.ok) return { ok: false, field: c.names.time, message: time.message };
    if (!(time.t > lastT)) {
      return {
        ok: false,
        field: c.names.time,
        message: "times must increase strictly: this time is not after the previous row's",
      };
    }
    const flagText = c.valid === null ? undefined : parts[c.valid];
    const flag = flagText === undefined || flagText === "" ? true : readValidity(flagText);
    if (flag === null) {
      return {
        ok: false,
        field: c.names.valid,
        message: `"${flagText}" is not a validity flag (1/0, true/false)`,
      };
    }
    if (!flag) return { ok: true, sample: { t: time.t, y: NaN } };
    const value = readValue(parts[c.value] ?? "", c.names.value);
    if (typeof value !== "number") return value;
    return { ok: true, sample: { t: time.t, y: value } };
  }

  return {
    line(text, lineNo) {
      // Bytes that were not UTF-8 reach here as U+FFFD (a UTF-16 file brings NULs as well).
      if (utf16) {
        badRows++;
        return null;
      }
      // A UTF-16 byte-order mark, FF FE or FE FF, decodes as two U+FFFD before anything else.
      if (text.includes("\u0000") || (columns === null && text.startsWith("\uFFFD\uFFFD"))) {
        utf16 = true;
        return bad(lineNo, "file", "the file is UTF-16 text (or not text): save it as UTF-8");
      }
      const broken = text.indexOf("\uFFFD");
      if (broken >= 0) {
        const at = sep === null ? -1 : split(text.slice(0, broken).trimStart(), sep).length - 1;
        const field =
          columns === null
            ? "text"
            : at === columns.time
              ? columns.names.time
              : at === columns.value
                ? columns.names.value
                : at === columns.valid
                  ? columns.names.valid
                  : "text";
        const message = `not valid UTF-8 text at character ${broken + 1}: save the file as UTF-8`;
        return bad(lineNo, field, message);
      }
      const trimmed = text.trim();
      if (trimmed === "" || trimmed.startsWith("#")) return null;
      sep ??= separatorOf(trimmed);
      const parts = split(trimmed, sep);
      if (columns === null) {
        if (looksLikeHeader(parts[0] ?? "")) {
          const found = columnsFromHeader(parts);
          columns = typeof found === "string" ? POSITIONAL : found;
          return typeof found === "string" ? bad(lineNo, "header", found) : null;
        }
        columns = POSITIONAL;
      }
      rows++;
      const read = readRow(parts, columns);
      if (!read.ok) return bad(lineNo, read.field, read.message);
      lastT = read.sample.t;
      if (!Number.isNaN(read.sample.y)) validRows++;
      return read.sample;
    },
    get errors() {
      return errors;
    },
    get badRows() {
      return badRows;
    },
    get rows() {
      return rows;
    },
    get validRows() {
      return validRows;
    },
  };
}
