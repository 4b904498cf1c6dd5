// A site's crates and temperature entries from this device's store, live; a manual reading is one
// entry written through src/db and sent by the sync engine later.
import { useLiveQuery } from "dexie-react-hooks";
import { listCrates, listSiteEntries } from "../../../db/field-entry-queries";
import { addFieldEntriesLocally } from "../../../db/field-entry-store";
import { useLocalSync } from "../../../lib/sync-context";

export function useSiteTemperatures(campaignId: string, siteId: string) {
  const { db } = useLocalSync();
  const crates = useLiveQuery(() => listCrates(db, campaignId), [db, campaignId]);
  const entries = useLiveQuery(
    async () =>
      (await listSiteEntries(db, campaignId, siteId)).filter((e) => e.kind === "temperatures"),
    [db, campaignId, siteId],
  );
  return { crates, entries };
}

export interface ManualReading {
  siteId: string;
  crateId: string;
  at: string;
  celsius: number;
  humidityPct: number | null;
  note: string;
}

export function useTemperatureWrites(campaignId: string) {
  const { db, afterWrite } = useLocalSync();
  return {
    addReading: async (r: ManualReading) => {
      const [result] = await addFieldEntriesLocally(db, campaignId, [
        {
          siteId: r.siteId,
          crateId: r.crateId,
          observedAt: r.at,
          note: r.note,
          data: {
            kind: "temperatures",
            source: "manual",
            loggerModel: "",
            import: null,
            samples: [{ at: r.at, celsius: r.celsius, humidityPct: r.humidityPct }],
          },
        },
      ]);
      afterWrite();
      return result;
    },
  };
}
