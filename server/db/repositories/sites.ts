import { and, asc, eq, isNull } from "drizzle-orm";
import type { Queryable } from "../client";
import { sites } from "../schema";

export type SiteRow = typeof sites.$inferSelect;
export type SiteInsert = typeof sites.$inferInsert;

export const listSites = async (q: Queryable, campaignId: string) =>
  q
    .select()
    .from(sites)
    .where(and(eq(sites.campaignId, campaignId), isNull(sites.deletedAt)))
    .orderBy(asc(sites.name));

export const findSiteForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(sites)
      .where(and(eq(sites.campaignId, campaignId), eq(sites.id, id)))
      .for("update")
      .limit(1)
  )[0];

/** Any campaign: used to refuse a client-made id that already belongs elsewhere. */
export const findSiteAnywhere = async (q: Queryable, id: string) =>
  (
    await q
      .select({ id: sites.id, campaignId: sites.campaignId })
      .from(sites)
      .where(eq(sites.id, id))
      .limit(1)
  )[0];

export async function insertSite(q: Queryable, row: SiteInsert): Promise<SiteRow> {
  const [inserted] = await q.insert(sites).values(row).returning();
  if (!inserted) throw new Error("insert into sites returned no row");
  return inserted;
}

export async function updateSite(
  q: Queryable,
  id: string,
  patch: Partial<SiteInsert>,
): Promise<SiteRow> {
  const [updated] = await q.update(sites).set(patch).where(eq(sites.id, id)).returning();
  if (!updated) throw new Error("update of sites returned no row");
  return updated;
}
