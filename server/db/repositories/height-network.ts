// The levelling network's own tables (imported ties, kept adjustments) and what the network reads
// from the field books and benchmarks; every query is scoped by campaign.
import { and, asc, desc, eq, getTableColumns, inArray, isNotNull, isNull, sql } from "drizzle-orm";
import { adjustmentView, type AdjustmentView } from "../../../shared/schemas/height-network";
import type { Queryable } from "../client";
import {
  benchmarks,
  heightTies,
  levellingAdjustments,
  levellingSections,
  levellingSetups,
  users,
} from "../schema";

export type HeightTieRecord = typeof heightTies.$inferSelect;
export type HeightTieRow = HeightTieRecord & { importedByName: string | null };

const tieWithImporter = { ...getTableColumns(heightTies), importedByName: users.name };

export const listTies = (q: Queryable, campaignId: string): Promise<HeightTieRow[]> =>
  q
    .select(tieWithImporter)
    .from(heightTies)
    .leftJoin(users, eq(users.id, heightTies.importedBy))
    .where(and(eq(heightTies.campaignId, campaignId), isNull(heightTies.deletedAt)))
    .orderBy(asc(heightTies.importedAt), asc(heightTies.fromMark), asc(heightTies.id));

export async function insertTies(
  q: Queryable,
  rows: (typeof heightTies.$inferInsert)[],
): Promise<HeightTieRecord[]> {
  if (rows.length === 0) return [];
  return q.insert(heightTies).values(rows).returning();
}

/** A tie of this campaign, locked so two deletes are ordered. */
export const findTieForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(heightTies)
      .where(and(eq(heightTies.campaignId, campaignId), eq(heightTies.id, id)))
      .for("update")
      .limit(1)
  )[0];

export async function markTieDeleted(
  q: Queryable,
  campaignId: string,
  id: string,
): Promise<HeightTieRecord> {
  const [updated] = await q
    .update(heightTies)
    .set({ deletedAt: new Date() })
    .where(and(eq(heightTies.campaignId, campaignId), eq(heightTies.id, id)))
    .returning();
  if (!updated) throw new Error("update of height_ties returned no row");
  return updated;
}

export const closedSections = (q: Queryable, campaignId: string) =>
  q
    .select()
    .from(levellingSections)
    .where(and(eq(levellingSections.campaignId, campaignId), isNotNull(levellingSections.closedAt)))
    .orderBy(asc(levellingSections.closedAt), asc(levellingSections.id));

export const setupsOfSections = (q: Queryable, campaignId: string, sectionIds: string[]) =>
  sectionIds.length === 0
    ? Promise.resolve([])
    : q
        .select()
        .from(levellingSetups)
        .where(
          and(
            eq(levellingSetups.campaignId, campaignId),
            inArray(levellingSetups.sectionId, sectionIds),
          ),
        );

export const liveBenchmarks = (q: Queryable, campaignId: string) =>
  q
    .select({
      id: benchmarks.id,
      code: benchmarks.code,
      heightM: benchmarks.heightM,
      heightSigmaM: benchmarks.heightSigmaM,
    })
    .from(benchmarks)
    .where(and(eq(benchmarks.campaignId, campaignId), isNull(benchmarks.deletedAt)))
    .orderBy(asc(benchmarks.code));

export async function insertAdjustment(
  q: Queryable,
  campaignId: string,
  userId: string,
  view: AdjustmentView,
): Promise<void> {
  await q.insert(levellingAdjustments).values({
    id: view.id,
    campaignId,
    computedAt: new Date(view.computedAt),
    computedBy: userId,
    options: view.options,
    result: view,
  });
}

/** The campaign's most recent adjustment as stored (an AdjustmentView), or null when none. */
export async function latestAdjustment(
  q: Queryable,
  campaignId: string,
): Promise<AdjustmentView | null> {
  const [row] = await q
    .select({ result: levellingAdjustments.result })
    .from(levellingAdjustments)
    .where(eq(levellingAdjustments.campaignId, campaignId))
    .orderBy(desc(levellingAdjustments.computedAt), desc(levellingAdjustments.id))
    .limit(1);
  return row === undefined ? null : adjustmentView.parse(row.result);
}

/** The list reads only the summary fields out of each stored result. */
export const listAdjustments = (q: Queryable, campaignId: string) =>
  q
    .select({
      id: levellingAdjustments.id,
      computedAt: levellingAdjustments.computedAt,
      computedByName: sql<string | null>`${levellingAdjustments.result}->>'computedByName'`,
      dof: sql<number>`(${levellingAdjustments.result}->>'dof')::int`,
      sigma0: sql<number | null>`(${levellingAdjustments.result}->>'sigma0')::float8`,
      passed: sql<
        boolean | null
      >`(${levellingAdjustments.result}->'globalTest'->>'passed')::boolean`,
    })
    .from(levellingAdjustments)
    .where(eq(levellingAdjustments.campaignId, campaignId))
    .orderBy(desc(levellingAdjustments.computedAt), desc(levellingAdjustments.id))
    .limit(200);
