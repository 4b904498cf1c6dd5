// Crates and field entries from this device's store, live; writes go through src/db and are sent
// by the engine.
import { useLiveQuery } from "dexie-react-hooks";
import type { LocalFieldEntry } from "../../../db/database";
import { listCrates, listSiteEntries } from "../../../db/field-entry-queries";
import { addFieldEntryLocally, type FieldEntryDraft } from "../../../db/field-entry-store";
import { useLocalSync } from "../../../lib/sync-context";

export function useCrates(campaignId: string) {
  const { db } = useLocalSync();
  return useLiveQuery(() => listCrates(db, campaignId), [db, campaignId]);
}

export function useSiteEntries(campaignId: string, siteId: string) {
  const { db } = useLocalSync();
  return useLiveQuery(() => listSiteEntries(db, campaignId, siteId), [db, campaignId, siteId]);
}

/** undefined while reading, null when the entry is not on this device. */
export function useFieldEntry(
  campaignId: string,
  entryId: string,
): LocalFieldEntry | null | undefined {
  const { db } = useLocalSync();
  return useLiveQuery(async () => {
    const entry = await db.fieldEntries.get(entryId);
    return entry && entry.campaignId === campaignId ? entry : null;
  }, [db, campaignId, entryId]);
}

export function useEntryWrites(campaignId: string) {
  const { db, afterWrite } = useLocalSync();
  return {
    add: async (draft: FieldEntryDraft) => {
      const saved = await addFieldEntryLocally(db, campaignId, draft);
      afterWrite();
      return saved;
    },
  };
}
