// Checklist templates, runs and results; every query is scoped by campaign.
import { and, eq } from "drizzle-orm";
import type { Queryable } from "../client";
import { idTaken } from "./taken-ids";
import { checklistResults, checklistRuns, checklistTemplates } from "../schema";

export type ChecklistTemplateRow = typeof checklistTemplates.$inferSelect;
export type ChecklistRunRow = typeof checklistRuns.$inferSelect;
export type ChecklistResultRow = typeof checklistResults.$inferSelect;

export const findTemplate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(checklistTemplates)
      .where(and(eq(checklistTemplates.campaignId, campaignId), eq(checklistTemplates.id, id)))
      .limit(1)
  )[0];

/** Any campaign: a client-made id that already exists anywhere is refused. */
export const runIdTaken = (q: Queryable, id: string) => idTaken(q, checklistRuns, id);

export const resultIdTaken = (q: Queryable, id: string) => idTaken(q, checklistResults, id);

export const findRunForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(checklistRuns)
      .where(and(eq(checklistRuns.campaignId, campaignId), eq(checklistRuns.id, id)))
      .for("update")
      .limit(1)
  )[0];

export const resultsOfRun = (q: Queryable, runId: string) =>
  q.select().from(checklistResults).where(eq(checklistResults.runId, runId));

export async function insertRun(
  q: Queryable,
  row: typeof checklistRuns.$inferInsert,
): Promise<ChecklistRunRow> {
  const [inserted] = await q.insert(checklistRuns).values(row).returning();
  if (!inserted) throw new Error("insert into checklist_runs returned no row");
  return inserted;
}

export async function updateRun(
  q: Queryable,
  id: string,
  patch: Partial<typeof checklistRuns.$inferInsert>,
): Promise<ChecklistRunRow> {
  const [updated] = await q
    .update(checklistRuns)
    .set(patch)
    .where(eq(checklistRuns.id, id))
    .returning();
  if (!updated) throw new Error("update of checklist_runs returned no row");
  return updated;
}

export async function insertResult(
  q: Queryable,
  row: typeof checklistResults.$inferInsert,
): Promise<ChecklistResultRow> {
  const [inserted] = await q.insert(checklistResults).values(row).returning();
  if (!inserted) throw new Error("insert into checklist_results returned no row");
  return inserted;
}
