// Writes for the archive import: a new campaign and its rows, unpacked by PostgreSQL from one JSON
// parameter per batch. Table and column names come from the shared schemas' constant keys.
import { and, eq, sql } from "drizzle-orm";
import type { ArchiveTable } from "../../../shared/schemas/campaign-archive";
import type { Queryable } from "../client";
import { campaigns, memberships } from "../schema";

export type ImportTable = ArchiveTable | "comparison_chunks";

/** Rows per statement stay below this much JSON text, so one parameter never grows unbounded. */
const batchChars = 8_000_000;

function batches(rows: readonly Record<string, unknown>[]): string[] {
  const out: string[] = [];
  let parts: string[] = [];
  let size = 0;
  for (const row of rows) {
    const text = JSON.stringify(row);
    if (size + text.length > batchChars && parts.length > 0) {
      out.push(`[${parts.join(",")}]`);
      parts = [];
      size = 0;
    }
    parts.push(text);
    size += text.length + 1;
  }
  if (parts.length > 0) out.push(`[${parts.join(",")}]`);
  return out;
}

/** Inserts rows in the order given (audit ids keep the trail's order). */
export async function insertRows(
  q: Queryable,
  table: ImportTable,
  columns: readonly string[],
  rows: readonly Record<string, unknown>[],
): Promise<void> {
  const cols = sql.join(
    columns.map((c) => sql.identifier(c)),
    sql`, `,
  );
  for (const json of batches(rows)) {
    await q.execute(sql`
      insert into ${sql.identifier(table)} (${cols})
      select ${cols} from jsonb_populate_recordset(null::${sql.identifier(table)}, ${json}::jsonb)
        with ordinality
      order by ordinality`);
  }
}

export async function insertCampaignWithAdmin(
  q: Queryable,
  campaign: { id: string; name: string; description: string },
  adminUserId: string,
) {
  await q.insert(campaigns).values(campaign);
  await q.insert(memberships).values({
    campaignId: campaign.id,
    userId: adminUserId,
    role: "admin",
  });
}

export async function isAdminOfAnyCampaign(q: Queryable, userId: string): Promise<boolean> {
  const rows = await q
    .select({ campaignId: memberships.campaignId })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.role, "admin")))
    .limit(1);
  return rows.length > 0;
}

/** The ids among these that are accounts on this server. */
export async function existingUserIds(q: Queryable, ids: readonly string[]): Promise<Set<string>> {
  if (ids.length === 0) return new Set();
  const result = await q.execute<{ id: string }>(
    sql`select id from users where id = any(${`{${ids.join(",")}}`}::uuid[])`,
  );
  return new Set(result.rows.map((r) => r.id));
}
