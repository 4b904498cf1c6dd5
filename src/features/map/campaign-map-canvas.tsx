// The map itself, loaded on demand (maplibre is about 1 MB): bundled land outlines, the campaign's
// points, and optionally an online raster layer underneath. The style has no tiles, glyphs or
// sprites of its own, so it renders with no network at all.
import { useEffect, useRef, useState } from "react";
import {
  Map as MapLibre,
  setWorkerUrl,
  type GeoJSONSource,
  type StyleSpecification,
} from "maplibre-gl";
import workerUrl from "maplibre-gl/dist/maplibre-gl-worker.mjs?url";
import "maplibre-gl/dist/maplibre-gl.css";
import { Notice } from "../../components/notice";
import { landOutlines } from "./land";
import { pointsBounds, pointsToGeoJson, type MapPoint } from "./map-data";
import { mapColours } from "./map-legend";

setWorkerUrl(workerUrl);

function webGlAvailable(): boolean {
  try {
    const canvas = document.createElement("canvas");
    return canvas.getContext("webgl2") !== null;
  } catch {
    return false;
  }
}

function buildStyle(points: readonly MapPoint[], tileUrl: string | null): StyleSpecification {
  const style: StyleSpecification = {
    version: 8,
    sources: {
      land: { type: "geojson", data: landOutlines },
      points: { type: "geojson", data: pointsToGeoJson(points) },
    },
    layers: [{ id: "water", type: "background", paint: { "background-color": mapColours.water } }],
  };
  if (tileUrl !== null) {
    style.sources.tiles = { type: "raster", tiles: [tileUrl], tileSize: 256, maxzoom: 19 };
    style.layers.push({ id: "tiles", type: "raster", source: "tiles" });
  }
  style.layers.push(
    {
      id: "land",
      type: "fill",
      source: "land",
      paint: { "fill-color": mapColours.land, "fill-opacity": tileUrl === null ? 1 : 0.15 },
    },
    {
      id: "coast",
      type: "line",
      source: "land",
      paint: { "line-color": mapColours.coast, "line-width": 1 },
    },
    {
      id: "benchmarks",
      type: "circle",
      source: "points",
      filter: ["==", ["get", "kind"], "benchmark"],
      // Under the sites and wider: a benchmark at a site shows as a ring around its disc.
      paint: {
        "circle-radius": 11,
        "circle-color": "#ffffff",
        "circle-stroke-color": mapColours.benchmark,
        "circle-stroke-width": 4,
      },
    },
    {
      id: "sites",
      type: "circle",
      source: "points",
      filter: ["==", ["get", "kind"], "site"],
      paint: {
        "circle-radius": 8,
        "circle-color": mapColours.site,
        "circle-stroke-color": "#ffffff",
        "circle-stroke-width": 2,
      },
    },
    {
      id: "crates",
      type: "circle",
      source: "points",
      filter: ["==", ["get", "kind"], "crate"],
      paint: {
        "circle-radius": 5,
        "circle-color": mapColours.crate,
        "circle-stroke-color": "#ffffff",
        "circle-stroke-width": 1.5,
        // Crates share their site's point: push them aside so the site stays visible.
        "circle-translate": [14, -14],
      },
    },
  );
  return style;
}

interface Props {
  points: readonly MapPoint[];
  tileUrl: string | null;
}

export default function CampaignMapCanvas({ points, tileUrl }: Props) {
  const container = useRef<HTMLDivElement>(null);
  const [failed, setFailed] = useState<string | null>(() =>
    webGlAvailable() ? null : "This browser cannot draw the map (WebGL is not available).",
  );
  const firstPoints = useRef(points);
  const mapRef = useRef<MapLibre | null>(null);

  useEffect(() => {
    if (failed !== null || container.current === null) return undefined;
    let map: MapLibre;
    try {
      map = new MapLibre({
        container: container.current,
        style: buildStyle(firstPoints.current, tileUrl),
        center: [10, 47],
        zoom: 3,
        attributionControl: false,
        // Lets tests and screenshots read what was drawn.
        canvasContextAttributes: { preserveDrawingBuffer: true },
      });
    } catch {
      // The constructor throws when WebGL cannot start after all (a lost or refused context).
      queueMicrotask(() => setFailed("The map could not start on this device."));
      return undefined;
    }
    map.on("load", () => {
      // Fit once the layout has settled: a container sized late would leave the points off-centre.
      map.resize();
      const bounds = pointsBounds(firstPoints.current);
      if (bounds !== null) map.fitBounds(bounds, { padding: 48, maxZoom: 11, animate: false });
      container.current?.setAttribute("data-map-loaded", "true");
    });
    mapRef.current = map;
    return () => {
      mapRef.current = null;
      map.remove();
    };
  }, [failed, tileUrl]);

  // Later changes (a pull, a new entry) move the points without rebuilding the map.
  useEffect(() => {
    firstPoints.current = points;
    const source = mapRef.current?.getSource<GeoJSONSource>("points");
    source?.setData(pointsToGeoJson(points));
  }, [points]);

  if (failed !== null)
    return (
      <Notice tone="attention" title="Map not shown">
        {failed} Every point is in the list beside it.
      </Notice>
    );
  return (
    <figure className="flex flex-col gap-2">
      <div
        ref={container}
        className="h-[28rem] w-full overflow-hidden rounded-lg border-2 border-line"
        data-testid="campaign-map"
      />
      <figcaption className="text-sm text-muted">
        Land outlines are bundled at low resolution (1:110 million): for orientation, not for
        finding the way.
      </figcaption>
    </figure>
  );
}
