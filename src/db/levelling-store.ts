// Local levelling writes: open a section, record a setup (a correction is a newer setup with the
// same number), close the section. Each is one transaction with its outbox entry (outbox.ts); the
// server's checks run here first, so a refusal shows at the instrument, not at the next sync.
import type { z } from "zod";
import { describeMisclosure, summariseSection, type BookSetup } from "../../shared/levelling-book";
import { findLevellingClass } from "../../shared/science/levelling/misclosure";
import {
  levellingCloseInput,
  levellingOpenInput,
  levellingSetupInput,
  type LevellingRun,
} from "../../shared/schemas/levelling";
import type { EquipotDb, LocalLevellingSection, LocalLevellingSetup } from "./database";
import type { CloseSnapshot, SetupSnapshot } from "./levelling-view";
import { readAuthorName, recordMutation } from "./outbox";

/** The first problem of an input, naming its field as the schema names it. */
export class LevellingInputError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = "LevellingInputError";
  }
}

// Fields whose schema messages do not say which field they are about.
const unnamed: Record<string, string> = { number: "Setup number", run: "Run", id: "id" };

function parse<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const field = issue?.path.join(".") ?? "";
  const message = issue?.message ?? "Invalid input";
  const label = unnamed[field];
  throw new LevellingInputError(field, label === undefined ? message : `${label}: ${message}`);
}

export interface SectionDraft {
  readonly siteId: string;
  readonly fromMark: string;
  readonly toMark: string;
  readonly classId: string;
  readonly instrument: string;
}

export interface SetupDraft {
  readonly run: LevellingRun;
  readonly number: number;
  readonly backsightM: number;
  readonly foresightM: number;
  readonly backsightDistanceM: number;
  readonly foresightDistanceM: number;
  readonly note?: string;
}

export async function openSectionLocally(
  db: EquipotDb,
  campaignId: string,
  draft: SectionDraft,
  id = crypto.randomUUID(),
): Promise<string> {
  const args = parse(levellingOpenInput, { ...draft, id, openedAt: new Date().toISOString() });
  const site = await db.sites.get(args.siteId);
  if (!site || site.campaignId !== campaignId || site.deletedAt !== null)
    throw new LevellingInputError("siteId", "This site is not on this device");
  await recordMutation(db, { campaignId, name: "levelling.open", entityId: id, args });
  return id;
}

async function openSection(
  db: EquipotDb,
  campaignId: string,
  sectionId: string,
  closedMessage = "This section is closed and takes no more setups",
): Promise<LocalLevellingSection> {
  const section = await db.levellingSections.get(sectionId);
  if (!section || section.campaignId !== campaignId)
    throw new Error("This levelling section is not on this device");
  if (section.closedAt !== null) throw new Error(closedMessage);
  return section;
}

export async function recordSetupLocally(
  db: EquipotDb,
  campaignId: string,
  sectionId: string,
  draft: SetupDraft,
  id = crypto.randomUUID(),
): Promise<string> {
  await openSection(db, campaignId, sectionId);
  const args = parse(levellingSetupInput, {
    ...draft,
    note: draft.note ?? "",
    id,
    sectionId,
    recordedAt: new Date().toISOString(),
  });
  const snapshot: SetupSnapshot = { recordedByName: await readAuthorName(db) };
  await recordMutation(db, { campaignId, name: "levelling.setup", entityId: id, args, snapshot });
  return id;
}

/** Refused when a run has no setup, and when out of tolerance without a reason in the note. */
export async function closeSectionLocally(
  db: EquipotDb,
  campaignId: string,
  sectionId: string,
  note = "",
): Promise<void> {
  const section = await openSection(db, campaignId, sectionId, "This section is already closed");
  const args = parse(levellingCloseInput, {
    id: sectionId,
    closedAt: new Date().toISOString(),
    note,
  });
  const setups = await listLevellingSetups(db, campaignId, sectionId);
  const missing = (["forward", "backward"] as const).filter(
    (run) => !setups.some((s) => s.run === run),
  );
  if (missing.length > 0)
    throw new Error(`Not closed: the ${missing.join(" and ")} run has no setups yet`);
  const summary = summariseSection(section.classId, setups);
  const { misclosure, closure } = summary;
  if (misclosure === null || closure === null)
    throw new Error("Not closed: no sight distances yet, so the section has no length to judge");
  if (!misclosure.withinTolerance && args.note === "") {
    const words = describeMisclosure(misclosure, findLevellingClass(section.classId));
    throw new LevellingInputError(
      "note",
      `Out of tolerance: ${words}. Re-level, or give the reason for closing anyway`,
    );
  }
  const snapshot: CloseSnapshot = { closure };
  await recordMutation(db, {
    campaignId,
    name: "levelling.close",
    entityId: sectionId,
    args,
    snapshot,
  });
}

/** A site's sections, newest first. */
export async function listLevellingSections(
  db: EquipotDb,
  campaignId: string,
  siteId: string,
): Promise<LocalLevellingSection[]> {
  const all = await db.levellingSections.where("siteId").equals(siteId).toArray();
  return all
    .filter((s) => s.campaignId === campaignId)
    .sort((a, b) => b.openedAt.localeCompare(a.openedAt) || a.id.localeCompare(b.id));
}

export async function findLevellingSection(
  db: EquipotDb,
  campaignId: string,
  sectionId: string,
): Promise<LocalLevellingSection | null> {
  const section = await db.levellingSections.get(sectionId);
  return section && section.campaignId === campaignId ? section : null;
}

/** Every setup of a section, corrections included (shared/levelling-book picks the current ones). */
export async function listLevellingSetups(
  db: EquipotDb,
  campaignId: string,
  sectionId: string,
): Promise<LocalLevellingSetup[]> {
  const all = await db.levellingSetups.where("sectionId").equals(sectionId).toArray();
  return all.filter((s) => s.campaignId === campaignId);
}

/** The setups of a campaign's sections at a site, by section id (for the list's live misclosure). */
export async function listSetupsBySection(
  db: EquipotDb,
  campaignId: string,
  sectionIds: readonly string[],
): Promise<Map<string, BookSetup[]>> {
  const all = await db.levellingSetups.where("sectionId").anyOf(sectionIds).toArray();
  const out = new Map<string, BookSetup[]>();
  for (const s of all) {
    if (s.campaignId !== campaignId) continue;
    const list = out.get(s.sectionId) ?? [];
    list.push(s);
    out.set(s.sectionId, list);
  }
  return out;
}
