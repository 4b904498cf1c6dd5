// Imported ties (a file in one transaction: one bad row and nothing is stored; a delete is a
// tombstone) and the network as it stands: closed field-book sections plus live ties.
import type { z } from "zod";
import type { HeightTieView, heightTieImportInput } from "../../shared/schemas/height-network";
import type { Db, Queryable } from "../db/client";
import { recordAudit, recordAudits } from "../db/repositories/audit";
import {
  closedSections,
  findTieForUpdate,
  insertTies,
  listTies,
  markTieDeleted,
  setupsOfSections,
} from "../db/repositories/height-network";
import { notFound } from "../http-errors";
import { presentTie } from "../presenters/height-network";
import {
  sectionObservation,
  tieObservation,
  type NetworkObservation,
} from "./height-network/network";
import { readTieFile, type TieRowError } from "./height-network/tie-file";
import type { Scope } from "./revision";

type ImportInput = z.output<typeof heightTieImportInput>;

export const tieEntity = "height-tie";

export type TieImportOutcome =
  { ok: true; ties: HeightTieView[] } | { ok: false; message: string; rows: TieRowError[] };

export async function listCampaignTies(db: Db, campaignId: string): Promise<HeightTieView[]> {
  return (await listTies(db, campaignId)).map(presentTie);
}

export async function importTies(
  db: Db,
  scope: Scope,
  input: ImportInput,
): Promise<TieImportOutcome> {
  const read = readTieFile(input.content);
  const what = input.fileName || "the file";
  if (!read.ok) {
    const n = read.errorCount;
    return {
      ok: false,
      message: `${n} ${n === 1 ? "problem" : "problems"} in ${what}; nothing was imported`,
      rows: read.errors,
    };
  }
  const source = input.fileName || "Imported file";
  const ids = await db.transaction(async (tx) => {
    const rows = await insertTies(
      tx,
      read.ties.map(({ line: _line, ...tie }) => ({
        ...tie,
        campaignId: scope.campaignId,
        source,
        importedBy: scope.userId,
      })),
    );
    await recordAudits(
      tx,
      rows.map((row) => ({
        campaignId: scope.campaignId,
        userId: scope.userId,
        action: "create",
        entity: tieEntity,
        entityId: row.id,
        after: presentTie({ ...row, importedByName: null }),
      })),
    );
    return new Set(rows.map((r) => r.id));
  });
  const ties = (await listTies(db, scope.campaignId)).filter((t) => ids.has(t.id));
  return { ok: true, ties: ties.map(presentTie) };
}

export async function deleteTie(db: Db, scope: Scope, id: string): Promise<void> {
  await db.transaction(async (tx) => {
    const current = await findTieForUpdate(tx, scope.campaignId, id);
    if (!current || current.deletedAt) throw notFound("Height tie not found");
    const row = await markTieDeleted(tx, scope.campaignId, id);
    await recordAudit(tx, {
      campaignId: scope.campaignId,
      userId: scope.userId,
      action: "delete",
      entity: tieEntity,
      entityId: id,
      before: presentTie({ ...current, importedByName: null }),
      after: presentTie({ ...row, importedByName: null }),
    });
  });
}

/** Every observation the network holds now, field-book sections first. */
export async function networkObservations(
  q: Queryable,
  campaignId: string,
): Promise<NetworkObservation[]> {
  const sections = await closedSections(q, campaignId);
  const setups = await setupsOfSections(
    q,
    campaignId,
    sections.map((s) => s.id),
  );
  const bySection = new Map<string, typeof setups>();
  for (const s of setups) bySection.set(s.sectionId, [...(bySection.get(s.sectionId) ?? []), s]);
  const fromBooks = sections.flatMap((section) => {
    const book = (bySection.get(section.id) ?? []).map((s) => ({
      ...s,
      recordedAt: s.recordedAt.toISOString(),
    }));
    const o = sectionObservation({ ...section, setups: book });
    return o === null ? [] : [o];
  });
  const ties = (await listTies(q, campaignId)).map(tieObservation);
  return [...fromBooks, ...ties];
}
