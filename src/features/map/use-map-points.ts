// Everything the map shows, from this device: sites, crates and entries from the local store,
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
    const [sites, crates, entries] = await Promise.all([
      listSites(db, campaignId),
      listCrates(db, campaignId),
      db.fieldEntries.where("campaignId").equals(campaignId).toArray(),
    ]);
    return { sites, crates, entries };
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
