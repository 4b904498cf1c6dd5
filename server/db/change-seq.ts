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

export async function nextChangeSeq(q: Queryable, campaignId: string): Promise<number> {
  const [row] = await q
    .update(campaigns)
    .set({ changeSeq: sql`${campaigns.changeSeq} + 1` })
    .where(eq(campaigns.id, campaignId))
    .returning({ seq: campaigns.changeSeq });
  if (!row) throw new Error(`campaign ${campaignId} not found for a change position`);
  return row.seq;
}
