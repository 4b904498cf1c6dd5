// Local field entries: shock indicators, logger events, temperatures, dew-point checks and
// observations. Each is checked as the server will check it, flagged against its crate's limits at
// once, and written with its outbox entry; several entries (an imported file's parts) go in one
// transaction, so an import is kept whole or not at all.
import type { z } from "zod";
import { assessEntry } from "../../shared/field-entries";
import {
  crateKinds,
  fieldEntryInput,
  type EntryFlags,
  type FieldEntryInput,
  type FieldEntryKind,
} from "../../shared/schemas/field-entries";
import type { EquipotDb } from "./database";
import type { EntrySnapshot } from "./field-entry-view";
import { readAuthorName, recordMutations, type LocalMutation } from "./outbox";

/** An entry as a screen fills it in; the store adds the id and the time it was written down. */
export type FieldEntryDraft = Omit<FieldEntryInput, "id" | "recordedAt"> & { id?: string };

export interface EntryIssue {
  field: string;
  message: string;
}

/** What is wrong with a draft, each problem naming its field as the server would name it. */
export class EntryInputError extends Error {
  readonly field: string;
  constructor(readonly issues: readonly EntryIssue[]) {
    super(issues.map((i) => i.message).join("; "));
    this.field = issues[0]?.field ?? "";
  }
}

function parseDraft(draft: FieldEntryDraft, recordedAt: string): z.output<typeof fieldEntryInput> {
  const parsed = fieldEntryInput.safeParse({
    ...draft,
    id: draft.id ?? crypto.randomUUID(),
    recordedAt,
  });
  if (parsed.success) return parsed.data;
  const issues = parsed.error.issues.map((i) => ({ field: i.path.join("."), message: i.message }));
  // The crate rule runs only once the rest is valid; say it together with the other problems.
  const kind = (draft.data as { kind?: FieldEntryKind } | undefined)?.kind;
  if (
    draft.crateId == null &&
    kind &&
    crateKinds.includes(kind) &&
    !issues.some((i) => i.field === "crateId")
  )
    issues.unshift({ field: "crateId", message: "Choose the crate this entry is about" });
  throw new EntryInputError(issues);
}

export async function addFieldEntriesLocally(
  db: EquipotDb,
  campaignId: string,
  drafts: readonly FieldEntryDraft[],
): Promise<{ id: string; flags: EntryFlags }[]> {
  if (drafts.length === 0) return [];
  const recordedAt = new Date().toISOString();
  const entries = drafts.map((d) => parseDraft(d, recordedAt));
  const recordedByName = await readAuthorName(db);
  const crateIds = [...new Set(entries.map((e) => e.crateId).filter((id) => id !== null))];
  const crates = new Map(
    (await db.crates.bulkGet(crateIds)).flatMap((c) => (c ? [[c.id, c]] : [])),
  );
  const site = await db.sites.get(entries[0]?.siteId ?? "");
  const results: { id: string; flags: EntryFlags }[] = [];
  const mutations: LocalMutation[] = entries.map((args) => {
    if (!site || site.campaignId !== campaignId || args.siteId !== site.id)
      throw new EntryInputError([{ field: "siteId", message: "This site is not on this device" }]);
    const crate = args.crateId === null ? null : crates.get(args.crateId);
    if (crate === undefined || (crate && crate.campaignId !== campaignId))
      throw new EntryInputError([
        { field: "crateId", message: "This crate is not on this device" },
      ]);
    const flags = assessEntry(args.data, crate);
    results.push({ id: args.id, flags });
    const snapshot: EntrySnapshot = { flags, recordedByName };
    return { campaignId, name: "entry.add", entityId: args.id, args, snapshot };
  });
  await recordMutations(db, mutations);
  return results;
}

export const addFieldEntryLocally = async (
  db: EquipotDb,
  campaignId: string,
  draft: FieldEntryDraft,
) => {
  const [result] = await addFieldEntriesLocally(db, campaignId, [draft]);
  if (!result) throw new Error("the entry was not written");
  return result;
};
