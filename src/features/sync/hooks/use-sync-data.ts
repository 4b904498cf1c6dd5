// Conflicts and refused changes of a campaign, live from this device's store.
import { useLiveQuery } from "dexie-react-hooks";
import type { LocalConflict, LocalFile, RecoveryEntry } from "../../../db/database";
import { exportOutbox, exportRecovery, unsentFiles } from "../../../db/export";
import { listOpenConflicts, listRecovery, listRefusedFiles, siteNames } from "../../../db/queries";
import { dismissRecovery, forgetRefusedFile } from "../../../db/recovery-store";
import { resolveConflictLocally } from "../../../db/site-store";
import { downloadBlob, downloadJson, exportFileName } from "../../../lib/download";
import { useLocalSync } from "../../../lib/sync-context";

export interface CampaignReview {
  conflicts: LocalConflict[] | undefined;
  recovery: RecoveryEntry[] | undefined;
  refusedFiles: LocalFile[] | undefined;
  names: Map<string, string>;
}

export function useCampaignReview(campaignId: string): CampaignReview {
  const { db } = useLocalSync();
  const conflicts = useLiveQuery(() => listOpenConflicts(db, campaignId), [db, campaignId]);
  const recovery = useLiveQuery(() => listRecovery(db, campaignId), [db, campaignId]);
  const refusedFiles = useLiveQuery(() => listRefusedFiles(db, campaignId), [db, campaignId]);
  const names = useLiveQuery(() => siteNames(db, campaignId), [db, campaignId], new Map());
  return { conflicts, recovery, refusedFiles, names };
}

/** How many things in the campaign wait for a person: open conflicts, refused changes and files. */
export function useReviewCount(campaignId: string): number {
  const { conflicts, recovery, refusedFiles } = useCampaignReview(campaignId);
  return (conflicts?.length ?? 0) + (recovery?.length ?? 0) + (refusedFiles?.length ?? 0);
}

export function useRecoveryActions(campaignId: string) {
  const { db } = useLocalSync();
  return {
    dismiss: (id: number) => dismissRecovery(db, id),
    forgetFile: (sha256: string) => forgetRefusedFile(db, campaignId, sha256),
  };
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
    /** JSON alone, or a ZIP holding the JSON and the bytes when photos or files wait too. */
    async outbox() {
      const changes = await exportOutbox(db);
      const files = await unsentFiles(db);
      if (files.length === 0) {
        downloadJson(exportFileName("unsent-changes"), changes);
        return;
      }
      // The ZIP library loads only when a ZIP is asked for: it stays out of the start-up code.
      const { zipUnsent } = await import("../zip-unsent");
      const archive = zipUnsent(changes, files);
      downloadBlob(exportFileName("unsent-changes", new Date(), "zip"), archive);
    },
    async recovery(campaignId: string) {
      downloadJson(exportFileName("kept-for-recovery"), await exportRecovery(db, campaignId));
    },
  };
}
