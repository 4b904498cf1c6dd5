import { and, asc, eq, isNull, sql, type SQLWrapper } from "drizzle-orm";
import type { Queryable } from "../client";
import { takenIds } from "./taken-ids";
import { poolDb, preparedOn } from "../prepared";
import { sites } from "../schema";
import { wellFormed } from "../storable";

export type SiteRow = typeof sites.$inferSelect;
export type SiteInsert = typeof sites.$inferInsert;

const sitesQuery = (q: Queryable, campaignId: SQLWrapper | string) =>
  q
    .select()
    .from(sites)
    .where(and(eq(sites.campaignId, campaignId), isNull(sites.deletedAt)))
    .orderBy(asc(sites.name));

/** The site list, asked by every screen that names sites: prepared once on the pool. */
export const listSites = async (q: Queryable, campaignId: string) => {
  const db = poolDb(q);
  return db
    ? preparedOn(db, "list_sites", (d) =>
        sitesQuery(d, sql.placeholder("campaignId")).prepare("list_sites"),
      ).execute({ campaignId })
    : sitesQuery(q, campaignId);
};

export const findSiteForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(sites)
      .where(and(eq(sites.campaignId, campaignId), eq(sites.id, id)))
      .for("update")
      .limit(1)
  )[0];

/** The site, in any campaign the scope shows: compare its campaign before trusting it. */
export const findSiteAnywhere = async (q: Queryable, id: string) =>
  (
    await q
      .select({ id: sites.id, campaignId: sites.campaignId })
      .from(sites)
      .where(eq(sites.id, id))
      .limit(1)
  )[0];

/** Which of these ids already belong to a site, in any campaign (as PostgreSQL spells them). */
export const takenSiteIds = (q: Queryable, ids: string[]) => takenIds(q, sites, ids);

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

/** What a create writes; the other columns take their defaults. */
export type NewSite = Required<
  Pick<
    SiteInsert,
    | "id"
    | "campaignId"
    | "name"
    | "kind"
    | "latitudeDeg"
    | "longitudeDeg"
    | "approxHeightM"
    | "notes"
    | "updatedBy"
    | "changeSeq"
  >
>;

/**
 * Several sites in one INSERT, read back in change order. The rows travel as one JSON parameter
 * that PostgreSQL unpacks: building a multi-row VALUES through drizzle costs more than the database
 * spends on the insert.
 */
export async function insertSites(q: Queryable, rows: NewSite[]): Promise<SiteRow[]> {
  if (rows.length === 0) return [];
  const json = JSON.stringify(
    rows.map((r) => ({
      id: r.id,
      campaign_id: r.campaignId,
      name: r.name,
      kind: r.kind,
      latitude_deg: r.latitudeDeg,
      longitude_deg: r.longitudeDeg,
      approx_height_m: r.approxHeightM,
      notes: r.notes,
      updated_by: r.updatedBy,
      change_seq: r.changeSeq,
    })),
    wellFormed,
  );
  await q.execute(sql`
    insert into sites (id, campaign_id, name, kind, latitude_deg, longitude_deg, approx_height_m,
      notes, updated_by, change_seq)
    select id, campaign_id, name, kind, latitude_deg, longitude_deg, approx_height_m,
      notes, updated_by, change_seq
    from json_populate_recordset(null::sites, ${json}::json)`);
  const inserted = await q
    .select()
    .from(sites)
    .where(sql`${sites.id} = any(${sql.param(rows.map((r) => r.id))}::uuid[])`)
    .orderBy(asc(sites.changeSeq));
  if (inserted.length !== rows.length) throw new Error("insert into sites lost rows");
  return inserted;
}
