// Field entries (append-only); every query is scoped by campaign except the id check.
import { and, eq, getTableColumns, sql } from "drizzle-orm";
import type { Queryable } from "../client";
import { idTaken } from "./taken-ids";
import { fieldEntries, users } from "../schema";

export type FieldEntryRecord = typeof fieldEntries.$inferSelect;
/** A stored entry with its author's name, as the pull and the presenter take it. */
export type FieldEntryRow = FieldEntryRecord & { recordedByName: string | null };

const withAuthor = { ...getTableColumns(fieldEntries), recordedByName: users.name };

/** Any campaign: a client-made id that already exists anywhere is refused. */
export const entryIdTaken = (q: Queryable, id: string) => idTaken(q, fieldEntries, id);

export const findEntry = async (
  q: Queryable,
  campaignId: string,
  id: string,
): Promise<FieldEntryRow | undefined> =>
  (
    await q
      .select(withAuthor)
      .from(fieldEntries)
      .leftJoin(users, eq(users.id, fieldEntries.recordedBy))
      .where(and(eq(fieldEntries.campaignId, campaignId), eq(fieldEntries.id, id)))
      .limit(1)
  )[0];

export async function insertEntry(
  q: Queryable,
  row: typeof fieldEntries.$inferInsert,
): Promise<FieldEntryRecord> {
  const [inserted] = await q.insert(fieldEntries).values(row).returning();
  if (!inserted) throw new Error("insert into field_entries returned no row");
  return inserted;
}

/** The dew-point entries that name this checklist run (data.runId), for the unpacking gate. */
export const dewPointEntriesOfRun = (q: Queryable, campaignId: string, runId: string) =>
  q
    .select({ data: fieldEntries.data })
    .from(fieldEntries)
    .where(
      and(
        eq(fieldEntries.campaignId, campaignId),
        eq(fieldEntries.kind, "dew-point"),
        sql`${fieldEntries.data}->>'runId' = ${runId}`,
      ),
    );
