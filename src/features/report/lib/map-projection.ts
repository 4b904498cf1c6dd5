// A plain equirectangular view fitted around a few points, for a printed overview map: longitudes
// shrunk by cos(mid latitude) so shapes look right at the campaign's latitude. SVG coordinates.
import type { Feature, FeatureCollection, Geometry, Position } from "geojson";

export interface MapView {
  widthPx: number;
  heightPx: number;
  project: (longitudeDeg: number, latitudeDeg: number) => { x: number; y: number };
  /** Visible longitude and latitude range, for leaving out land far outside the view. */
  bounds: { west: number; east: number; south: number; north: number };
  /** Kilometres per SVG unit along the mid latitude. */
  kmPerPx: number;
}

const kmPerDegree = 111.32;

interface Place {
  longitudeDeg: number;
  latitudeDeg: number;
}

/** Fits the points with a margin; a lone point or a tight cluster gets at least `minSpanDeg`. */
export function fitView(
  places: readonly Place[],
  widthPx: number,
  heightPx: number,
  minSpanDeg = 2,
): MapView {
  const lons = places.map((p) => p.longitudeDeg);
  const lats = places.map((p) => p.latitudeDeg);
  const midLat = places.length === 0 ? 0 : (Math.min(...lats) + Math.max(...lats)) / 2;
  const midLon = places.length === 0 ? 0 : (Math.min(...lons) + Math.max(...lons)) / 2;
  const k = Math.max(Math.cos((midLat * Math.PI) / 180), 0.2);
  const spanX = places.length === 0 ? 360 : (Math.max(...lons) - Math.min(...lons)) * k;
  const spanY = places.length === 0 ? 180 : Math.max(...lats) - Math.min(...lats);
  // 25 % margin on every side, then widen the short side to the box's shape.
  let viewX = Math.max(spanX * 1.5, minSpanDeg * k);
  let viewY = Math.max(spanY * 1.5, minSpanDeg);
  if (viewX / viewY < widthPx / heightPx) viewX = (viewY * widthPx) / heightPx;
  else viewY = (viewX * heightPx) / widthPx;
  const pxPerUnit = widthPx / viewX;
  const halfLon = viewX / k / 2;
  return {
    widthPx,
    heightPx,
    project: (lon, lat) => ({
      x: widthPx / 2 + (lon - midLon) * k * pxPerUnit,
      y: heightPx / 2 - (lat - midLat) * pxPerUnit,
    }),
    bounds: {
      west: midLon - halfLon,
      east: midLon + halfLon,
      south: midLat - viewY / 2,
      north: midLat + viewY / 2,
    },
    kmPerPx: kmPerDegree / pxPerUnit,
  };
}

function ringNear(ring: readonly Position[], view: MapView): boolean {
  const { west, east, south, north } = view.bounds;
  const spanLon = east - west;
  const spanLat = north - south;
  return ring.some(
    ([lon = 0, lat = 0]) =>
      lon > west - spanLon &&
      lon < east + spanLon &&
      lat > south - spanLat &&
      lat < north + spanLat,
  );
}

function ringsOf(geometry: Geometry): Position[][] {
  if (geometry.type === "Polygon") return geometry.coordinates;
  if (geometry.type === "MultiPolygon") return geometry.coordinates.flat();
  if (geometry.type === "GeometryCollection") return geometry.geometries.flatMap(ringsOf);
  return [];
}

/** One SVG path of the land rings near the view (the rest of the world is left out). */
export function landPath(land: FeatureCollection | Feature, view: MapView): string {
  const features = land.type === "FeatureCollection" ? land.features : [land];
  const parts: string[] = [];
  for (const feature of features) {
    if (feature.geometry === null) continue;
    for (const ring of ringsOf(feature.geometry)) {
      if (!ringNear(ring, view)) continue;
      const points = ring.map(([lon = 0, lat = 0]) => {
        const { x, y } = view.project(lon, lat);
        return `${x.toFixed(1)} ${y.toFixed(1)}`;
      });
      parts.push(`M${points.join("L")}Z`);
    }
  }
  return parts.join("");
}

/** A round scale-bar length (1, 2 or 5 × 10ⁿ km) near a fifth of the map's width. */
export function scaleBarKm(view: MapView): number {
  const target = (view.widthPx / 5) * view.kmPerPx;
  const power = 10 ** Math.floor(Math.log10(target));
  const step = [1, 2, 5, 10].find((m) => m * power >= target * 0.7) ?? 10;
  return step * power;
}
