// Reads for exports: every row of a campaign table as JSON with the database's column names.
// Table names and orders come from archive-spec.ts constants only.
import { sql } from "drizzle-orm";
import type { ArchiveTable } from "../../../shared/schemas/campaign-archive";
import { tableSpecs } from "./archive-spec";
import type { Db, Queryable, Tx } from "../client";

export type JsonRow = Record<string, unknown>;

// PostgreSQL writes timestamps in JSON with the session's offset; the reads run in UTC and the
// offset is written as Z, the usual ISO 8601 spelling of UTC.
const utcOffset = /^(\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(?:\.\d+)?)\+00:00$/;
const normaliseTimes = (row: JsonRow): JsonRow =>
  Object.fromEntries(
    Object.entries(row).map(([k, v]) => [
      k,
      typeof v === "string" ? v.replace(utcOffset, "$1Z") : v,
    ]),
  );

/** One consistent, read-only snapshot in UTC for everything an export reads. */
export function withExportSnapshot<T>(db: Db, read: (tx: Tx) => Promise<T>): Promise<T> {
  return db.transaction(
    async (tx) => {
      await tx.execute(sql`set local time zone 'UTC'`);
      return read(tx);
    },
    { isolationLevel: "repeatable read", accessMode: "read only" },
  );
}

export async function readTableRows(
  q: Queryable,
  campaignId: string,
  table: ArchiveTable,
): Promise<JsonRow[]> {
  const spec = tableSpecs[table];
  const omit = `{${spec.omit.join(",")}}`;
  const result = await q.execute<{ row: JsonRow }>(sql`
    select to_jsonb(t) - ${omit}::text[] as row
    from ${sql.identifier(table)} t
    where t.campaign_id = ${campaignId}
    order by ${sql.raw(spec.orderBy)}`);
  return result.rows.map((r) => normaliseTimes(r.row));
}

export async function readCampaign(q: Queryable, campaignId: string) {
  const result = await q.execute<{ id: string; name: string; description: string }>(
    sql`select id, name, description from campaigns where id = ${campaignId}`,
  );
  const row = result.rows[0];
  if (!row) throw new Error(`campaign ${campaignId} not found for an export`);
  return row;
}

export async function readUserNames(q: Queryable, ids: readonly string[]) {
  if (ids.length === 0) return new Map<string, string>();
  const result = await q.execute<{ id: string; name: string }>(
    sql`select id, name from users where id = any(${`{${ids.join(",")}}`}::uuid[]) order by name`,
  );
  return new Map(result.rows.map((r) => [r.id, r.name]));
}

/** Bytes one archive would gather: attachments plus 16 bytes per series sample. */
export async function estimateArchiveBytes(q: Queryable, campaignId: string): Promise<number> {
  const result = await q.execute<{ bytes: string | null }>(sql`
    select (select coalesce(sum(size_bytes), 0) from attachments where campaign_id = ${campaignId})
      + 16 * (select coalesce(sum(row_count), 0) from comparison_files
              where campaign_id = ${campaignId}) as bytes`);
  return Number(result.rows[0]?.bytes ?? 0);
}

/** The series chunks of one file, in order. */
export async function readChunksOfFile(q: Queryable, campaignId: string, fileId: string) {
  const result = await q.execute<{ row: JsonRow }>(sql`
    select to_jsonb(c) as row
    from comparison_chunks c join comparison_files f on f.id = c.file_id
    where f.campaign_id = ${campaignId} and c.file_id = ${fileId}
    order by c.chunk_no`);
  return result.rows.map((r) => r.row);
}
