// The points the map and its list show, built in one place so both always agree.
import type { BenchmarkView } from "../../../shared/schemas/benchmarks";
import type { CrateView } from "../../../shared/schemas/crates";
import type { FieldEntryView } from "../../../shared/schemas/field-entries";
import { siteKindLabels, type SiteView } from "../../../shared/schemas/sites";

export type MapPointKind = "site" | "benchmark" | "crate";

export interface MapPoint {
  id: string;
  kind: MapPointKind;
  name: string;
  detail: string;
  latitudeDeg: number;
  longitudeDeg: number;
  /** For a crate: the site it was last recorded at. */
  siteId?: string;
}

export const mapPointKindLabels: Record<MapPointKind, string> = {
  site: "Site",
  benchmark: "Benchmark",
  crate: "Crate (last known position)",
};

type SiteLike = Pick<
  SiteView,
  "id" | "name" | "kind" | "latitudeDeg" | "longitudeDeg" | "deletedAt"
>;
type EntryLike = Pick<FieldEntryView, "id" | "siteId" | "crateId" | "observedAt">;

export interface MapInputs {
  sites: readonly SiteLike[];
  benchmarks: readonly BenchmarkView[];
  crates: readonly CrateView[];
  entries: readonly EntryLike[];
}

/**
 * A crate's last known position is the site of its most recent entry or arrival (by time, then
 * id, as the site board orders them). Crates with neither, or whose site is gone, are left out.
 */
export function lastCrateSites(
  crates: readonly Pick<CrateView, "id">[],
  entries: readonly EntryLike[],
): Map<string, { siteId: string; observedAt: string }> {
  const wanted = new Set(crates.map((c) => c.id));
  const latest = new Map<string, EntryLike>();
  for (const entry of entries) {
    if (entry.crateId === null || !wanted.has(entry.crateId)) continue;
    const seen = latest.get(entry.crateId);
    if (
      seen === undefined ||
      entry.observedAt > seen.observedAt ||
      (entry.observedAt === seen.observedAt && entry.id > seen.id)
    )
      latest.set(entry.crateId, entry);
  }
  return new Map(
    [...latest].map(([crateId, e]) => [crateId, { siteId: e.siteId, observedAt: e.observedAt }]),
  );
}

export function buildMapPoints({ sites, benchmarks, crates, entries }: MapInputs): MapPoint[] {
  const liveSites = sites.filter((s) => s.deletedAt === null);
  const byId = new Map(liveSites.map((s) => [s.id, s]));
  const points: MapPoint[] = liveSites.map((s) => ({
    id: s.id,
    kind: "site",
    name: s.name,
    detail: siteKindLabels[s.kind],
    latitudeDeg: s.latitudeDeg,
    longitudeDeg: s.longitudeDeg,
  }));
  for (const b of benchmarks)
    points.push({
      id: b.id,
      kind: "benchmark",
      name: b.code,
      detail: b.description,
      latitudeDeg: b.latitudeDeg,
      longitudeDeg: b.longitudeDeg,
    });
  const last = lastCrateSites(
    crates.filter((c) => c.deletedAt === null),
    entries,
  );
  for (const crate of crates) {
    const at = last.get(crate.id);
    const site = at === undefined ? undefined : byId.get(at.siteId);
    if (at === undefined || site === undefined) continue;
    points.push({
      id: crate.id,
      kind: "crate",
      name: crate.label,
      detail: `At ${site.name} (last entry ${at.observedAt.slice(0, 16).replace("T", " ")} UTC)`,
      latitudeDeg: site.latitudeDeg,
      longitudeDeg: site.longitudeDeg,
      siteId: site.id,
    });
  }
  return points;
}

/** GeoJSON for the map (RFC 7946: longitude first). */
export function pointsToGeoJson(
  points: readonly MapPoint[],
): GeoJSON.FeatureCollection<GeoJSON.Point> {
  return {
    type: "FeatureCollection",
    features: points.map((p) => ({
      type: "Feature",
      geometry: { type: "Point", coordinates: [p.longitudeDeg, p.latitudeDeg] },
      properties: { id: p.id, kind: p.kind, name: p.name },
    })),
  };
}

/** [[west, south], [east, north]] around the points, padded; null with no points. */
export function pointsBounds(
  points: readonly MapPoint[],
  padDeg = 0.05,
): [[number, number], [number, number]] | null {
  if (points.length === 0) return null;
  const lons = points.map((p) => p.longitudeDeg);
  const lats = points.map((p) => p.latitudeDeg);
  return [
    [Math.max(-180, Math.min(...lons) - padDeg), Math.max(-85, Math.min(...lats) - padDeg)],
    [Math.min(180, Math.max(...lons) + padDeg), Math.min(85, Math.max(...lats) + padDeg)],
  ];
}
