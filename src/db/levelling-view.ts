// Working copies of the levelling field book: sections with this tablet's pending open and close on
// top, and setups not yet confirmed. Snapshots carry the closure computed on the tablet and the
// author's name.
import type { z } from "zod";
import type {
  LevellingClosure,
  LevellingSectionView,
  LevellingSetupView,
  levellingCloseInput,
  levellingOpenInput,
  levellingSetupInput,
} from "../../shared/schemas/levelling";
import type {
  EquipotDb,
  LocalLevellingSection,
  LocalLevellingSetup,
  OutboxEntry,
} from "./database";
import { rebuildWorkingCopies } from "./working-copy";

export interface CloseSnapshot {
  closure: LevellingClosure;
}

export interface SetupSnapshot {
  recordedByName: string | null;
}

function applySection(record: LevellingSectionView | undefined, entry: OutboxEntry) {
  if (entry.name === "levelling.open" && !record) {
    const args = entry.args as z.output<typeof levellingOpenInput>;
    return {
      id: args.id,
      campaignId: entry.campaignId,
      siteId: args.siteId,
      fromMark: args.fromMark,
      toMark: args.toMark,
      classId: args.classId,
      instrument: args.instrument,
      openedAt: args.openedAt,
      openedBy: null,
      closedAt: null,
      closedBy: null,
      closeNote: "",
      closure: null,
    } satisfies LevellingSectionView;
  }
  if (entry.name === "levelling.close" && record && record.closedAt === null) {
    const args = entry.args as z.output<typeof levellingCloseInput>;
    const { closure } = entry.snapshot as CloseSnapshot;
    return { ...record, closedAt: args.closedAt, closeNote: args.note, closure };
  }
  return record;
}

function applySetup(record: LevellingSetupView | undefined, entry: OutboxEntry) {
  if (entry.name !== "levelling.setup" || record) return record;
  const args = entry.args as z.output<typeof levellingSetupInput>;
  const snapshot = entry.snapshot as SetupSnapshot | undefined;
  return {
    ...args,
    campaignId: entry.campaignId,
    recordedBy: null,
    recordedByName: snapshot?.recordedByName ?? null,
  } satisfies LevellingSetupView;
}

/** Call inside a transaction over the view tables (views.ts). */
export const rebuildLevellingSectionViews = (db: EquipotDb, ids: Iterable<string>) =>
  rebuildWorkingCopies(db, {
    ids,
    server: db.serverLevellingSections,
    working: db.levellingSections,
    kind: "levellingSections",
    apply: applySection,
    finish: (view, pending): LocalLevellingSection => ({ ...view, pending: pending.length > 0 }),
  });

export const rebuildLevellingSetupViews = (db: EquipotDb, ids: Iterable<string>) =>
  rebuildWorkingCopies(db, {
    ids,
    server: db.serverLevellingSetups,
    working: db.levellingSetups,
    kind: "levellingSetups",
    apply: applySetup,
    finish: (view, pending): LocalLevellingSetup => ({ ...view, pending: pending.length > 0 }),
  });
