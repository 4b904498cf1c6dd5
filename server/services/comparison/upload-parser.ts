// The shared series parser, fed from bytes, with a fast path for the common row. Every line the
// fast path declines (headers, comments, offsets, bad rows…) is decoded and read by the shared
// parser, which keeps its own say on what is good and words every error. The shared parser only
// remembers the last good time between rows, so before it reads a line after fast rows it is
// shown the last fast row again (a replay, left out of the counts).
import {
  createSeriesParser,
  type SeriesParserOptions,
  type SeriesSample,
} from "../../../shared/comparison";
import type { SeriesRowError } from "../../../shared/schemas/comparison";
import { fastSample, readFastRow, type FastLayout } from "./fast-row";

export interface UploadParser {
  /** The sample of a data line, in fastSample's shape; null for other lines and bad rows. */
  line(buf: Buffer, start: number, end: number, lineNo: number): SeriesSample | null;
  readonly errors: SeriesRowError[];
  readonly badRows: number;
  readonly rows: number;
  readonly validRows: number;
}

// The shared parser's rules for the first line that is not blank or a comment.
const TIME_NAMES = /^(time|timestamp|datetime|date|utc|epoch|t)\b/i;
const MJD_NAMES = /^mjd\b/i;
const VALID_NAMES = /^(valid|validity|flag|ok)\b/i;
const SEPARATORS = { "\t": 0x09, ";": 0x3b, ",": 0x2c } as const;

/**
 * The fast layout for the file whose first content line is `trimmed`, or null when the file's
 * columns are anything but time, value and an optional flag in that order, or the separator is
 * spaces. Erring towards null only costs speed.
 */
export function fastLayoutOf(trimmed: string): FastLayout | null {
  const sepText = trimmed.includes("\t")
    ? "\t"
    : trimmed.includes(";")
      ? ";"
      : trimmed.includes(",")
        ? ","
        : null;
  if (sepText === null) return null;
  const sep = SEPARATORS[sepText];
  const parts = trimmed.split(sepText).map((p) => p.trim());
  const first = parts[0] ?? "";
  // No header: time, value, flag by position.
  if (/^[+-]?[\d.]/.test(first)) return { sep, flagColumn: true };
  const names = parts.map((n) => n.replace(/^"|"$/g, ""));
  if (names.some((n) => MJD_NAMES.test(n)) || !TIME_NAMES.test(names[0] ?? "")) return null;
  const second = names[1] ?? "";
  if (VALID_NAMES.test(second) || TIME_NAMES.test(second)) return null;
  if (names.length === 2) return { sep, flagColumn: false };
  if (names.length === 3 && VALID_NAMES.test(names[2] ?? "")) return { sep, flagColumn: true };
  return null;
}

type Layout = FastLayout | "undecided" | "off";

export function createUploadParser(options: SeriesParserOptions): UploadParser {
  const shared = createSeriesParser(options);
  // A ratio file needs exact decimals: it goes the shared way throughout.
  let layout: Layout = options.valueKind === "fractional" ? "undecided" : "off";
  let lastT = -Infinity;
  let fastRows = 0;
  let fastValid = 0;
  let replayRows = 0;
  let replayValid = 0;
  // The last fast row, not yet shown to the shared parser (scalars: no allocation per row).
  let unseenBuf: Buffer | null = null;
  let unseenStart = 0;
  let unseenEnd = 0;

  function replay() {
    if (unseenBuf === null) return;
    const rows = shared.rows;
    const valid = shared.validRows;
    const bad = shared.badRows;
    shared.line(unseenBuf.toString("utf8", unseenStart, unseenEnd), 0);
    if (shared.badRows !== bad) throw new Error("unreachable: a fast row refused on replay");
    replayRows += shared.rows - rows;
    replayValid += shared.validRows - valid;
    unseenBuf = null;
  }

  function sharedLine(text: string, lineNo: number): SeriesSample | null {
    replay();
    const sample = shared.line(text, lineNo);
    if (sample !== null) lastT = sample.t;
    return sample;
  }

  return {
    line(buf, start, end, lineNo) {
      if (typeof layout === "object") {
        if (readFastRow(buf, start, end, layout, lastT)) {
          lastT = fastSample.t;
          fastRows++;
          if (!Number.isNaN(fastSample.y)) fastValid++;
          unseenBuf = buf;
          unseenStart = start;
          unseenEnd = end;
          return fastSample;
        }
        return sharedLine(buf.toString("utf8", start, end), lineNo);
      }
      const text = buf.toString("utf8", start, end);
      if (layout === "undecided") {
        const trimmed = text.trim();
        if (trimmed !== "" && !trimmed.startsWith("#")) layout = fastLayoutOf(trimmed) ?? "off";
      }
      return sharedLine(text, lineNo);
    },
    get errors() {
      return shared.errors;
    },
    get badRows() {
      return shared.badRows;
    },
    get rows() {
      return shared.rows - replayRows + fastRows;
    },
    get validRows() {
      return shared.validRows - replayValid + fastValid;
    },
  };
}
