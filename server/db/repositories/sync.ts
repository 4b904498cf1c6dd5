import { and, asc, between, eq } from "drizzle-orm";
import type { Queryable } from "../client";
import { conflicts, syncClients, syncRejections } from "../schema";

export type SyncClientRow = typeof syncClients.$inferSelect;
export type ConflictRow = typeof conflicts.$inferSelect;

/** Registers the client to the user on first sight; locks its row for the rest of the transaction. */
export async function lockSyncClient(
  q: Queryable,
  clientId: string,
  userId: string,
): Promise<SyncClientRow> {
  await q.insert(syncClients).values({ id: clientId, userId }).onConflictDoNothing();
  const [row] = await q
    .select()
    .from(syncClients)
    .where(eq(syncClients.id, clientId))
    .for("update");
  if (!row) throw new Error("sync client row vanished");
  return row;
}

export const findSyncClient = async (q: Queryable, clientId: string) =>
  (await q.select().from(syncClients).where(eq(syncClients.id, clientId)).limit(1))[0];

export async function advanceSyncClient(q: Queryable, clientId: string, lastMutationId: number) {
  await q
    .update(syncClients)
    .set({ lastMutationId, lastSeenAt: new Date() })
    .where(eq(syncClients.id, clientId));
}

export async function recordRejection(q: Queryable, row: typeof syncRejections.$inferInsert) {
  await q.insert(syncRejections).values(row);
}

/** Several refusals in one INSERT; their ids follow the order given. */
export async function recordRejections(
  q: Queryable,
  rows: (typeof syncRejections.$inferInsert)[],
): Promise<void> {
  if (rows.length === 0) return;
  await q.insert(syncRejections).values(rows);
}

/** The client's refused mutations in an id range, oldest first (one client's own record). */
export const rejectionsBetween = (q: Queryable, clientId: string, from: number, to: number) =>
  q
    .select({ mutationId: syncRejections.mutationId, reason: syncRejections.reason })
    .from(syncRejections)
    .where(and(eq(syncRejections.clientId, clientId), between(syncRejections.mutationId, from, to)))
    .orderBy(asc(syncRejections.mutationId));

export async function insertConflict(
  q: Queryable,
  row: typeof conflicts.$inferInsert,
): Promise<ConflictRow> {
  const [inserted] = await q.insert(conflicts).values(row).returning();
  if (!inserted) throw new Error("insert into conflicts returned no row");
  return inserted;
}

export const findConflictForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(conflicts)
      .where(and(eq(conflicts.campaignId, campaignId), eq(conflicts.id, id)))
      .for("update")
      .limit(1)
  )[0];

export async function updateConflict(
  q: Queryable,
  id: string,
  patch: Partial<typeof conflicts.$inferInsert>,
) {
  await q.update(conflicts).set(patch).where(eq(conflicts.id, id));
}
