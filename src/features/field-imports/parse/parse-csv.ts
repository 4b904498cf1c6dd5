// Reads a logger CSV with a mapping: every row checked, every problem kept with its line number as
// in the file (the header is line 1 unless a preamble precedes it). One bad row means nothing is
// imported, so the result always carries all readings or says why not.
import Papa from "papaparse";
import type { ShockEventInput, TemperatureSample } from "../../../../shared/schemas/field-entries";
import { columnMapping, mappedColumns, type ColumnMapping } from "./mapping";
import { readShockRow, readTemperatureRow, type Row } from "./rows";

export interface LineError {
  /** Line in the file, or null for a problem with the whole file or the mapping. */
  line: number | null;
  text: string;
}

export type Readings =
  | { kind: "temperatures"; samples: TemperatureSample[] }
  | { kind: "shock-log"; events: ShockEventInput[] };

export type ParsedFile = Readings & {
  /** Data rows read (empty lines left out). */
  rows: number;
  /** The first problems (at most keptErrors), and how many there were in all. */
  errors: LineError[];
  errorCount: number;
};

export interface ParseProgress {
  doneChars: number;
  totalChars: number;
}

/** Five thousand per entry, at most forty entries from one file. */
export const maxReadingsPerFile = 200_000;
const keptErrors = 200;
const rowsPerSlice = 2000;

const replacementChar = "\uFFFD";

/** Counts lines forward only, so the whole file is scanned once. */
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

function startOfLine(text: string, lineNumber: number): number | null {
  let index = 0;
  for (let line = 1; line < lineNumber; line++) {
    const next = text.slice(index).search(/\r\n|\n|\r/);
    if (next < 0) return null;
    index += next + (text.startsWith("\r\n", index + next) ? 2 : 1);
  }
  return index;
}

const emptyResult = (kind: ColumnMapping["values"]["kind"], errors: LineError[]): ParsedFile =>
  kind === "temperatures"
    ? { kind, samples: [], rows: 0, errors, errorCount: errors.length }
    : { kind, events: [], rows: 0, errors, errorCount: errors.length };

function readHeader(body: string, mapping: ColumnMapping, headerLine: number): LineError[] {
  const headers = (
    Papa.parse<string[]>(body, { delimiter: mapping.delimiter, preview: 1 }).data[0] ?? []
  ).map((h) => h.trim());
  return mappedColumns(mapping)
    .filter(({ name }) => !headers.includes(name))
    .map(({ role, name }) => ({
      line: headerLine,
      text: `Line ${headerLine}: the ${role} column "${name}" is not in the header (columns: ${headers.join(", ")})`,
    }));
}

function fieldCountProblem(
  results: Papa.ParseStepResult<Row>,
  expected: number,
  isLast: boolean,
): string | null {
  const codes = results.errors.map((e) => e.code);
  if (codes.length === 0) return null;
  const found =
    Object.keys(results.data).filter((k) => k !== "__parsed_extra").length +
    (Array.isArray(results.data.__parsed_extra) ? results.data.__parsed_extra.length : 0);
  if (isLast && (codes.includes("MissingQuotes") || codes.includes("TooFewFields")))
    return "the last line is cut short (is the file complete?)";
  if (codes.includes("MissingQuotes")) return "a quoted value is not closed";
  return `expected ${expected} columns, found ${found}`;
}

type Body = { text: string; headerAt: number; body: string } | { errors: LineError[] };

/** The mapping (zod), an empty file, a missing header line or mapped columns it does not have. */
function preflight(input: string, mapping: ColumnMapping): Body {
  const checked = columnMapping.safeParse(mapping);
  if (!checked.success)
    return {
      errors: checked.error.issues.map((i) => ({ line: null, text: `Mapping: ${i.message}` })),
    };
  const text = input.replace(/^\uFEFF/, "");
  if (text.trim() === "") return { errors: [{ line: null, text: "The file is empty" }] };
  // UTF-16 (its byte-order mark decodes as two U+FFFD, and every other byte is a NUL).
  if (text.startsWith("\uFFFD\uFFFD") || text.includes("\u0000"))
    return {
      errors: [
        { line: 1, text: "Line 1: the file is UTF-16 text (or not text); save it as UTF-8" },
      ],
    };
  const headerAt = startOfLine(text, mapping.headerLine);
  if (headerAt === null)
    return {
      errors: [
        {
          line: null,
          text: `The file ends before line ${mapping.headerLine}, where the header should be`,
        },
      ],
    };
  const body = text.slice(headerAt);
  const errors = readHeader(body, mapping, mapping.headerLine);
  return errors.length > 0 ? { errors } : { text, headerAt, body };
}

/** Checks rows one by one, keeping the readings while no row has failed. */
function rowChecker(result: ParsedFile, mapping: ColumnMapping) {
  let previous: { ms: number; line: number } | null = null;
  const add = (line: number, problem: string) => {
    result.errorCount++;
    if (result.errors.length < keptErrors)
      result.errors.push({ line, text: `Line ${line}: ${problem}` });
  };
  return (results: Papa.ParseStepResult<Row>, line: number, isLast: boolean) => {
    const values = Object.values(results.data).flat();
    if (values.some((v) => typeof v === "string" && v.includes(replacementChar)))
      return add(line, "the file is not valid UTF-8 text");
    const countProblem = fieldCountProblem(results, results.meta.fields?.length ?? 0, isLast);
    if (countProblem !== null) return add(line, countProblem);
    if (result.kind === "temperatures") {
      const row = readTemperatureRow(results.data, mapping);
      for (const p of row.problems) add(line, p);
      if (row.timeMs !== null) {
        if (previous !== null && row.timeMs <= previous.ms)
          add(
            line,
            `time ${new Date(row.timeMs).toISOString()} is not after the previous reading's (line ${previous.line})`,
          );
        previous = { ms: row.timeMs, line };
      }
      if (row.reading !== null && result.errorCount === 0) result.samples.push(row.reading);
    } else {
      const row = readShockRow(results.data, mapping);
      for (const p of row.problems) add(line, p);
      if (row.reading !== null && result.errorCount === 0) result.events.push(row.reading);
    }
  };
}

const tooMany: LineError = {
  line: null,
  text: `The file has more than ${maxReadingsPerFile.toLocaleString("en-GB")} readings: split it and import the parts`,
};

/** The mapping is checked first (zod); a bad one gives errors naming the field and no readings. */
export async function parseLoggerText(
  input: string,
  mapping: ColumnMapping,
  onProgress?: (progress: ParseProgress) => void,
): Promise<ParsedFile> {
  const kind = mapping.values.kind;
  const ready = preflight(input, mapping);
  if ("errors" in ready) return emptyResult(kind, ready.errors);
  const { text, headerAt, body } = ready;
  const lineOf = lineCounter(text);
  const result = emptyResult(kind, []);
  const check = rowChecker(result, mapping);
  // Data rows start after the header line (a header never spans lines in a logger file).
  let cursor = startOfLine(body, 2) ?? body.length;
  // After a pause papaparse goes on with the rest of the text, its cursor counting from there.
  let base = 0;

  await new Promise<void>((resolve) => {
    Papa.parse<Row>(body, {
      header: true,
      skipEmptyLines: true,
      delimiter: mapping.delimiter,
      transformHeader: (h) => h.trim(),
      step(results, parser) {
        let start = cursor;
        while (body[start] === "\n" || body[start] === "\r") start++;
        cursor = base + results.meta.cursor;
        if (++result.rows > maxReadingsPerFile) {
          result.errorCount++;
          result.errors.push(tooMany);
          parser.abort();
          return;
        }
        check(results, lineOf(headerAt + start), cursor >= body.length);
        if (result.rows % rowsPerSlice === 0) {
          // Let the page repaint the progress bar between slices.
          onProgress?.({ doneChars: headerAt + cursor, totalChars: text.length });
          parser.pause();
          base = cursor;
          setTimeout(() => parser.resume(), 0);
        }
      },
      complete: () => resolve(),
    });
  });
  onProgress?.({ doneChars: text.length, totalChars: text.length });
  if (result.rows === 0 && result.errorCount === 0)
    return emptyResult(kind, [{ line: null, text: "The file has a header but no readings" }]);
  if (result.errorCount > 0)
    return {
      ...emptyResult(kind, result.errors),
      rows: result.rows,
      errorCount: result.errorCount,
    };
  return result;
}
