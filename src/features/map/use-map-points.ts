// Everything the map shows, from this device: sites, crates, entries and legs from the local store,
// benchmarks from the (persisted) REST cache.
import { useMemo } from "react";
import { useLiveQuery } from "dexie-react-hooks";
import { listCrates } from "../../db/field-entry-queries";
import { listSites } from "../../db/queries";
import { useLocalSync } from "../../lib/sync-context";
import { useBenchmarks } from "./api/get-benchmarks";
import { buildMapPoints, type MapPoint } from "./map-data";

export interface MapPointsState {
  /** undefined while the local store is being read. */
  points: MapPoint[] | undefined;
  benchmarks: "loading" | "ready" | "unavailable";
}

export function useMapPoints(campaignId: string): MapPointsState {
  const { db } = useLocalSync();
  const local = useLiveQuery(async () => {
    const [sites, crates, fieldEntries, legs] = await Promise.all([
      listSites(db, campaignId),
      listCrates(db, campaignId),
      db.fieldEntries.where("campaignId").equals(campaignId).toArray(),
      db.legs.where("campaignId").equals(campaignId).toArray(),
    ]);
    // An arrival places a crate as surely as an entry does: the latest of either counts.
    const arrivals = legs.flatMap((l) =>
      l.arrivedAt === null || l.cancelledAt !== null
        ? []
        : [{ id: l.id, siteId: l.toSiteId, crateId: l.crateId, observedAt: l.arrivedAt }],
    );
    return { sites, crates, entries: [...fieldEntries, ...arrivals] };
  }, [db, campaignId]);
  const benchmarks = useBenchmarks(campaignId);
  const points = useMemo(
    () =>
      local === undefined
        ? undefined
        : buildMapPoints({ ...local, benchmarks: benchmarks.data ?? [] }),
    [local, benchmarks.data],
  );
  return {
    points,
    benchmarks:
      benchmarks.data !== undefined ? "ready" : benchmarks.isError ? "unavailable" : "loading",
  };
}
