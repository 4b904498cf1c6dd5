// Checklists from this device's store, live; writes go through src/db and are sent by the engine.
import { useLiveQuery } from "dexie-react-hooks";
import type { ChecklistValue } from "../../../../shared/schemas/checklists";
import {
  latestResults,
  recordResultLocally,
  signOffLocally,
  startChecklistLocally,
} from "../../../db/checklist-store";
import { findChecklistRun, listChecklistRuns, listChecklistTemplates } from "../../../db/queries";
import { addAttachmentLocally } from "../../../db/attachment-store";
import { prepareFile } from "../../../lib/prepare-file";
import { useLocalSync } from "../../../lib/sync-context";

export function useSiteChecklists(campaignId: string, siteId: string) {
  const { db } = useLocalSync();
  const templates = useLiveQuery(() => listChecklistTemplates(db, campaignId), [db, campaignId]);
  const runs = useLiveQuery(
    () => listChecklistRuns(db, campaignId, siteId),
    [db, campaignId, siteId],
  );
  return { templates, runs };
}

export function useChecklistRun(campaignId: string, runId: string) {
  const { db } = useLocalSync();
  const run = useLiveQuery(() => findChecklistRun(db, campaignId, runId), [db, campaignId, runId]);
  const results = useLiveQuery(() => latestResults(db, runId), [db, runId]);
  return { run, results };
}

export function useChecklistWrites(campaignId: string) {
  const { db, afterWrite } = useLocalSync();
  const after = <T>(done: T) => {
    afterWrite();
    return done;
  };
  return {
    start: async (templateId: string, siteId: string) =>
      after(await startChecklistLocally(db, campaignId, templateId, siteId)),
    record: async (runId: string, itemId: string, value: ChecklistValue) =>
      after(await recordResultLocally(db, campaignId, runId, itemId, value)),
    signOff: async (runId: string, note: string) =>
      after(await signOffLocally(db, campaignId, runId, note)),
    /** The photo is kept and linked to the run; the item's result names the link. */
    photo: async (runId: string, itemId: string, file: File) => {
      const prepared = await prepareFile(file);
      const subject = { kind: "checklistRun" as const, id: runId };
      const linkId = await addAttachmentLocally(db, campaignId, { subject, ...prepared });
      return after(await recordResultLocally(db, campaignId, runId, itemId, linkId));
    },
  };
}
