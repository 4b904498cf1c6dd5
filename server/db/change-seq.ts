// Positions in a campaign's change stream, handed out in commit order.
//
// The pull reads "everything after cursor N". With a plain sequence, a transaction that took
// position 10 but commits after the one that took 11 would be skipped by a reader that already saw
// 11. Here the position comes from the campaign's counter row, whose row lock is held until the
// writing transaction ends: the next writer of the campaign waits, so positions become visible in
// order and a reader always sees a gap-free prefix. Writers of one campaign serialise on that lock;
// writers of different campaigns do not.
import { eq, sql } from "drizzle-orm";
import type { Queryable } from "./client";
import { campaigns } from "./schema";

export const nextChangeSeq = (q: Queryable, campaignId: string): Promise<number> =>
  takeChangeSeqs(q, campaignId, 1);

/**
 * `count` consecutive positions in one UPDATE, under the same row lock: returns the first, the
 * others follow it. For a run of writes in one transaction, the same positions as one at a time.
 */
export async function takeChangeSeqs(
  q: Queryable,
  campaignId: string,
  count: number,
): Promise<number> {
  const [row] = await q
    .update(campaigns)
    .set({ changeSeq: sql`${campaigns.changeSeq} + ${count}` })
    .where(eq(campaigns.id, campaignId))
    .returning({ seq: campaigns.changeSeq });
  if (!row) throw new Error(`campaign ${campaignId} not found for a change position`);
  return row.seq - count + 1;
}

/**
 * Takes the campaign's counter lock now, before any row of the campaign is locked: every writer
 * then locks in the same order (counter, then rows), so two writers of one campaign queue instead
 * of deadlocking. A campaign that is missing or out of scope locks nothing.
 */
export async function lockChangeStream(q: Queryable, campaignId: string): Promise<void> {
  await q
    .select({ id: campaigns.id })
    .from(campaigns)
    .where(eq(campaigns.id, campaignId))
    .for("update");
}
