// Checklist templates as administrators edit them; every query is scoped by campaign.
import { and, asc, eq, isNull } from "drizzle-orm";
import type { Queryable } from "../client";
import { idTaken } from "./taken-ids";
import { checklistTemplates } from "../schema";
import type { ChecklistTemplateRow } from "./checklists";

export type ChecklistTemplateInsert = typeof checklistTemplates.$inferInsert;

export const listTemplates = (q: Queryable, campaignId: string) =>
  q
    .select()
    .from(checklistTemplates)
    .where(and(eq(checklistTemplates.campaignId, campaignId), isNull(checklistTemplates.deletedAt)))
    .orderBy(asc(checklistTemplates.title), asc(checklistTemplates.id));

/** Locks the row, so two administrators saving at once are ordered and the later one is stale. */
export const findTemplateForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(checklistTemplates)
      .where(and(eq(checklistTemplates.campaignId, campaignId), eq(checklistTemplates.id, id)))
      .for("update")
      .limit(1)
  )[0];

/** Any campaign: a client-made id that already exists anywhere is refused. */
export const templateIdTaken = (q: Queryable, id: string) => idTaken(q, checklistTemplates, id);

export async function insertTemplate(
  q: Queryable,
  row: ChecklistTemplateInsert,
): Promise<ChecklistTemplateRow> {
  const [inserted] = await q.insert(checklistTemplates).values(row).returning();
  if (!inserted) throw new Error("insert into checklist_templates returned no row");
  return inserted;
}

export async function updateTemplate(
  q: Queryable,
  campaignId: string,
  id: string,
  patch: Partial<ChecklistTemplateInsert>,
): Promise<ChecklistTemplateRow> {
  const [updated] = await q
    .update(checklistTemplates)
    .set(patch)
    .where(and(eq(checklistTemplates.campaignId, campaignId), eq(checklistTemplates.id, id)))
    .returning();
  if (!updated) throw new Error("update of checklist_templates returned no row");
  return updated;
}
