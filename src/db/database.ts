// The tablet's IndexedDB: the campaign's working copy, the outbox and sync bookkeeping.
// This folder holds the only code that touches IndexedDB. Bump the version with an upgrade for every
// schema change, so that an app update never loses the outbox.
import { Dexie, type DexieOptions, type EntityTable } from "dexie";
import type { AttachmentContentType, AttachmentLinkView } from "../../shared/schemas/attachments";
import type {
  ChecklistResultView,
  ChecklistRunView,
  ChecklistTemplateView,
} from "../../shared/schemas/checklists";
import type { CrateView } from "../../shared/schemas/crates";
import type { FieldEntryView } from "../../shared/schemas/field-entries";
import type { LevellingSectionView, LevellingSetupView } from "../../shared/schemas/levelling";
import type { AlertView, HandoverView, LegView } from "../../shared/schemas/logistics";
import type { ReviewView } from "../../shared/schemas/reviews";
import type { SiteView } from "../../shared/schemas/sites";
import type { ConflictView, MutationName, MutationResult } from "../../shared/sync/protocol";

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
  /** What the working copy needs beyond the arguments (a run's copied items, a result's flag). */
  snapshot?: unknown;
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

/** A link from a record to a file, as this device sees it (the server's, or one not yet sent). */
export interface LocalAttachment extends AttachmentLinkView {
  pending: boolean;
}

export type LocalFileState = "waiting" | "sent" | "refused";

/** The bytes of a photo or file, kept until the server has them and afterwards as a cache. */
export interface LocalFile {
  /** `${campaignId}:${sha256}`: the server keeps files per campaign. */
  key: string;
  campaignId: string;
  sha256: string;
  contentType: AttachmentContentType;
  sizeBytes: number;
  name: string;
  bytes: ArrayBuffer;
  state: LocalFileState;
  /** Why the server refused it, in its words. */
  refusal: string | null;
  addedAt: string;
  sentAt: string | null;
}

export const fileKey = (campaignId: string, sha256: string) => `${campaignId}:${sha256}`;

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
  serverAttachments: EntityTable<AttachmentLinkView, "id">;
  attachments: EntityTable<LocalAttachment, "id">;
  files: EntityTable<LocalFile, "key">;
  checklistTemplates: EntityTable<ChecklistTemplateView, "id">;
  serverChecklistRuns: EntityTable<ChecklistRunView, "id">;
  serverChecklistResults: EntityTable<ChecklistResultView, "id">;
  checklistRuns: EntityTable<LocalChecklistRun, "id">;
  checklistResults: EntityTable<LocalChecklistResult, "id">;
  crates: EntityTable<CrateView, "id">;
  serverFieldEntries: EntityTable<FieldEntryView, "id">;
  fieldEntries: EntityTable<LocalFieldEntry, "id">;
  serverLevellingSections: EntityTable<LevellingSectionView, "id">;
  levellingSections: EntityTable<LocalLevellingSection, "id">;
  serverLevellingSetups: EntityTable<LevellingSetupView, "id">;
  levellingSetups: EntityTable<LocalLevellingSetup, "id">;
  serverLegs: EntityTable<LegView, "id">;
  legs: EntityTable<LocalLeg, "id">;
  serverHandovers: EntityTable<HandoverView, "id">;
  handovers: EntityTable<LocalHandover, "id">;
  serverAlerts: EntityTable<AlertView, "id">;
  alerts: EntityTable<LocalAlert, "id">;
  reviews: EntityTable<LocalReview, "id">;
};

/** An office decision on a record, as pulled (read-only on the tablet). */
export interface LocalReview extends ReviewView {
  campaignId: string;
}

export interface LocalLeg extends LegView {
  pending: boolean;
}

export interface LocalHandover extends HandoverView {
  pending: boolean;
}

export interface LocalAlert extends AlertView {
  pending: boolean;
}

export interface LocalFieldEntry extends FieldEntryView {
  pending: boolean;
}

export interface LocalLevellingSection extends LevellingSectionView {
  pending: boolean;
}

export interface LocalLevellingSetup extends LevellingSetupView {
  pending: boolean;
}

export interface LocalChecklistRun extends ChecklistRunView {
  pending: boolean;
}

export interface LocalChecklistResult extends ChecklistResultView {
  pending: boolean;
}

/**
 * Every schema version ever shipped, oldest first. Never edit a shipped entry: add a new one (with
 * an upgrade function when rows must change), so a tablet updating the app keeps its outbox.
 */
export const schemaHistory: readonly { version: number; stores: Record<string, string | null> }[] =
  [
    {
      version: 1,
      stores: {
        meta: "key",
        outbox: "mutationId, campaignId, entityId",
        serverSites: "id, campaignId",
        sites: "id, campaignId",
        conflicts: "id, campaignId, entityId",
        recovery: "++id, campaignId",
      },
    },
    {
      version: 2,
      stores: {
        serverAttachments: "id, campaignId, subject.id",
        attachments: "id, campaignId, subject.id",
        files: "key, campaignId, state",
      },
    },
    {
      version: 3,
      stores: {
        checklistTemplates: "id, campaignId",
        serverChecklistRuns: "id, campaignId, siteId",
        serverChecklistResults: "id, campaignId, runId",
        checklistRuns: "id, campaignId, siteId",
        checklistResults: "id, campaignId, runId",
      },
    },
    {
      version: 4,
      // Waiting files by age from the index alone, without reading their bytes.
      stores: { files: "key, campaignId, state, [state+addedAt]" },
    },
    {
      version: 5,
      // Crates (read-only here for now), field entries and the levelling field book.
      stores: {
        crates: "id, campaignId",
        serverFieldEntries: "id, campaignId, siteId",
        fieldEntries: "id, campaignId, siteId, crateId",
        serverLevellingSections: "id, campaignId, siteId",
        levellingSections: "id, campaignId, siteId",
        serverLevellingSetups: "id, campaignId, sectionId",
        levellingSetups: "id, campaignId, sectionId",
      },
    },
    {
      version: 6,
      // Logistics: legs, handovers (custody) and alerts, each with a working copy.
      stores: {
        serverLegs: "id, campaignId, crateId",
        legs: "id, campaignId, crateId",
        serverHandovers: "id, campaignId, crateId",
        handovers: "id, campaignId, crateId",
        serverAlerts: "id, campaignId, crateId",
        alerts: "id, campaignId, crateId",
      },
    },
    {
      version: 7,
      // Office review decisions, read by record (the newest per record counts).
      stores: { reviews: "id, campaignId, subjectId, [campaignId+decision]" },
    },
  ];

export const localSchemaVersion = schemaHistory.at(-1)?.version ?? 1;

/** `upTo` opens an older version: only for tests of the upgrade path. */
export function openDatabase(
  name = "equipot",
  options?: DexieOptions,
  upTo = localSchemaVersion,
): EquipotDb {
  const db = new Dexie(name, options) as EquipotDb;
  for (const { version, stores } of schemaHistory)
    if (version <= upTo) db.version(version).stores(stores);
  return db;
}
