// A file of section height differences: CSV with the columns from, to, dh_m, length_km and an
// optional sigma_mm (header any case, comma or semicolon). Every bad row is kept with its line
// (the header is line 1), the column and zod's message; one bad row and the file is refused.
import Papa from "papaparse";
import { textEncodingErrors } from "../../../shared/benchmark-import";
import { heightTieFields } from "../../../shared/schemas/height-network";

export interface TieRowError {
  row: number;
  field: string;
  message: string;
}

export interface ReadTie {
  line: number;
  fromMark: string;
  toMark: string;
  deltaM: number;
  lengthKm: number;
  sigmaM: number | null;
}

export type TieFileResult =
  { ok: true; ties: ReadTie[] } | { ok: false; errors: TieRowError[]; errorCount: number };

/** A campaign levels tens of sections; the JSON body limit comes first anyway. */
export const maxTieRows = 5000;
/** The first problems are listed; the count says how many there were. */
export const keptTieErrors = 200;

const columns = ["from", "to", "dh_m", "length_km", "sigma_mm"] as const;
type Column = (typeof columns)[number];
const requiredColumns: Column[] = ["from", "to", "dh_m", "length_km"];

const columnOfField: Record<string, Column> = {
  fromMark: "from",
  toMark: "to",
  deltaM: "dh_m",
  lengthKm: "length_km",
  sigmaM: "sigma_mm",
};

/** "12.5" → 12.5; "" → undefined (zod says "must be a number"); words → NaN (the same). */
function toNumber(value: string | undefined, decimalComma: boolean): number | undefined {
  const trimmed = (value ?? "").trim();
  if (trimmed === "") return undefined;
  const normal =
    decimalComma && /^[-+]?\d*,\d+$/.test(trimmed) ? trimmed.replace(",", ".") : trimmed;
  return /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(normal) ? Number(normal) : Number.NaN;
}

function headerErrors(header: string[]): TieRowError[] {
  const errors: TieRowError[] = [];
  for (const name of requiredColumns) {
    if (!header.includes(name))
      errors.push({ row: 1, field: name, message: `The column "${name}" is missing` });
  }
  header.forEach((name, i) => {
    if (name !== "" && !(columns as readonly string[]).includes(name))
      errors.push({
        row: 1,
        field: name,
        message: `Unknown column "${name}" (expected ${columns.join(", ")})`,
      });
    else if (name !== "" && header.indexOf(name) !== i)
      errors.push({ row: 1, field: name, message: `The column "${name}" appears twice` });
  });
  return errors;
}

function readRow(
  cells: string[],
  header: string[],
  line: number,
  decimalComma: boolean,
): ReadTie | TieRowError[] {
  const cell = (name: Column) => {
    const at = header.indexOf(name);
    return at < 0 ? undefined : cells[at];
  };
  const sigmaMm = toNumber(cell("sigma_mm"), decimalComma);
  const parsed = heightTieFields.safeParse({
    fromMark: cell("from") ?? "",
    toMark: cell("to") ?? "",
    deltaM: toNumber(cell("dh_m"), decimalComma),
    lengthKm: toNumber(cell("length_km"), decimalComma),
    sigmaM: sigmaMm === undefined ? null : sigmaMm / 1000,
  });
  if (!parsed.success) {
    return parsed.error.issues.map((issue) => ({
      row: line,
      field: columnOfField[String(issue.path[0])] ?? "row",
      message:
        issue.path[0] === "sigmaM"
          ? issue.message.replace(/ m$/, " m (sigma_mm / 1000)")
          : issue.message,
    }));
  }
  return { line, ...parsed.data };
}

/** From the header: decimal commas in the rows would mislead a guess over the whole file. */
function delimiterOf(text: string): "," | ";" {
  const header = text.split(/\r?\n/, 1)[0] ?? "";
  const count = (c: string) => header.split(c).length - 1;
  return count(";") > count(",") ? ";" : ",";
}

/** Semicolon files often write decimals with a comma; a comma-separated file cannot. */
export function readTieFile(content: string): TieFileResult {
  // A UTF-8 byte-order mark (spreadsheets write one) is dropped; bytes not UTF-8 are refused.
  const text = content.replace(/^\uFEFF/, "");
  const delimiter = delimiterOf(text);
  const names = (text.split(/\r?\n/, 1)[0] ?? "").split(delimiter).map((h) => h.trim());
  const broken = textEncodingErrors(text, (line, index) => {
    const name = names[line.slice(0, index).split(delimiter).length - 1]?.toLowerCase();
    return name && (columns as readonly string[]).includes(name) ? name : "row";
  });
  if (broken.length > 0)
    return { ok: false, errors: broken.slice(0, keptTieErrors), errorCount: broken.length };
  const parsed = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: false });
  const rows = parsed.data;
  // A quote opened and never closed swallows the rest of the file into one cell.
  const unclosed = new Set(
    parsed.errors.filter((e) => e.code === "MissingQuotes").map((e) => e.row ?? -1),
  );
  const cutShort = /[^\r\n]$/.test(text) ? rows.length - 1 : -1;
  const header = (rows[0] ?? []).map((h) => h.trim().toLowerCase());
  const decimalComma = parsed.meta.delimiter === ";";
  const errors = headerErrors(header);
  const ties: ReadTie[] = [];
  rows.slice(1).forEach((cells, i) => {
    const line = i + 2;
    if (cells.every((c) => c.trim() === "")) return;
    if (unclosed.has(i + 1)) {
      const message = "A quoted value is not closed (is the file complete?)";
      errors.push({ row: line, field: "row", message });
      return;
    }
    if (i + 1 === cutShort && cells.length < header.length) {
      const message = `The last line is cut short: ${cells.length} of ${header.length} columns (is the file complete?)`;
      errors.push({ row: line, field: "row", message });
      return;
    }
    const read = readRow(cells, header, line, decimalComma);
    if (Array.isArray(read)) errors.push(...read);
    else ties.push(read);
  });
  if (errors.length === 0 && ties.length === 0)
    errors.push({
      row: 1,
      field: "row",
      message: "The file has no height differences below its header",
    });
  if (ties.length > maxTieRows)
    errors.push({
      row: maxTieRows + 2,
      field: "row",
      message: `At most ${maxTieRows} height differences per file`,
    });
  if (errors.length > 0)
    return { ok: false, errors: errors.slice(0, keptTieErrors), errorCount: errors.length };
  return { ok: true, ties };
}
