// Crates from this device's store, live, and the one write an import makes: every part in one
// transaction through src/db, sent by the sync engine later.
import { useLiveQuery } from "dexie-react-hooks";
import { listCrates } from "../../../db/field-entry-queries";
import { addFieldEntriesLocally } from "../../../db/field-entry-store";
import { useLocalSync } from "../../../lib/sync-context";
import type { ImportDraft } from "../parse/split";

export function useCrates(campaignId: string) {
  const { db } = useLocalSync();
  return useLiveQuery(() => listCrates(db, campaignId), [db, campaignId]);
}

export function useImportWrites(campaignId: string) {
  const { db, afterWrite } = useLocalSync();
  return {
    save: async (drafts: ImportDraft[]) => {
      const results = await addFieldEntriesLocally(db, campaignId, drafts);
      afterWrite();
      return results;
    },
  };
}
