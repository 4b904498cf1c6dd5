// Comparison runs are kept online (REST) by geodesists. The clocks, the link and the remote site
// must belong to the campaign; a run's data revision changes only with its files.
import type { z } from "zod";
import type {
  comparisonRunCreateInput,
  comparisonRunUpdateInput,
  ComparisonRunFields,
  ComparisonRunView,
} from "../../../shared/schemas/comparison";
import type { Db, Tx } from "../../db/client";
import { recordAudit } from "../../db/repositories/audit";
import {
  findInstrument,
  findRun,
  findSite,
  insertRun,
  listFiles,
  listRuns,
  runIdTaken,
  updateRun,
} from "../../db/repositories/comparison";
import { conflict, notFound, validationFailed } from "../../http-errors";
import type { Scope } from "../revision";
import { presentFile, presentRun } from "./present";

type CreateInput = z.output<typeof comparisonRunCreateInput>;
type UpdateInput = z.output<typeof comparisonRunUpdateInput>;
type Fields = z.output<typeof comparisonRunCreateInput>["run"];

export const runEntity = "comparison-run";

export const listCampaignRuns = async (db: Db, campaignId: string) =>
  (await listRuns(db, campaignId)).map(presentRun);

export async function liveRun(q: Db | Tx, campaignId: string, id: string, forUpdate = false) {
  const row = await findRun(q, campaignId, id, forUpdate);
  if (!row || row.deletedAt) throw notFound("Comparison run not found");
  return row;
}

export async function getRunWithFiles(db: Db, campaignId: string, id: string) {
  const run = await liveRun(db, campaignId, id);
  const files = await listFiles(db, campaignId, id);
  return { run: presentRun(run), files: files.map(presentFile) };
}

/** The named site and instruments exist in this campaign, and each instrument is of its kind. */
async function checkReferences(tx: Tx, campaignId: string, run: Fields) {
  const issues: { path: string; message: string }[] = [];
  const site = await findSite(tx, campaignId, run.remoteSiteId);
  if (!site || site.deletedAt)
    issues.push({
      path: "run.remoteSiteId",
      message: "Remote site is not a site of this campaign",
    });
  const wanted: [keyof ComparisonRunFields, string | null, "clock" | "link", string][] = [
    ["remoteClockId", run.remoteClockId, "clock", "Remote clock"],
    ["referenceClockId", run.referenceClockId, "clock", "Reference clock"],
    ["linkId", run.linkId, "link", "Link"],
  ];
  for (const [field, id, kind, label] of wanted) {
    if (id === null) continue;
    const found = await findInstrument(tx, campaignId, id);
    if (!found || found.deletedAt)
      issues.push({
        path: `run.${field}`,
        message: `${label} is not an instrument of this campaign`,
      });
    else if (found.kind !== kind)
      issues.push({
        path: `run.${field}`,
        message: `${label} must be a ${kind}, and ${found.name} is a ${found.kind}`,
      });
  }
  if (issues.length > 0) throw validationFailed(issues);
}

export async function createRun(
  db: Db,
  scope: Scope,
  input: CreateInput,
): Promise<ComparisonRunView> {
  return db.transaction(async (tx) => {
    if (await runIdTaken(tx, input.id))
      throw conflict("A comparison run with this id already exists");
    await checkReferences(tx, scope.campaignId, input.run);
    const row = await insertRun(tx, {
      ...input.run,
      id: input.id,
      campaignId: scope.campaignId,
      createdBy: scope.userId,
      updatedBy: scope.userId,
    });
    const after = presentRun(row);
    await recordAudit(tx, {
      ...scope,
      action: "create",
      entity: runEntity,
      entityId: row.id,
      after,
    });
    return after;
  });
}

export async function editRun(
  db: Db,
  scope: Scope,
  id: string,
  input: UpdateInput,
): Promise<ComparisonRunView> {
  return db.transaction(async (tx) => {
    const current = await liveRun(tx, scope.campaignId, id, true);
    if (current.version !== input.baseVersion) {
      throw conflict(
        `Run "${current.name}" was changed by someone else (now version ${current.version}). Reload it and edit again.`,
      );
    }
    await checkReferences(tx, scope.campaignId, input.run);
    const row = await updateRun(tx, scope.campaignId, id, {
      ...input.run,
      version: current.version + 1,
      updatedAt: new Date(),
      updatedBy: scope.userId,
    });
    const after = presentRun(row);
    await recordAudit(tx, {
      ...scope,
      action: "update",
      entity: runEntity,
      entityId: id,
      before: presentRun(current),
      after,
    });
    return after;
  });
}

/** A tombstone: its files and samples stay until the campaign is removed. */
export async function deleteRun(db: Db, scope: Scope, id: string): Promise<void> {
  await db.transaction(async (tx) => {
    const current = await liveRun(tx, scope.campaignId, id, true);
    const now = new Date();
    await updateRun(tx, scope.campaignId, id, {
      version: current.version + 1,
      updatedAt: now,
      updatedBy: scope.userId,
      deletedAt: now,
    });
    await recordAudit(tx, {
      ...scope,
      action: "delete",
      entity: runEntity,
      entityId: id,
      before: presentRun(current),
    });
  });
}
