// A crate's legs (planned once, then departed, arrived or cancelled); every query is scoped by
// campaign except the id check.
import { and, eq } from "drizzle-orm";
import type { Queryable } from "../client";
import { idTaken } from "./taken-ids";
import { legs } from "../schema";

export type LegRow = typeof legs.$inferSelect;

/** Any campaign: a client-made id that already exists anywhere is refused. */
export const legIdTaken = (q: Queryable, id: string) => idTaken(q, legs, id);

export const findLeg = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(legs)
      .where(and(eq(legs.campaignId, campaignId), eq(legs.id, id)))
      .limit(1)
  )[0];

/** Locks the leg, so two tablets recording the same step are ordered and the later one is a no-op. */
export const findLegForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(legs)
      .where(and(eq(legs.campaignId, campaignId), eq(legs.id, id)))
      .for("update")
      .limit(1)
  )[0];

export async function insertLeg(q: Queryable, row: typeof legs.$inferInsert): Promise<LegRow> {
  const [inserted] = await q.insert(legs).values(row).returning();
  if (!inserted) throw new Error("insert into legs returned no row");
  return inserted;
}

export async function updateLeg(
  q: Queryable,
  id: string,
  patch: Partial<typeof legs.$inferInsert>,
): Promise<LegRow> {
  const [updated] = await q.update(legs).set(patch).where(eq(legs.id, id)).returning();
  if (!updated) throw new Error("update of legs returned no row");
  return updated;
}
