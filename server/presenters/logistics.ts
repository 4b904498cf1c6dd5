import type { HandoverView, LegView } from "../../shared/schemas/logistics";
import type { HandoverRow } from "../db/repositories/handovers";
import type { LegRow } from "../db/repositories/legs";

export const presentLeg = (row: LegRow): LegView => ({
  id: row.id,
  campaignId: row.campaignId,
  crateId: row.crateId,
  fromSiteId: row.fromSiteId,
  toSiteId: row.toSiteId,
  vehicle: row.vehicle,
  plannedDepartAt: row.plannedDepartAt.toISOString(),
  plannedArriveAt: row.plannedArriveAt.toISOString(),
  departedAt: row.departedAt?.toISOString() ?? null,
  arrivedAt: row.arrivedAt?.toISOString() ?? null,
  cancelledAt: row.cancelledAt?.toISOString() ?? null,
  note: row.note,
  createdBy: row.createdBy,
});

export const presentHandover = (row: HandoverRow): HandoverView => ({
  id: row.id,
  campaignId: row.campaignId,
  crateId: row.crateId,
  legId: row.legId,
  fromName: row.fromName,
  toName: row.toName,
  at: row.at.toISOString(),
  siteId: row.siteId,
  place: row.place,
  condition: row.condition,
  note: row.note,
  recordedBy: row.recordedBy,
  recordedByName: row.recordedByName,
  recordedAt: row.recordedAt.toISOString(),
});
