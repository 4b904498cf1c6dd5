// Levelling sections and their setups (append-only); every query is scoped by campaign except the
// id checks.
import { and, asc, eq, getTableColumns } from "drizzle-orm";
import type { Queryable } from "../client";
import { idTaken } from "./taken-ids";
import { levellingSections, levellingSetups, users } from "../schema";

export type LevellingSectionRow = typeof levellingSections.$inferSelect;
export type LevellingSetupRecord = typeof levellingSetups.$inferSelect;
/** A stored setup with its author's name, as the pull and the presenter take it. */
export type LevellingSetupRow = LevellingSetupRecord & { recordedByName: string | null };

const setupWithAuthor = { ...getTableColumns(levellingSetups), recordedByName: users.name };

/** Any campaign: a client-made id that already exists anywhere is refused. */
export const sectionIdTaken = (q: Queryable, id: string) => idTaken(q, levellingSections, id);

export const setupIdTaken = (q: Queryable, id: string) => idTaken(q, levellingSetups, id);

export const findSection = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(levellingSections)
      .where(and(eq(levellingSections.campaignId, campaignId), eq(levellingSections.id, id)))
      .limit(1)
  )[0];

export const findSectionForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(levellingSections)
      .where(and(eq(levellingSections.campaignId, campaignId), eq(levellingSections.id, id)))
      .for("update")
      .limit(1)
  )[0];

export const setupsOfSection = (q: Queryable, sectionId: string) =>
  q
    .select()
    .from(levellingSetups)
    .where(eq(levellingSetups.sectionId, sectionId))
    .orderBy(asc(levellingSetups.changeSeq));

export const findSetup = async (
  q: Queryable,
  campaignId: string,
  id: string,
): Promise<LevellingSetupRow | undefined> =>
  (
    await q
      .select(setupWithAuthor)
      .from(levellingSetups)
      .leftJoin(users, eq(users.id, levellingSetups.recordedBy))
      .where(and(eq(levellingSetups.campaignId, campaignId), eq(levellingSetups.id, id)))
      .limit(1)
  )[0];

export async function insertSection(
  q: Queryable,
  row: typeof levellingSections.$inferInsert,
): Promise<LevellingSectionRow> {
  const [inserted] = await q.insert(levellingSections).values(row).returning();
  if (!inserted) throw new Error("insert into levelling_sections returned no row");
  return inserted;
}

export async function updateSection(
  q: Queryable,
  id: string,
  patch: Partial<typeof levellingSections.$inferInsert>,
): Promise<LevellingSectionRow> {
  const [updated] = await q
    .update(levellingSections)
    .set(patch)
    .where(eq(levellingSections.id, id))
    .returning();
  if (!updated) throw new Error("update of levelling_sections returned no row");
  return updated;
}

export async function insertSetup(
  q: Queryable,
  row: typeof levellingSetups.$inferInsert,
): Promise<LevellingSetupRecord> {
  const [inserted] = await q.insert(levellingSetups).values(row).returning();
  if (!inserted) throw new Error("insert into levelling_setups returned no row");
  return inserted;
}
