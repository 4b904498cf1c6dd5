// Geodesists keep the campaign's clocks and links online, with history. Every write records the
// whole view in the audit trail, so the history is read back from it (who, when, what changed).
import { and, eq, isNull, or } from "drizzle-orm";
import type { z } from "zod";
import type {
  instrumentCreateInput,
  InstrumentRevisionView,
  instrumentUpdateInput,
  InstrumentView,
} from "../../shared/schemas/instruments";
import type { Db, Queryable, Tx } from "../db/client";
import { recordAudit } from "../db/repositories/audit";
import {
  findInstrumentForUpdate,
  findInstrumentWithName,
  insertInstrument,
  instrumentAudit,
  instrumentIdTaken,
  listInstruments,
  updateInstrument,
  type InstrumentWithName,
} from "../db/repositories/instruments";
import { comparisonRuns } from "../db/schema";
import { conflict, notFound } from "../http-errors";
import type { Scope } from "./revision";

type CreateInput = z.output<typeof instrumentCreateInput>;
type UpdateInput = z.output<typeof instrumentUpdateInput>;
type Terms = { name: string; value: number }[];

export const instrumentEntity = "instrument";

export function presentInstrument(row: InstrumentWithName): InstrumentView {
  const systematic = row.systematic as Terms;
  return {
    id: row.id,
    campaignId: row.campaignId,
    kind: row.kind,
    name: row.name,
    description: row.description,
    instabilityAt1s: row.instabilityAt1s,
    systematic,
    systematicTotal: Math.sqrt(systematic.reduce((s, t) => s + t.value * t.value, 0)),
    notes: row.notes,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
    updatedByName: row.updatedByName,
  };
}

export const listCampaignInstruments = async (db: Db, campaignId: string) =>
  (await listInstruments(db, campaignId)).map(presentInstrument);

export async function getInstrument(db: Db, campaignId: string, id: string) {
  const row = await findInstrumentWithName(db, campaignId, id);
  if (!row || row.deletedAt) throw notFound("Instrument not found");
  return presentInstrument(row);
}

async function readBack(tx: Queryable, scope: Scope, id: string) {
  const row = await findInstrumentWithName(tx, scope.campaignId, id);
  if (!row) throw new Error("instrument vanished inside its transaction");
  return presentInstrument(row);
}

export async function createInstrument(db: Db, scope: Scope, input: CreateInput) {
  return db.transaction(async (tx) => {
    if (await instrumentIdTaken(tx, input.id))
      throw conflict("An instrument with this id already exists");
    await insertInstrument(tx, {
      ...input.instrument,
      id: input.id,
      campaignId: scope.campaignId,
      updatedBy: scope.userId,
    });
    const after = await readBack(tx, scope, input.id);
    await recordAudit(tx, {
      ...scope,
      action: "create",
      entity: instrumentEntity,
      entityId: input.id,
      after,
    });
    return after;
  });
}

export async function editInstrument(db: Db, scope: Scope, id: string, input: UpdateInput) {
  return db.transaction(async (tx) => {
    const current = await findInstrumentForUpdate(tx, scope.campaignId, id);
    if (!current || current.deletedAt) throw notFound("Instrument not found");
    if (current.version !== input.baseVersion) {
      throw conflict(
        `${current.name} was changed by someone else (now version ${current.version}). Reload it and edit again.`,
      );
    }
    if (input.instrument.kind !== current.kind && (await usedBy(tx, scope.campaignId, id)) !== null)
      throw conflict("A clock or link in use by a comparison run cannot change its kind");
    const before = await readBack(tx, scope, id);
    await updateInstrument(tx, scope.campaignId, id, {
      ...input.instrument,
      version: current.version + 1,
      updatedAt: new Date(),
      updatedBy: scope.userId,
    });
    const after = await readBack(tx, scope, id);
    await recordAudit(tx, {
      ...scope,
      action: "update",
      entity: instrumentEntity,
      entityId: id,
      before,
      after,
    });
    return after;
  });
}

/** The name of a live run that uses the instrument, or null. */
async function usedBy(tx: Tx, campaignId: string, id: string): Promise<string | null> {
  const [run] = await tx
    .select({ name: comparisonRuns.name })
    .from(comparisonRuns)
    .where(
      and(
        eq(comparisonRuns.campaignId, campaignId),
        isNull(comparisonRuns.deletedAt),
        or(
          eq(comparisonRuns.remoteClockId, id),
          eq(comparisonRuns.referenceClockId, id),
          eq(comparisonRuns.linkId, id),
        ),
      ),
    )
    .limit(1);
  return run?.name ?? null;
}

/** A tombstone; refused while a live run relies on the instrument's figures. */
export async function deleteInstrument(db: Db, scope: Scope, id: string): Promise<void> {
  await db.transaction(async (tx) => {
    const current = await findInstrumentForUpdate(tx, scope.campaignId, id);
    if (!current || current.deletedAt) throw notFound("Instrument not found");
    const run = await usedBy(tx, scope.campaignId, id);
    if (run !== null)
      throw conflict(
        `${current.name} is used by the comparison run "${run}": remove it there first`,
      );
    const before = await readBack(tx, scope, id);
    const now = new Date();
    await updateInstrument(tx, scope.campaignId, id, {
      version: current.version + 1,
      updatedAt: now,
      updatedBy: scope.userId,
      deletedAt: now,
    });
    await recordAudit(tx, {
      ...scope,
      action: "delete",
      entity: instrumentEntity,
      entityId: id,
      before,
      after: null,
    });
  });
}

const compared = ["kind", "name", "description", "instabilityAt1s", "systematic", "notes"] as const;

/** Each revision with the fields that changed from the one before (all of them for a create). */
export async function instrumentHistory(
  db: Db,
  campaignId: string,
  id: string,
): Promise<InstrumentRevisionView[]> {
  const events = await instrumentAudit(db, campaignId, id);
  if (events.length === 0) throw notFound("Instrument not found");
  let previous: InstrumentView | null = null;
  return events.map((e) => {
    const after = (e.after as InstrumentView | null) ?? null;
    const action = e.action as InstrumentRevisionView["action"];
    const changed =
      after === null
        ? []
        : compared.filter(
            (f) => previous === null || JSON.stringify(previous[f]) !== JSON.stringify(after[f]),
          );
    const version = after?.version ?? (previous?.version ?? 0) + 1;
    previous = after ?? previous;
    return {
      at: e.at.toISOString(),
      action,
      byName: e.byName,
      version,
      changed: [...changed],
      after,
    };
  });
}
