// The transport record from this device's store, live: crates, legs, handovers, alerts, the
// field entries that judge crates against their limits, and the sites to name places.
import { useLiveQuery } from "dexie-react-hooks";
import { listCrates } from "../../../db/field-entry-queries";
import { listAlerts, listHandovers, listLegs } from "../../../db/logistics-queries";
import { listSites } from "../../../db/queries";
import { useLocalSync } from "../../../lib/sync-context";
import { summariseTransport, type CrateTransport } from "../lib/transport-summary";

/** undefined while the store is being read. */
export function useTransportSummary(campaignId: string): CrateTransport[] | undefined {
  const { db } = useLocalSync();
  return useLiveQuery(async () => {
    const [crates, legs, handovers, alerts, sites, entries] = await Promise.all([
      listCrates(db, campaignId),
      listLegs(db, campaignId),
      listHandovers(db, campaignId),
      listAlerts(db, campaignId),
      listSites(db, campaignId),
      db.fieldEntries.where("campaignId").equals(campaignId).toArray(),
    ]);
    return summariseTransport({ crates, legs, handovers, alerts, sites, entries });
  }, [db, campaignId]);
}
