// Logistics edits crates online. Every write takes a new change position, so tablets pull the new
// limits (and, for a deleted crate, the tombstone); the crate's row lock orders two editors.
import type { z } from "zod";
import type { CrateView } from "../../shared/schemas/crates";
import type { crateCreateInput, crateUpdateInput } from "../../shared/schemas/logistics";
import { lockChangeStream, nextChangeSeq } from "../db/change-seq";
import { nextRevision, tombstoneRevision, type Scope } from "./revision";
import type { Db } from "../db/client";
import { recordAudit } from "../db/repositories/audit";
import {
  crateIdTaken,
  findCrateForUpdate,
  insertCrate,
  updateCrate,
} from "../db/repositories/crates-benchmarks";
import { conflict, notFound } from "../http-errors";
import { presentCrate } from "../presenters/crate-benchmark";

type CreateInput = z.output<typeof crateCreateInput>;
type UpdateInput = z.output<typeof crateUpdateInput>;

const entity = "crate";

export async function createCrate(db: Db, scope: Scope, input: CreateInput): Promise<CrateView> {
  return db.transaction(async (tx) => {
    if (await crateIdTaken(tx, input.id)) throw conflict("A crate with this id already exists");
    const row = await insertCrate(tx, {
      ...input.crate,
      id: input.id,
      campaignId: scope.campaignId,
      version: 1,
      updatedBy: scope.userId,
      changeSeq: await nextChangeSeq(tx, scope.campaignId),
    });
    const after = presentCrate(row);
    await recordAudit(tx, { ...scope, action: "create", entity, entityId: row.id, after });
    return after;
  });
}

export async function editCrate(
  db: Db,
  scope: Scope,
  id: string,
  input: UpdateInput,
): Promise<CrateView> {
  return db.transaction(async (tx) => {
    await lockChangeStream(tx, scope.campaignId);
    const current = await findCrateForUpdate(tx, scope.campaignId, id);
    if (!current || current.deletedAt) throw notFound("Crate not found");
    if (current.version !== input.baseVersion) {
      throw conflict(
        `This crate was changed by someone else (now version ${current.version}). Reload it and edit again.`,
      );
    }
    const row = await updateCrate(tx, scope.campaignId, id, {
      ...input.crate,
      ...(await nextRevision(tx, scope, current)),
    });
    const after = presentCrate(row);
    await recordAudit(tx, {
      ...scope,
      action: "update",
      entity,
      entityId: id,
      before: presentCrate(current),
      after,
    });
    return after;
  });
}

/** A tombstone: legs, handovers and entries that name the crate keep pointing at it. */
export async function deleteCrate(db: Db, scope: Scope, id: string): Promise<void> {
  await db.transaction(async (tx) => {
    await lockChangeStream(tx, scope.campaignId);
    const current = await findCrateForUpdate(tx, scope.campaignId, id);
    if (!current || current.deletedAt) throw notFound("Crate not found");
    const row = await updateCrate(
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
      before: presentCrate(current),
      after: presentCrate(row),
    });
  });
}
