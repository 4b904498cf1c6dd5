// Reads of the working copy, for live queries (dexie-react-hooks) and tests. Components reach them
// through hooks, never Dexie itself.
import { Dexie } from "dexie";
import type { ChecklistTemplateView } from "../../shared/schemas/checklists";
import {
  fileKey,
  type EquipotDb,
  type LocalAttachment,
  type LocalChecklistRun,
  type LocalConflict,
  type LocalFile,
  type LocalSite,
  type RecoveryEntry,
} from "./database";
import { cursorKey } from "./meta";

const byName = (a: LocalSite, b: LocalSite) =>
  a.name.localeCompare(b.name, undefined, { sensitivity: "base" }) || a.id.localeCompare(b.id);

/** The campaign's sites as this device sees them, deleted ones left out, sorted by name. */
export async function listSites(db: EquipotDb, campaignId: string): Promise<LocalSite[]> {
  const sites = await db.sites.where("campaignId").equals(campaignId).toArray();
  return sites.filter((site) => site.deletedAt === null).sort(byName);
}

/** One site of the campaign, or null when it is not on this device (or deleted). */
export async function findSite(
  db: EquipotDb,
  campaignId: string,
  siteId: string,
): Promise<LocalSite | null> {
  const site = await db.sites.get(siteId);
  if (site === undefined || site.campaignId !== campaignId || site.deletedAt !== null) return null;
  return site;
}

/** True once at least one page of the campaign was pulled onto this device. */
export async function hasPulled(db: EquipotDb, campaignId: string): Promise<boolean> {
  return (await db.meta.get(cursorKey(campaignId))) !== undefined;
}

/** Conflicts a person still has to decide, oldest first. */
export async function listOpenConflicts(
  db: EquipotDb,
  campaignId: string,
): Promise<LocalConflict[]> {
  const all = await db.conflicts.where("campaignId").equals(campaignId).toArray();
  return all
    .filter((conflict) => conflict.resolvedAt === null)
    .sort((a, b) => a.openedAt.localeCompare(b.openedAt));
}

/** Changes the server refused, newest first. */
export async function listRecovery(db: EquipotDb, campaignId: string): Promise<RecoveryEntry[]> {
  const all = await db.recovery.where("campaignId").equals(campaignId).toArray();
  return all.sort((a, b) => b.mutationId - a.mutationId);
}

/** Names of sites by id (deleted ones too), to label conflicts and refused changes. */
export async function siteNames(db: EquipotDb, campaignId: string): Promise<Map<string, string>> {
  const sites = await db.sites.where("campaignId").equals(campaignId).toArray();
  const server = await db.serverSites.where("campaignId").equals(campaignId).toArray();
  return new Map([...server, ...sites].map((site) => [site.id, site.name]));
}

/** Photos and files attached to one record, oldest first, removed ones left out. */
export async function listAttachments(
  db: EquipotDb,
  campaignId: string,
  subjectId: string,
): Promise<LocalAttachment[]> {
  const all = await db.attachments.where("subject.id").equals(subjectId).toArray();
  return all
    .filter((a) => a.campaignId === campaignId && a.removedAt === null)
    .sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.id.localeCompare(b.id));
}

/** The file's bytes and upload state on this device, or null when it is not here (yet). */
export async function findFile(
  db: EquipotDb,
  campaignId: string,
  sha256: string,
): Promise<LocalFile | null> {
  return (await db.files.get(fileKey(campaignId, sha256))) ?? null;
}

/** Files the server would not take, kept here so they can be saved elsewhere. */
export async function listRefusedFiles(db: EquipotDb, campaignId: string): Promise<LocalFile[]> {
  const all = await db.files.where("state").equals("refused").toArray();
  return all.filter((f) => f.campaignId === campaignId);
}

const purposeOrder = [
  "arrival",
  "unpacking",
  "vacuum-bakeout",
  "laser-lockup",
  "comparison-start",
  "pack-down",
  "other",
];

/** The campaign's checklist templates in the order of a site's days. */
export async function listChecklistTemplates(
  db: EquipotDb,
  campaignId: string,
): Promise<ChecklistTemplateView[]> {
  const all = await db.checklistTemplates.where("campaignId").equals(campaignId).toArray();
  return all
    .filter((t) => t.deletedAt === null)
    .sort(
      (a, b) =>
        purposeOrder.indexOf(a.purpose) - purposeOrder.indexOf(b.purpose) ||
        a.title.localeCompare(b.title),
    );
}

/** Runs at one site, the open ones first, newest first within each. */
export async function listChecklistRuns(
  db: EquipotDb,
  campaignId: string,
  siteId: string,
): Promise<LocalChecklistRun[]> {
  const all = await db.checklistRuns.where("siteId").equals(siteId).toArray();
  return all
    .filter((r) => r.campaignId === campaignId)
    .sort(
      (a, b) =>
        Number(a.signedOffAt !== null) - Number(b.signedOffAt !== null) ||
        b.startedAt.localeCompare(a.startedAt),
    );
}

export async function findChecklistRun(
  db: EquipotDb,
  campaignId: string,
  runId: string,
): Promise<LocalChecklistRun | null> {
  const run = await db.checklistRuns.get(runId);
  return run !== undefined && run.campaignId === campaignId ? run : null;
}

/** How many files wait to be sent and when the oldest was kept, read from an index (no bytes). */
export async function waitingFiles(
  db: EquipotDb,
): Promise<{ count: number; oldestAt: string | null }> {
  const keys = await db.files
    .where("[state+addedAt]")
    .between(["waiting", Dexie.minKey], ["waiting", Dexie.maxKey])
    .keys();
  const first = keys[0] as [string, string] | undefined;
  return { count: keys.length, oldestAt: first?.[1] ?? null };
}
