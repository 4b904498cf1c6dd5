// Administrators edit checklist templates online. Every write takes a new change position, so
// tablets pull the new items; runs already started keep the items they copied at their start.
import type { z } from "zod";
import type {
  checklistTemplateCreateInput,
  checklistTemplateUpdateInput,
} from "../../shared/schemas/checklist-templates";
import type { ChecklistTemplateView } from "../../shared/schemas/checklists";
import { lockChangeStream, nextChangeSeq } from "../db/change-seq";
import { nextRevision, tombstoneRevision, type Scope } from "./revision";
import type { Db } from "../db/client";
import { recordAudit } from "../db/repositories/audit";
import {
  findTemplateForUpdate,
  insertTemplate,
  listTemplates,
  templateIdTaken,
  updateTemplate,
} from "../db/repositories/checklist-templates";
import { conflict, notFound } from "../http-errors";
import { presentTemplate } from "../presenters/checklist";

type CreateFields = z.output<typeof checklistTemplateCreateInput>;
type UpdateFields = z.output<typeof checklistTemplateUpdateInput>;

const entity = "checklistTemplate";

export const listCampaignTemplates = async (
  db: Db,
  campaignId: string,
): Promise<ChecklistTemplateView[]> => (await listTemplates(db, campaignId)).map(presentTemplate);

export async function createTemplate(
  db: Db,
  scope: Scope,
  input: CreateFields,
): Promise<ChecklistTemplateView> {
  return db.transaction(async (tx) => {
    if (await templateIdTaken(tx, input.id))
      throw conflict("A checklist template with this id already exists");
    const row = await insertTemplate(tx, {
      ...input,
      campaignId: scope.campaignId,
      version: 1,
      updatedBy: scope.userId,
      changeSeq: await nextChangeSeq(tx, scope.campaignId),
    });
    const after = presentTemplate(row);
    await recordAudit(tx, { ...scope, action: "create", entity, entityId: row.id, after });
    return after;
  });
}

export async function editTemplate(
  db: Db,
  scope: Scope,
  id: string,
  input: UpdateFields,
): Promise<ChecklistTemplateView> {
  return db.transaction(async (tx) => {
    await lockChangeStream(tx, scope.campaignId);
    const current = await findTemplateForUpdate(tx, scope.campaignId, id);
    if (!current || current.deletedAt) throw notFound("Checklist template not found");
    if (current.version !== input.baseVersion) {
      throw conflict(
        `This checklist template was changed by someone else (now version ${current.version}). Reload it and edit again.`,
      );
    }
    const { baseVersion: _baseVersion, ...fields } = input;
    const row = await updateTemplate(tx, scope.campaignId, id, {
      ...fields,
      ...(await nextRevision(tx, scope, current)),
    });
    const after = presentTemplate(row);
    await recordAudit(tx, {
      ...scope,
      action: "update",
      entity,
      entityId: id,
      before: presentTemplate(current),
      after,
    });
    return after;
  });
}

/** A tombstone with a new change position, so tablets stop offering the template. */
export async function deleteTemplate(db: Db, scope: Scope, id: string): Promise<void> {
  await db.transaction(async (tx) => {
    await lockChangeStream(tx, scope.campaignId);
    const current = await findTemplateForUpdate(tx, scope.campaignId, id);
    if (!current || current.deletedAt) throw notFound("Checklist template not found");
    const row = await updateTemplate(
      tx,
      scope.campaignId,
      id,
      await tombstoneRevision(tx, scope, current),
    );
    await recordAudit(tx, {
      ...scope,
      action: "delete",
      entity,
      entityId: id,
      before: presentTemplate(current),
      after: presentTemplate(row),
    });
  });
}
