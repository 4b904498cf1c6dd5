// Local logistics writes: plan a leg, record its departure, arrival or cancellation, record a
// handover, acknowledge an alert. Each is one transaction with its outbox entry (outbox.ts); the
// server's checks run here first, so a refusal shows on the tablet, not at the next sync.
import type { z } from "zod";
import {
  alertAcknowledgeInput,
  handoverInput,
  legPlanInput,
  legStepInput,
  type HandoverCondition,
} from "../../shared/schemas/logistics";
import type { CrateView } from "../../shared/schemas/crates";
import type { EquipotDb, LocalLeg } from "./database";
import type { HandoverSnapshot } from "./logistics-view";
import { custodyProblem } from "../../shared/custody";
import { lastHandover } from "./logistics-queries";
import { readAuthorName, recordMutation } from "./outbox";

/** The first problem of an input, naming its field as the schema names it. */
export class LogisticsInputError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = "LogisticsInputError";
  }
}

function parse<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  throw new LogisticsInputError(issue?.path.join(".") ?? "", issue?.message ?? "Invalid input");
}

async function requireCrate(db: EquipotDb, campaignId: string, crateId: string) {
  const crate = await db.crates.get(crateId);
  if (!crate || crate.campaignId !== campaignId || crate.deletedAt !== null)
    throw new LogisticsInputError("crateId", "This crate is not on this device");
  return crate;
}

async function requireSite(db: EquipotDb, campaignId: string, siteId: string, field: string) {
  const site = await db.sites.get(siteId);
  if (!site || site.campaignId !== campaignId || site.deletedAt !== null)
    throw new LogisticsInputError(field, "This site is not on this device");
  return site;
}

export interface LegDraft {
  readonly crateId: string;
  readonly fromSiteId: string;
  readonly toSiteId: string;
  readonly vehicle?: string;
  readonly plannedDepartAt: string;
  readonly plannedArriveAt: string;
  readonly note?: string;
}

export async function planLegLocally(
  db: EquipotDb,
  campaignId: string,
  draft: LegDraft,
  id = crypto.randomUUID(),
): Promise<string> {
  const args = parse(legPlanInput, { ...draft, id });
  await requireCrate(db, campaignId, args.crateId);
  await requireSite(db, campaignId, args.fromSiteId, "fromSiteId");
  await requireSite(db, campaignId, args.toSiteId, "toSiteId");
  await recordMutation(db, { campaignId, name: "leg.plan", entityId: id, args });
  return id;
}

async function requireLeg(db: EquipotDb, campaignId: string, legId: string): Promise<LocalLeg> {
  const leg = await db.legs.get(legId);
  if (!leg || leg.campaignId !== campaignId)
    throw new LogisticsInputError("id", "This leg is not on this device");
  if (leg.cancelledAt !== null)
    throw new LogisticsInputError("id", "This leg was cancelled; plan a new leg for the journey");
  return leg;
}

type Step = "leg.depart" | "leg.arrive" | "leg.cancel";

async function stepLeg(
  db: EquipotDb,
  campaignId: string,
  legId: string,
  name: Step,
  at: string,
  note: string,
) {
  const leg = await requireLeg(db, campaignId, legId);
  const args = parse(legStepInput, { id: legId, at, note });
  if (name === "leg.depart" && leg.departedAt !== null)
    throw new LogisticsInputError("at", "This leg has already departed");
  if (name === "leg.arrive") {
    if (leg.departedAt === null)
      throw new LogisticsInputError(
        "at",
        "This leg has not departed yet: record the departure first",
      );
    if (leg.arrivedAt !== null) throw new LogisticsInputError("at", "This leg has already arrived");
    if (Date.parse(args.at) < Date.parse(leg.departedAt))
      throw new LogisticsInputError("at", "Time: the arrival must not be before the departure");
  }
  if (name === "leg.cancel" && leg.departedAt !== null)
    throw new LogisticsInputError(
      "at",
      "This leg has already departed; only a planned leg can be cancelled",
    );
  await recordMutation(db, { campaignId, name, entityId: legId, args });
}

export const departLegLocally = (
  db: EquipotDb,
  campaignId: string,
  legId: string,
  at = new Date().toISOString(),
  note = "",
) => stepLeg(db, campaignId, legId, "leg.depart", at, note);

export const arriveLegLocally = (
  db: EquipotDb,
  campaignId: string,
  legId: string,
  at = new Date().toISOString(),
  note = "",
) => stepLeg(db, campaignId, legId, "leg.arrive", at, note);

export const cancelLegLocally = (
  db: EquipotDb,
  campaignId: string,
  legId: string,
  at = new Date().toISOString(),
  note = "",
) => stepLeg(db, campaignId, legId, "leg.cancel", at, note);

export interface HandoverDraft {
  readonly crateId: string;
  readonly legId?: string | null;
  readonly fromName: string;
  readonly toName: string;
  readonly at: string;
  readonly siteId?: string | null;
  readonly place?: string;
  readonly condition: HandoverCondition;
  readonly note?: string;
}

/** Custody runs in time order per crate: each handover comes after the last, from its receiver. */
export async function recordHandoverLocally(
  db: EquipotDb,
  campaignId: string,
  draft: HandoverDraft,
  id = crypto.randomUUID(),
): Promise<string> {
  const args = parse(handoverInput, { ...draft, id });
  // A deleted crate still takes handovers, as on the server: custody that happened is kept.
  const crate = await db.crates.get(args.crateId);
  if (!crate || crate.campaignId !== campaignId)
    throw new LogisticsInputError("crateId", "This crate is not on this device");
  if (args.siteId !== null) await requireSite(db, campaignId, args.siteId, "siteId");
  if (args.legId !== null) {
    const leg = await db.legs.get(args.legId);
    if (!leg || leg.campaignId !== campaignId || leg.crateId !== args.crateId)
      throw new LogisticsInputError("legId", "This leg is not one of this crate's legs");
  }
  const last = await lastHandover(db, campaignId, args.crateId);
  const problem = custodyProblem(last, args);
  if (problem?.kind === "out-of-order")
    throw new LogisticsInputError(
      "at",
      `Time: must be after the last handover of ${crate.label} (${last?.at}); custody is recorded in time order`,
    );
  if (problem?.kind === "wrong-giver")
    throw new LogisticsInputError(
      "fromName",
      `Handed over by: ${crate.label} is held by ${problem.holder}, not ${args.fromName}`,
    );
  const snapshot: HandoverSnapshot = { recordedByName: await readAuthorName(db) };
  await recordMutation(db, {
    campaignId,
    name: "handover.record",
    entityId: id,
    args,
    snapshot,
  });
  return id;
}

export async function acknowledgeAlertLocally(
  db: EquipotDb,
  campaignId: string,
  alertId: string,
  note = "",
  at = new Date().toISOString(),
): Promise<void> {
  const alert = await db.alerts.get(alertId);
  if (!alert || alert.campaignId !== campaignId)
    throw new LogisticsInputError("id", "This alert is not on this device");
  if (alert.acknowledgedAt !== null)
    throw new LogisticsInputError("id", "This alert is already acknowledged");
  const args = parse(alertAcknowledgeInput, { id: alertId, at, note });
  await recordMutation(db, { campaignId, name: "alert.acknowledge", entityId: alertId, args });
}

/** A crate as the server answered an edit, kept until the next pull brings the same record. */
export async function storeCrateLocally(db: EquipotDb, crate: CrateView): Promise<void> {
  await db.transaction("rw", db.crates, async () => {
    const current = await db.crates.get(crate.id);
    // Never step back: a pull may already have brought a newer version.
    if (current === undefined || current.version <= crate.version) await db.crates.put(crate);
  });
}
