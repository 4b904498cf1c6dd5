import { and, asc, eq, isNull } from "drizzle-orm";
import type { Queryable } from "../client";
import { idTaken } from "./taken-ids";
import { crates } from "../schema";

export type CrateRow = typeof crates.$inferSelect;

export const listCrates = (q: Queryable, campaignId: string) =>
  q
    .select()
    .from(crates)
    .where(and(eq(crates.campaignId, campaignId), isNull(crates.deletedAt)))
    .orderBy(asc(crates.label));

/** A crate of this campaign that has not been deleted. */
export const findCrate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(crates)
      .where(and(eq(crates.campaignId, campaignId), eq(crates.id, id), isNull(crates.deletedAt)))
      .limit(1)
  )[0];

/** Any campaign, deleted or not: the crate's row locked, so writes to it are ordered. */
export const findCrateForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(crates)
      .where(and(eq(crates.campaignId, campaignId), eq(crates.id, id)))
      .for("update")
      .limit(1)
  )[0];

/** Any campaign: a client-made id that already exists anywhere is refused. */
export const crateIdTaken = (q: Queryable, id: string) => idTaken(q, crates, id);

export async function insertCrate(
  q: Queryable,
  row: typeof crates.$inferInsert,
): Promise<CrateRow> {
  const [inserted] = await q.insert(crates).values(row).returning();
  if (!inserted) throw new Error("insert into crates returned no row");
  return inserted;
}

export async function updateCrate(
  q: Queryable,
  campaignId: string,
  id: string,
  patch: Partial<typeof crates.$inferInsert>,
): Promise<CrateRow> {
  const [updated] = await q
    .update(crates)
    .set(patch)
    .where(and(eq(crates.campaignId, campaignId), eq(crates.id, id)))
    .returning();
  if (!updated) throw new Error("update of crates returned no row");
  return updated;
}

// Deleted crates are included: tablets pull the tombstone and stop offering the crate.
