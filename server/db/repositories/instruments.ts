// Instruments (clocks and links): queries only, always scoped by campaign.
import { and, asc, eq, isNull } from "drizzle-orm";
import type { Queryable } from "../client";
import { idTaken } from "./taken-ids";
import { auditEvents, instruments, users } from "../schema";

export type InstrumentRow = typeof instruments.$inferSelect;
export type InstrumentInsert = typeof instruments.$inferInsert;
export type InstrumentWithName = InstrumentRow & { updatedByName: string | null };

const withName = { row: instruments, updatedByName: users.name };

export async function listInstruments(
  q: Queryable,
  campaignId: string,
): Promise<InstrumentWithName[]> {
  const rows = await q
    .select(withName)
    .from(instruments)
    .leftJoin(users, eq(users.id, instruments.updatedBy))
    .where(and(eq(instruments.campaignId, campaignId), isNull(instruments.deletedAt)))
    .orderBy(asc(instruments.kind), asc(instruments.name));
  return rows.map((r) => ({ ...r.row, updatedByName: r.updatedByName }));
}

/** This campaign's instrument, deleted or not. */
export async function findInstrumentWithName(
  q: Queryable,
  campaignId: string,
  id: string,
): Promise<InstrumentWithName | undefined> {
  const [r] = await q
    .select(withName)
    .from(instruments)
    .leftJoin(users, eq(users.id, instruments.updatedBy))
    .where(and(eq(instruments.campaignId, campaignId), eq(instruments.id, id)))
    .limit(1);
  return r === undefined ? undefined : { ...r.row, updatedByName: r.updatedByName };
}

/** Locked, so two edits of one instrument are ordered. */
export const findInstrumentForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(instruments)
      .where(and(eq(instruments.campaignId, campaignId), eq(instruments.id, id)))
      .for("update")
      .limit(1)
  )[0];

export const instrumentIdTaken = (q: Queryable, id: string) => idTaken(q, instruments, id);

export async function insertInstrument(q: Queryable, values: InstrumentInsert) {
  const [row] = await q.insert(instruments).values(values).returning();
  if (!row) throw new Error("insert into instruments returned no row");
  return row;
}

export async function updateInstrument(
  q: Queryable,
  campaignId: string,
  id: string,
  patch: Partial<InstrumentInsert>,
) {
  const [row] = await q
    .update(instruments)
    .set(patch)
    .where(and(eq(instruments.campaignId, campaignId), eq(instruments.id, id)))
    .returning();
  if (!row) throw new Error("update of instruments returned no row");
  return row;
}

/** The instrument's audit events, oldest first, with the name of who made each. */
export const instrumentAudit = (q: Queryable, campaignId: string, id: string) =>
  q
    .select({
      at: auditEvents.at,
      action: auditEvents.action,
      after: auditEvents.after,
      byName: users.name,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.userId))
    .where(
      and(
        eq(auditEvents.campaignId, campaignId),
        eq(auditEvents.entity, "instrument"),
        eq(auditEvents.entityId, id),
      ),
    )
    .orderBy(asc(auditEvents.id));
