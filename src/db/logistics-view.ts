// Working copies of logistics: legs with this tablet's pending steps on top, handovers not yet
// confirmed (append-only), and alerts with a pending acknowledgement. Each step applies once, as on
// the server, so a replayed entry never moves a time.
import type { z } from "zod";
import type {
  AlertView,
  HandoverView,
  LegView,
  alertAcknowledgeInput,
  handoverInput,
  legPlanInput,
  legStepInput,
} from "../../shared/schemas/logistics";
import type { EquipotDb, LocalAlert, LocalHandover, LocalLeg, OutboxEntry } from "./database";
import { rebuildWorkingCopies } from "./working-copy";

export interface HandoverSnapshot {
  recordedByName: string | null;
}

// A step's note joins the leg's note on its own line, as the server keeps it.
const withStepNote = (current: string, step: string, note: string) =>
  note === "" ? current : [current, `${step}: ${note}`].filter((n) => n !== "").join("\n");

function applyLeg(record: LegView | undefined, entry: OutboxEntry): LegView | undefined {
  if (entry.name === "leg.plan") {
    if (record) return record;
    const args = entry.args as z.output<typeof legPlanInput>;
    return {
      ...args,
      campaignId: entry.campaignId,
      departedAt: null,
      arrivedAt: null,
      cancelledAt: null,
      createdBy: null,
    };
  }
  if (!record || record.cancelledAt !== null) return record;
  const { at, note } = entry.args as z.output<typeof legStepInput>;
  if (entry.name === "leg.depart" && record.departedAt === null)
    return { ...record, departedAt: at, note: withStepNote(record.note, "Departure", note) };
  if (entry.name === "leg.arrive" && record.departedAt !== null && record.arrivedAt === null)
    return { ...record, arrivedAt: at, note: withStepNote(record.note, "Arrival", note) };
  if (entry.name === "leg.cancel" && record.departedAt === null)
    return { ...record, cancelledAt: at, note: withStepNote(record.note, "Cancelled", note) };
  return record;
}

function applyHandover(record: HandoverView | undefined, entry: OutboxEntry) {
  if (entry.name !== "handover.record" || record) return record;
  const args = entry.args as z.output<typeof handoverInput>;
  const snapshot = entry.snapshot as HandoverSnapshot | undefined;
  return {
    ...args,
    campaignId: entry.campaignId,
    recordedBy: null,
    recordedByName: snapshot?.recordedByName ?? null,
    recordedAt: entry.createdAt,
  } satisfies HandoverView;
}

function applyAlert(record: AlertView | undefined, entry: OutboxEntry) {
  if (entry.name !== "alert.acknowledge" || !record || record.acknowledgedAt !== null)
    return record;
  const args = entry.args as z.output<typeof alertAcknowledgeInput>;
  return { ...record, acknowledgedAt: args.at, acknowledgeNote: args.note };
}

/** Call inside a transaction over the view tables (views.ts). */
export const rebuildLegViews = (db: EquipotDb, ids: Iterable<string>) =>
  rebuildWorkingCopies(db, {
    ids,
    server: db.serverLegs,
    working: db.legs,
    kind: "legs",
    apply: applyLeg,
    finish: (view, pending): LocalLeg => ({ ...view, pending: pending.length > 0 }),
  });

export const rebuildHandoverViews = (db: EquipotDb, ids: Iterable<string>) =>
  rebuildWorkingCopies(db, {
    ids,
    server: db.serverHandovers,
    working: db.handovers,
    kind: "handovers",
    apply: applyHandover,
    finish: (view, pending): LocalHandover => ({ ...view, pending: pending.length > 0 }),
  });

export const rebuildAlertViews = (db: EquipotDb, ids: Iterable<string>) =>
  rebuildWorkingCopies(db, {
    ids,
    server: db.serverAlerts,
    working: db.alerts,
    kind: "alerts",
    apply: applyAlert,
    finish: (view, pending): LocalAlert => ({ ...view, pending: pending.length > 0 }),
  });
