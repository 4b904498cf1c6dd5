// Handovers of a crate's custody (append-only); every query is scoped by campaign except the id
// check.
import { and, desc, eq, getTableColumns } from "drizzle-orm";
import type { Queryable } from "../client";
import { idTaken } from "./taken-ids";
import { handovers, users } from "../schema";

export type HandoverRecord = typeof handovers.$inferSelect;
/** A stored handover with the name of whoever recorded it, as the pull and the presenter take it. */
export type HandoverRow = HandoverRecord & { recordedByName: string | null };

const withRecorder = { ...getTableColumns(handovers), recordedByName: users.name };

/** Any campaign: a client-made id that already exists anywhere is refused. */
export const handoverIdTaken = (q: Queryable, id: string) => idTaken(q, handovers, id);

export const findHandover = async (
  q: Queryable,
  campaignId: string,
  id: string,
): Promise<HandoverRow | undefined> =>
  (
    await q
      .select(withRecorder)
      .from(handovers)
      .leftJoin(users, eq(users.id, handovers.recordedBy))
      .where(and(eq(handovers.campaignId, campaignId), eq(handovers.id, id)))
      .limit(1)
  )[0];

/** The newest link of a crate's custody chain (the caller holds the crate's row lock). */
export const latestHandoverOfCrate = async (q: Queryable, campaignId: string, crateId: string) =>
  (
    await q
      .select()
      .from(handovers)
      .where(and(eq(handovers.campaignId, campaignId), eq(handovers.crateId, crateId)))
      .orderBy(desc(handovers.at), desc(handovers.changeSeq))
      .limit(1)
  )[0];

export async function insertHandover(
  q: Queryable,
  row: typeof handovers.$inferInsert,
): Promise<HandoverRecord> {
  const [inserted] = await q.insert(handovers).values(row).returning();
  if (!inserted) throw new Error("insert into handovers returned no row");
  return inserted;
}
