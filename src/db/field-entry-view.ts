// Working copies of field entries: the server's entry, or this tablet's entry not yet confirmed. The
// outbox entry's snapshot carries what the arguments do not: the flags computed on the tablet against
// the crate's limits, and the author's name.
import type { z } from "zod";
import type {
  EntryFlags,
  FieldEntryView,
  fieldEntryInput,
} from "../../shared/schemas/field-entries";
import type { EquipotDb, LocalFieldEntry, OutboxEntry } from "./database";
import { rebuildWorkingCopies } from "./working-copy";

export interface EntrySnapshot {
  flags: EntryFlags;
  recordedByName: string | null;
}

function applyEntry(record: FieldEntryView | undefined, entry: OutboxEntry) {
  // Append-only: the server's copy, once pulled, is the entry.
  if (entry.name !== "entry.add" || record) return record;
  const args = entry.args as z.output<typeof fieldEntryInput>;
  const snapshot = entry.snapshot as EntrySnapshot;
  return {
    id: args.id,
    campaignId: entry.campaignId,
    siteId: args.siteId,
    crateId: args.crateId,
    kind: args.data.kind,
    observedAt: args.observedAt,
    note: args.note,
    data: args.data,
    flags: snapshot.flags,
    recordedAt: args.recordedAt,
    recordedBy: null,
    recordedByName: snapshot.recordedByName,
  } satisfies FieldEntryView;
}

/** Call inside a transaction over the view tables (views.ts). */
export const rebuildFieldEntryViews = (db: EquipotDb, ids: Iterable<string>) =>
  rebuildWorkingCopies(db, {
    ids,
    server: db.serverFieldEntries,
    working: db.fieldEntries,
    kind: "fieldEntries",
    apply: applyEntry,
    finish: (view, pending): LocalFieldEntry => ({ ...view, pending: pending.length > 0 }),
  });
