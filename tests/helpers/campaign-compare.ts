// Compares two campaigns record by record, straight from PostgreSQL: every table, every column,
// ids and references through the map that pairs source rows with imported rows.
import { expect } from "vitest";
import { archiveTables, type ArchiveTable } from "../../shared/schemas/campaign-archive";
import type { TestContext } from "./app";

type Row = Record<string, unknown>;

const uuidLike = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const isUserColumn = (c: string) => c === "user_id" || c.endsWith("_by");

export async function countRows(ctx: TestContext, table: string, campaignId: string) {
  const r = await ctx.database.pool.query<{ n: number }>(
    `select count(*)::int as n from ${table} where campaign_id = $1`,
    [campaignId],
  );
  return r.rows[0]?.n ?? -1;
}

/** Rows of every table (all campaigns) and the campaigns: a refused import must change none. */
export async function countAll(ctx: TestContext) {
  const counts: Record<string, number> = {};
  for (const t of [...archiveTables, "campaigns", "memberships", "comparison_chunks"]) {
    const r = await ctx.database.pool.query<{ n: number }>(`select count(*)::int as n from ${t}`);
    counts[t] = r.rows[0]?.n ?? -1;
  }
  return counts;
}

async function rowsOf(ctx: TestContext, table: ArchiveTable, campaignId: string): Promise<Row[]> {
  const order = table === "audit_events" ? "t.id" : "1";
  const r = await ctx.database.pool.query<{ row: Row }>(
    `select to_jsonb(t) - 'campaign_id' as row from ${table} t where t.campaign_id = $1 order by ${order}`,
    [campaignId],
  );
  return r.rows.map((x) => x.row);
}

/** Everything but ids, so that a source row and its copy sort alike. */
function signature(value: unknown): string {
  const strip = (v: unknown): unknown => {
    if (typeof v === "string") return uuidLike.test(v) ? "~" : v;
    if (Array.isArray(v)) return v.map(strip);
    if (v !== null && typeof v === "object")
      return Object.fromEntries(
        Object.entries(v)
          .filter(([k]) => k !== "id" && k !== "change_seq" && k !== "reviewed_seq")
          .sort(([a], [b]) => a.localeCompare(b))
          .map(([k, x]) => [k, strip(x)]),
      );
    return v;
  };
  return JSON.stringify(strip(value));
}

function sortForPairing(table: ArchiveTable, rows: Row[]): Row[] {
  if (table === "audit_events") return rows;
  return [...rows].sort((a, b) => {
    const bySeq = Number(a.change_seq ?? 0) - Number(b.change_seq ?? 0);
    return bySeq !== 0 ? bySeq : signature(a).localeCompare(signature(b));
  });
}

function mapDeep(value: unknown, ids: ReadonlyMap<string, string>): unknown {
  if (typeof value === "string") return ids.get(value) ?? value;
  if (Array.isArray(value)) return value.map((v) => mapDeep(v, ids));
  if (value !== null && typeof value === "object")
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, mapDeep(v, ids)]));
  return value;
}

function compareRow(table: string, i: number, src: Row, dst: Row, maps: Maps) {
  expect(Object.keys(dst).sort(), `${table}[${i}] columns`).toEqual(Object.keys(src).sort());
  for (const [column, value] of Object.entries(src)) {
    const at = `${table}[${i}].${column}`;
    if (column === "id" && table !== "audit_events") {
      expect(dst.id, at).toBe(maps.ids.get(String(value)));
      expect(dst.id, at).not.toBe(value);
    } else if (column === "id" || column === "storage_key") continue;
    else if (column === "change_seq" || column === "reviewed_seq")
      expect(dst[column], at).toBe(maps.seqs.get(Number(value)));
    else if (isUserColumn(column)) expect(dst[column], at).toEqual(value);
    else expect(dst[column], at).toEqual(mapDeep(value, maps.ids));
  }
}

interface Maps {
  ids: Map<string, string>;
  seqs: Map<number, number>;
}

/** The imported campaign holds the source's records: same count, same values, references remapped. */
export async function compareCampaigns(ctx: TestContext, sourceId: string, copyId: string) {
  const maps: Maps = { ids: new Map([[sourceId, copyId]]), seqs: new Map() };
  const pairs: [ArchiveTable, Row[], Row[]][] = [];
  for (const table of archiveTables) {
    const src = sortForPairing(table, await rowsOf(ctx, table, sourceId));
    let dst = sortForPairing(table, await rowsOf(ctx, table, copyId));
    // The import records itself in the new campaign's trail.
    if (table === "audit_events") dst = dst.filter((r) => r.action !== "import");
    expect(dst.length, `${table} rows`).toBe(src.length);
    src.forEach((row, i) => {
      const copy = dst[i] ?? {};
      if (typeof row.id === "string" && typeof copy.id === "string") maps.ids.set(row.id, copy.id);
      if (typeof row.change_seq === "number" && typeof copy.change_seq === "number")
        maps.seqs.set(row.change_seq, copy.change_seq);
    });
    pairs.push([table, src, dst]);
  }
  // Positions are fresh from the new campaign's counter (1, 2, …) and keep their order.
  const seqs = [...maps.seqs].sort((a, b) => a[0] - b[0]).map(([, v]) => v);
  expect(seqs).toEqual(seqs.map((_, i) => i + 1));
  const counter = await ctx.database.pool.query<{ change_seq: string }>(
    `select change_seq from campaigns where id = $1`,
    [copyId],
  );
  expect(Number(counter.rows[0]?.change_seq)).toBe(seqs.length);
  for (const [table, src, dst] of pairs)
    src.forEach((row, i) => compareRow(table, i, row, dst[i] ?? {}, maps));
  await compareChunks(ctx, sourceId, maps.ids);
}

async function compareChunks(ctx: TestContext, sourceId: string, ids: ReadonlyMap<string, string>) {
  const r = await ctx.database.pool.query<{
    file_id: string;
    chunk_no: number;
    times: number[];
    values: number[];
  }>(
    `select c.file_id, c.chunk_no, c.times, c.values from comparison_chunks c
     join comparison_files f on f.id = c.file_id where f.campaign_id = $1 order by c.file_id, c.chunk_no`,
    [sourceId],
  );
  expect(r.rows.length).toBeGreaterThan(0);
  for (const chunk of r.rows) {
    const copy = await ctx.database.pool.query<{ times: number[]; values: number[] }>(
      `select times, values from comparison_chunks where file_id = $1 and chunk_no = $2`,
      [ids.get(chunk.file_id), chunk.chunk_no],
    );
    expect(copy.rows[0]?.times).toEqual(chunk.times);
    expect(copy.rows[0]?.values).toEqual(chunk.values);
  }
}
