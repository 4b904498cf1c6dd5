// One campaign table as CSV: the database's columns in schema order, each person's name beside
// their id, JSON values as JSON text, timestamps as ISO 8601 UTC.
import Papa from "papaparse";
import {
  archiveRowSchemas,
  heightTables,
  type ArchiveTable,
} from "../../../shared/schemas/campaign-archive";
import { officialHeightsCaution } from "../../../shared/schemas/comparison";
import { adjustmentView } from "../../../shared/schemas/height-network";
import { isUserColumn } from "../../db/repositories/archive-spec";
import type { JsonRow } from "../../db/repositories/campaign-export";

type Cell = string | number | boolean | null;

// The audit trail reads as who, when, from which device, what, on which record, before and after.
const auditColumns = [
  "user_name",
  "user_id",
  "at",
  "client_id",
  "action",
  "entity",
  "entity_id",
  "before",
  "after",
];

// The full adjustment is in campaign.json; the CSV keeps what a reader compares between runs.
const adjustmentColumns = [
  "id",
  "created_at",
  "computed_by",
  "computed_by_name",
  "sigma_per_sqrt_km_mm",
  "significance",
  "excluded_count",
  "dof",
  "sigma0",
  "global_test_passed",
  "observation_count",
  "flagged_count",
  "unconnected",
  "points",
];

function columnsOf(table: ArchiveTable): string[] {
  if (table === "audit_events") return auditColumns;
  if (table === "levelling_adjustments") return adjustmentColumns;
  const columns: string[] = [];
  for (const column of Object.keys(archiveRowSchemas[table].shape)) {
    columns.push(column);
    if (isUserColumn(column)) columns.push(`${column.replace(/_id$/, "")}_name`);
  }
  return columns;
}

function toCell(value: unknown): Cell {
  if (value === null || value === undefined) return null;
  if (typeof value === "string" || typeof value === "number" || typeof value === "boolean")
    return value;
  return JSON.stringify(value);
}

function adjustmentSummary(row: JsonRow): JsonRow {
  const parsed = adjustmentView.safeParse(row.result);
  if (!parsed.success) return row;
  const view = parsed.data;
  return {
    ...row,
    sigma_per_sqrt_km_mm: view.options.sigmaPerSqrtKmMm,
    significance: view.options.significance,
    excluded_count: view.options.excluded.length,
    dof: view.dof,
    sigma0: view.sigma0,
    global_test_passed: view.globalTest?.passed ?? null,
    observation_count: view.observations.length,
    flagged_count: view.observations.filter((o) => o.flagged).length,
    unconnected: view.unconnected.join(" "),
    points: view.points.map((p) => ({
      mark: p.mark,
      heightM: p.heightM,
      sigmaM: p.sigmaM,
      fixed: p.fixed,
    })),
  };
}

function withNames(row: JsonRow, names: ReadonlyMap<string, string>): JsonRow {
  const out: JsonRow = { ...row };
  for (const [column, value] of Object.entries(row)) {
    if (!isUserColumn(column)) continue;
    out[`${column.replace(/_id$/, "")}_name`] =
      typeof value === "string" ? (names.get(value) ?? "") : "";
  }
  return out;
}

/**
 * The CSV text. Tables with heights end with a `caution` column holding the official-heights
 * statement on every row: visible in a spreadsheet, and the file stays plain, strict CSV.
 * Text beginning with = + - @ is prefixed with ' so a spreadsheet never runs it as a formula.
 */
export function tableCsv(
  table: ArchiveTable,
  rows: readonly JsonRow[],
  names: ReadonlyMap<string, string>,
): string {
  const columns = columnsOf(table);
  const caution = heightTables.includes(table);
  const fields = caution ? [...columns, "caution"] : columns;
  const data = rows.map((raw) => {
    const row = withNames(table === "levelling_adjustments" ? adjustmentSummary(raw) : raw, names);
    const cells = columns.map((c) => toCell(row[c]));
    return caution ? [...cells, officialHeightsCaution] : cells;
  });
  return Papa.unparse({ fields, data }, { escapeFormulae: true, newline: "\r\n" });
}

/** Person ids named by any user column of these rows. */
export function userIdsOf(rows: readonly JsonRow[]): string[] {
  const ids = new Set<string>();
  for (const row of rows)
    for (const [column, value] of Object.entries(row))
      if (isUserColumn(column) && typeof value === "string") ids.add(value);
  return [...ids];
}

/** `equipot-<campaign>-<what>-<yyyy-mm-dd>.<ext>`, ASCII letters, digits and hyphens only. */
export function exportFileName(campaignName: string, what: string, ext: string, now: Date) {
  const slug = campaignName
    .normalize("NFKD")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 40)
    .replace(/-+$/, "");
  const stem = ["equipot", slug, what.replace(/_/g, "-"), now.toISOString().slice(0, 10)];
  return `${stem.filter(Boolean).join("-")}.${ext}`;
}
