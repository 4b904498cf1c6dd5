// Sites, benchmarks and legs as one GeoJSON FeatureCollection (RFC 7946: WGS 84, [longitude,
// latitude]). Deleted sites and benchmarks are left out; every leg is kept with its state.
import { archiveRowSchemas, type ArchiveRow } from "../../../shared/schemas/campaign-archive";
import { officialHeightsCaution } from "../../../shared/schemas/comparison";
import type { JsonRow } from "../../db/repositories/campaign-export";

type Position = [number, number];
type Geometry =
  { type: "Point"; coordinates: Position } | { type: "LineString"; coordinates: Position[] };

export interface Feature {
  type: "Feature";
  id: string;
  geometry: Geometry;
  properties: Record<string, string | number | boolean | null>;
}

export interface FeatureCollection {
  type: "FeatureCollection";
  /** A foreign member (RFC 7946 §6.1): benchmark heights are campaign results, not official ones. */
  caution: string;
  features: Feature[];
}

export interface GeoRows {
  sites: JsonRow[];
  benchmarks: JsonRow[];
  legs: JsonRow[];
  crates: JsonRow[];
}

const point = (row: { longitude_deg: number; latitude_deg: number }): Position => [
  row.longitude_deg,
  row.latitude_deg,
];

function legState(leg: ArchiveRow<"legs">): string {
  if (leg.cancelled_at) return "cancelled";
  if (leg.arrived_at) return "arrived";
  if (leg.departed_at) return "under-way";
  return "planned";
}

function siteFeature(site: ArchiveRow<"sites">): Feature {
  return {
    type: "Feature",
    id: site.id,
    geometry: { type: "Point", coordinates: point(site) },
    properties: {
      kind: "site",
      name: site.name,
      siteKind: site.kind,
      approxHeightM: site.approx_height_m,
      notes: site.notes,
    },
  };
}

function benchmarkFeature(mark: ArchiveRow<"benchmarks">): Feature {
  return {
    type: "Feature",
    id: mark.id,
    geometry: { type: "Point", coordinates: point(mark) },
    properties: {
      kind: "benchmark",
      code: mark.code,
      description: mark.description,
      heightM: mark.height_m,
      heightSigmaM: mark.height_sigma_m,
      heightSystem: mark.height_system,
      datum: mark.datum,
      source: mark.source,
    },
  };
}

export function campaignGeoJson(rows: GeoRows): FeatureCollection {
  const sites = rows.sites.map((r) => archiveRowSchemas.sites.parse(r));
  const byId = new Map(sites.map((s) => [s.id, s]));
  const labels = new Map(
    rows.crates.map((r) => archiveRowSchemas.crates.parse(r)).map((c) => [c.id, c.label]),
  );
  const features: Feature[] = sites.filter((s) => s.deleted_at === null).map(siteFeature);
  for (const r of rows.benchmarks) {
    const mark = archiveRowSchemas.benchmarks.parse(r);
    if (mark.deleted_at === null) features.push(benchmarkFeature(mark));
  }
  for (const r of rows.legs) {
    const leg = archiveRowSchemas.legs.parse(r);
    const from = byId.get(leg.from_site_id);
    const to = byId.get(leg.to_site_id);
    if (!from || !to) continue;
    features.push({
      type: "Feature",
      id: leg.id,
      geometry: { type: "LineString", coordinates: [point(from), point(to)] },
      properties: {
        kind: "leg",
        crateId: leg.crate_id,
        crateLabel: labels.get(leg.crate_id) ?? "",
        fromSite: from.name,
        toSite: to.name,
        state: legState(leg),
        plannedDepartAt: leg.planned_depart_at,
        plannedArriveAt: leg.planned_arrive_at,
        departedAt: leg.departed_at,
        arrivedAt: leg.arrived_at,
      },
    });
  }
  return { type: "FeatureCollection", caution: officialHeightsCaution, features };
}
