// What every edit of a versioned, synced record sets, in one place: the next version, who and when,
// and a new change position so tablets pull it. A delete is a revision that also sets the tombstone.
import type { Tx } from "../db/client";
import { nextChangeSeq } from "../db/change-seq";

/** The campaign and person a REST write acts for. */
export interface Scope {
  campaignId: string;
  userId: string;
}

export async function nextRevision(tx: Tx, scope: Scope, current: { version: number }) {
  return {
    version: current.version + 1,
    updatedAt: new Date(),
    updatedBy: scope.userId,
    changeSeq: await nextChangeSeq(tx, scope.campaignId),
  };
}

export async function tombstoneRevision(tx: Tx, scope: Scope, current: { version: number }) {
  const revision = await nextRevision(tx, scope, current);
  return { ...revision, deletedAt: revision.updatedAt };
}
