// Conflicts and refused changes of a campaign, live from this device's store.
import { useLiveQuery } from "dexie-react-hooks";
import type { LocalConflict, RecoveryEntry } from "../../../db/database";
import { exportOutbox, exportRecovery } from "../../../db/export";
import { listOpenConflicts, listRecovery, siteNames } from "../../../db/queries";
import { resolveConflictLocally } from "../../../db/site-store";
import { downloadJson, exportFileName } from "../../../lib/download";
import { useLocalSync } from "../../../lib/sync-context";

export interface CampaignReview {
  conflicts: LocalConflict[] | undefined;
  recovery: RecoveryEntry[] | undefined;
  names: Map<string, string>;
}

export function useCampaignReview(campaignId: string): CampaignReview {
  const { db } = useLocalSync();
  const conflicts = useLiveQuery(() => listOpenConflicts(db, campaignId), [db, campaignId]);
  const recovery = useLiveQuery(() => listRecovery(db, campaignId), [db, campaignId]);
  const names = useLiveQuery(() => siteNames(db, campaignId), [db, campaignId], new Map());
  return { conflicts, recovery, names };
}

/** How many things in the campaign wait for a person: open conflicts plus refused changes. */
export function useReviewCount(campaignId: string): number {
  const { conflicts, recovery } = useCampaignReview(campaignId);
  return (conflicts?.length ?? 0) + (recovery?.length ?? 0);
}

export function useResolveConflict(campaignId: string) {
  const { db, afterWrite } = useLocalSync();
  return async (conflictId: string, value: unknown) => {
    await resolveConflictLocally(db, campaignId, conflictId, value);
    afterWrite();
  };
}

export function useDownloads() {
  const { db } = useLocalSync();
  return {
    async outbox() {
      downloadJson(exportFileName("unsent-changes"), await exportOutbox(db));
    },
    async recovery(campaignId: string) {
      downloadJson(exportFileName("kept-for-recovery"), await exportRecovery(db, campaignId));
    },
  };
}
