// The tablet's IndexedDB: the campaign's working copy, the outbox and sync bookkeeping.
// This folder holds the only code that touches IndexedDB. Bump the version with an upgrade for every
// schema change, so that an app update never loses the outbox.
import { Dexie, type DexieOptions, type EntityTable } from "dexie";
import type { SiteView } from "../../shared/schemas/sites";
import type { ConflictView, MutationName, MutationResult } from "../../shared/sync/protocol";

export const localSchemaVersion = 1;

export interface OutboxEntry {
  mutationId: number;
  campaignId: string;
  name: MutationName;
  args: unknown;
  /** The record the mutation touches, so its working copy can be rebuilt. */
  entityId: string;
  createdAt: string;
  /** For conflict.resolve: the field chosen, so the working copy shows the choice at once. */
  field?: string;
  /** Set once a push was answered; the entry stays until a pull confirms it. */
  result?: MutationResult;
}

/** The working copy shown to the user: the server's record with this tablet's pending changes on top. */
export interface LocalSite extends SiteView {
  pendingChanges: number;
}

export interface LocalConflict extends ConflictView {
  campaignId: string;
}

/** A change the server refused, kept whole so nothing typed in the field is lost. */
export interface RecoveryEntry {
  id?: number;
  campaignId: string;
  mutationId: number;
  name: MutationName;
  args: unknown;
  reason: string;
  at: string;
}

export interface MetaRow {
  key: string;
  value: unknown;
}

export type EquipotDb = Dexie & {
  meta: EntityTable<MetaRow, "key">;
  outbox: EntityTable<OutboxEntry, "mutationId">;
  serverSites: EntityTable<SiteView, "id">;
  sites: EntityTable<LocalSite, "id">;
  conflicts: EntityTable<LocalConflict, "id">;
  recovery: EntityTable<RecoveryEntry, "id">;
};

export function openDatabase(name = "equipot", options?: DexieOptions): EquipotDb {
  const db = new Dexie(name, options) as EquipotDb;
  db.version(localSchemaVersion).stores({
    meta: "key",
    outbox: "mutationId, campaignId, entityId",
    serverSites: "id, campaignId",
    sites: "id, campaignId",
    conflicts: "id, campaignId, entityId",
    recovery: "++id, campaignId",
  });
  return db;
}
