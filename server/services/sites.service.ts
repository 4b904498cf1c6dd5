import { randomUUID } from "node:crypto";
import type { SiteCreateInput, SiteUpdateInput, SiteView } from "../../shared/schemas/sites";
import type { Db } from "../db/client";
import { lockChangeStream, nextChangeSeq } from "../db/change-seq";
import { nextRevision, tombstoneRevision, type Scope } from "./revision";
import { recordAudit } from "../db/repositories/audit";
import {
  takenSiteIds,
  findSiteForUpdate,
  insertSite,
  listSites,
  updateSite,
} from "../db/repositories/sites";
import { conflict, notFound } from "../http-errors";
import { presentSite } from "../presenters/site";

export const listCampaignSites = async (db: Db, campaignId: string) =>
  (await listSites(db, campaignId)).map(presentSite);

type CreateFields = Omit<SiteCreateInput, "notes"> & { notes: string };

export async function createSite(db: Db, scope: Scope, input: CreateFields): Promise<SiteView> {
  return db.transaction(async (tx) => {
    const id = input.id ?? randomUUID();
    if ((await takenSiteIds(tx, [id])).size > 0)
      throw conflict("A site with this id already exists");
    const row = await insertSite(tx, {
      ...input,
      id,
      campaignId: scope.campaignId,
      updatedBy: scope.userId,
      changeSeq: await nextChangeSeq(tx, scope.campaignId),
    });
    const view = presentSite(row);
    await recordAudit(tx, {
      ...scope,
      action: "create",
      entity: "site",
      entityId: id,
      after: view,
    });
    return view;
  });
}

export async function editSite(
  db: Db,
  scope: Scope,
  id: string,
  input: SiteUpdateInput,
): Promise<SiteView> {
  return db.transaction(async (tx) => {
    await lockChangeStream(tx, scope.campaignId);
    const current = await findSiteForUpdate(tx, scope.campaignId, id);
    if (!current || current.deletedAt) throw notFound("Site not found");
    if (current.version !== input.baseVersion) {
      throw conflict(
        `This site was changed by someone else (now version ${current.version}). Reload it and edit again.`,
      );
    }
    const { baseVersion: _baseVersion, ...fields } = input;
    const row = await updateSite(tx, id, {
      ...fields,
      ...(await nextRevision(tx, scope, current)),
    });
    const after = presentSite(row);
    await recordAudit(tx, {
      ...scope,
      action: "update",
      entity: "site",
      entityId: id,
      before: presentSite(current),
      after,
    });
    return after;
  });
}

export async function deleteSite(db: Db, scope: Scope, id: string): Promise<void> {
  await db.transaction(async (tx) => {
    await lockChangeStream(tx, scope.campaignId);
    const current = await findSiteForUpdate(tx, scope.campaignId, id);
    if (!current || current.deletedAt) throw notFound("Site not found");
    await updateSite(tx, id, await tombstoneRevision(tx, scope, current));
    await recordAudit(tx, {
      ...scope,
      action: "delete",
      entity: "site",
      entityId: id,
      before: presentSite(current),
    });
  });
}
