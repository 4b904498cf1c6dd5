// The campaign's sites from this device's working copy, live: every local write and every pull
// shows at once. Writes go through src/db and are sent by the sync engine later.
import { useLiveQuery } from "dexie-react-hooks";
import type { SiteFormValues, SitePatch } from "../../../../shared/schemas";
import type { LocalSite } from "../../../db/database";
import { findSite, hasPulled, listSites } from "../../../db/queries";
import { createSiteLocally, deleteSiteLocally, updateSiteLocally } from "../../../db/site-store";
import { useLocalSync } from "../../../lib/sync-context";

export interface LocalSites {
  /** undefined while this device's store is being read. */
  sites: LocalSite[] | undefined;
  /** Whether the campaign was ever pulled onto this device. */
  pulled: boolean | undefined;
}

export function useLocalSites(campaignId: string): LocalSites {
  const { db } = useLocalSync();
  const sites = useLiveQuery(() => listSites(db, campaignId), [db, campaignId]);
  const pulled = useLiveQuery(() => hasPulled(db, campaignId), [db, campaignId]);
  return { sites, pulled };
}

/** undefined while reading, null when the site is not on this device. */
export function useLocalSite(campaignId: string, siteId: string): LocalSite | null | undefined {
  const { db } = useLocalSync();
  return useLiveQuery(() => findSite(db, campaignId, siteId), [db, campaignId, siteId]);
}

/** Each resolves once the write and its outbox entry are committed on this device. */
export function useSiteWrites(campaignId: string) {
  const { db, afterWrite } = useLocalSync();
  return {
    async create(values: SiteFormValues): Promise<string> {
      const id = await createSiteLocally(db, campaignId, values);
      afterWrite();
      return id;
    },
    async update(siteId: string, changes: SitePatch, seenBefore: SitePatch): Promise<boolean> {
      const changed = await updateSiteLocally(db, campaignId, siteId, changes, seenBefore);
      if (changed) afterWrite();
      return changed;
    },
    async remove(siteId: string): Promise<void> {
      await deleteSiteLocally(db, campaignId, siteId);
      afterWrite();
    },
  };
}
