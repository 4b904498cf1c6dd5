// Client-made ids must be unique across campaigns, but row-level security hides other campaigns'
// rows. equipot_taken_ids() (drizzle/0009_row_security.sql) answers only which ids exist, nothing else.
import { getTableName, sql } from "drizzle-orm";
import type { PgTable } from "drizzle-orm/pg-core";
import type { Queryable } from "../client";

/** Which of these ids a row of `table` already has, in any campaign (as PostgreSQL spells them). */
export async function takenIds(q: Queryable, table: PgTable, ids: string[]): Promise<Set<string>> {
  if (ids.length === 0) return new Set();
  const { rows } = await q.execute<{ id: string }>(
    sql`select id from equipot_taken_ids(${getTableName(table)}::regclass, ${sql.param(ids)}::uuid[]) as t(id)`,
  );
  return new Set(rows.map((r) => r.id));
}

export const idTaken = async (q: Queryable, table: PgTable, id: string) =>
  (await takenIds(q, table, [id])).size > 0;
