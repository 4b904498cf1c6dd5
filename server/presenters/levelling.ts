import {
  levellingClosure,
  type LevellingSectionView,
  type LevellingSetupView,
} from "../../shared/schemas/levelling";
import type { LevellingSectionRow, LevellingSetupRow } from "../db/repositories/levelling";

// The closure is only written as computed at closing; parsing keeps the view honest.
export const presentSection = (row: LevellingSectionRow): LevellingSectionView => ({
  id: row.id,
  campaignId: row.campaignId,
  siteId: row.siteId,
  fromMark: row.fromMark,
  toMark: row.toMark,
  classId: row.classId,
  instrument: row.instrument,
  openedAt: row.openedAt.toISOString(),
  openedBy: row.openedBy,
  closedAt: row.closedAt?.toISOString() ?? null,
  closedBy: row.closedBy,
  closeNote: row.closeNote,
  closure: row.closure === null ? null : levellingClosure.parse(row.closure),
});

export const presentSetup = (row: LevellingSetupRow): LevellingSetupView => ({
  id: row.id,
  campaignId: row.campaignId,
  sectionId: row.sectionId,
  run: row.run,
  number: row.number,
  backsightM: row.backsightM,
  foresightM: row.foresightM,
  backsightDistanceM: row.backsightDistanceM,
  foresightDistanceM: row.foresightDistanceM,
  note: row.note,
  recordedAt: row.recordedAt.toISOString(),
  recordedBy: row.recordedBy,
  recordedByName: row.recordedByName,
});
