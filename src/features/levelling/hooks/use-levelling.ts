// The levelling field book from this device's store, live; writes go through src/db and are sent
// by the engine.
import { useLiveQuery } from "dexie-react-hooks";
import {
  closeSectionLocally,
  findLevellingSection,
  listLevellingSections,
  listLevellingSetups,
  listSetupsBySection,
  openSectionLocally,
  recordSetupLocally,
  type SectionDraft,
  type SetupDraft,
} from "../../../db/levelling-store";
import { useLocalSync } from "../../../lib/sync-context";

export function useSiteSections(campaignId: string, siteId: string) {
  const { db } = useLocalSync();
  return useLiveQuery(async () => {
    const sections = await listLevellingSections(db, campaignId, siteId);
    const setups = await listSetupsBySection(
      db,
      campaignId,
      sections.map((s) => s.id),
    );
    return { sections, setups };
  }, [db, campaignId, siteId]);
}

export function useLevellingSection(campaignId: string, sectionId: string) {
  const { db } = useLocalSync();
  const section = useLiveQuery(
    () => findLevellingSection(db, campaignId, sectionId),
    [db, campaignId, sectionId],
  );
  const setups = useLiveQuery(
    () => listLevellingSetups(db, campaignId, sectionId),
    [db, campaignId, sectionId],
  );
  return { section, setups };
}

export function useLevellingWrites(campaignId: string) {
  const { db, afterWrite } = useLocalSync();
  const after = <T>(done: T) => {
    afterWrite();
    return done;
  };
  return {
    open: async (draft: SectionDraft) => after(await openSectionLocally(db, campaignId, draft)),
    setup: async (sectionId: string, draft: SetupDraft) =>
      after(await recordSetupLocally(db, campaignId, sectionId, draft)),
    close: async (sectionId: string, note: string) =>
      after(await closeSectionLocally(db, campaignId, sectionId, note)),
  };
}
