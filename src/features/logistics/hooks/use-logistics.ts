// Logistics from this device's store, live; writes go through src/db and are sent by the engine.
import { useLiveQuery } from "dexie-react-hooks";
import {
  countAttachmentsBySubject,
  findCrate,
  findHandover,
  listAlerts,
  listCrateAlerts,
  listCrateHandovers,
  listCrateLegs,
  listHandovers,
  listLegs,
} from "../../../db/logistics-queries";
import {
  acknowledgeAlertLocally,
  arriveLegLocally,
  cancelLegLocally,
  departLegLocally,
  planLegLocally,
  recordHandoverLocally,
  storeCrateLocally,
  type HandoverDraft,
  type LegDraft,
} from "../../../db/logistics-store";
import { listCrates } from "../../../db/field-entry-queries";
import { listSites } from "../../../db/queries";
import { useLocalSync } from "../../../lib/sync-context";
import type { CrateView } from "../../../../shared/schemas/crates";

export function useLogistics(campaignId: string) {
  const { db } = useLocalSync();
  return useLiveQuery(async () => {
    const [crates, legs, handovers, alerts, sites] = await Promise.all([
      listCrates(db, campaignId),
      listLegs(db, campaignId),
      listHandovers(db, campaignId),
      listAlerts(db, campaignId),
      listSites(db, campaignId),
    ]);
    return { crates, legs, handovers, alerts, sites };
  }, [db, campaignId]);
}

export function useCrateRecord(campaignId: string, crateId: string) {
  const { db } = useLocalSync();
  return useLiveQuery(async () => {
    const crate = await findCrate(db, campaignId, crateId);
    if (crate === null) return null;
    const [legs, chain, alerts, sites] = await Promise.all([
      listCrateLegs(db, campaignId, crateId),
      listCrateHandovers(db, campaignId, crateId),
      listCrateAlerts(db, campaignId, crateId),
      listSites(db, campaignId),
    ]);
    const photos = await countAttachmentsBySubject(
      db,
      campaignId,
      chain.map((h) => h.id),
    );
    return { crate, legs, chain, alerts, sites, photos };
  }, [db, campaignId, crateId]);
}

export function useHandoverRecord(campaignId: string, handoverId: string) {
  const { db } = useLocalSync();
  return useLiveQuery(async () => {
    const handover = await findHandover(db, campaignId, handoverId);
    if (handover === null) return null;
    const crate = await findCrate(db, campaignId, handover.crateId);
    return { handover, crate };
  }, [db, campaignId, handoverId]);
}

export function useLogisticsWrites(campaignId: string) {
  const { db, afterWrite } = useLocalSync();
  const after = <T>(done: T) => {
    afterWrite();
    return done;
  };
  return {
    plan: async (draft: LegDraft) => after(await planLegLocally(db, campaignId, draft)),
    depart: async (legId: string, at?: string) =>
      after(await departLegLocally(db, campaignId, legId, at)),
    arrive: async (legId: string, at?: string) =>
      after(await arriveLegLocally(db, campaignId, legId, at)),
    cancel: async (legId: string, at?: string) =>
      after(await cancelLegLocally(db, campaignId, legId, at)),
    handover: async (draft: HandoverDraft) =>
      after(await recordHandoverLocally(db, campaignId, draft)),
    acknowledge: async (alertId: string, note: string) =>
      after(await acknowledgeAlertLocally(db, campaignId, alertId, note)),
    /** The server's answer to a crate edit, shown at once (the next pull brings the same). */
    keepCrate: (crate: CrateView) => storeCrateLocally(db, crate),
  };
}
