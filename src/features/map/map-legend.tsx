// The map's colours and the legend that explains them; the same marks appear in the list, so a
// kind is always told by shape and word, never by colour alone.
import type { MapPointKind } from "./map-data";
import { mapPointKindLabels } from "./map-data";

// Fixed, not themed: the map's canvas cannot read CSS variables, and the paper palette reads on
// both the outlines and most tile layers.
export const mapColours = {
  water: "#DCE7E6",
  land: "#F5EFE2",
  coast: "#857A66",
  site: "#12524E",
  benchmark: "#A86300",
  crate: "#5A3300",
} as const;

export function PointMark({ kind }: { kind: MapPointKind }) {
  return (
    <svg viewBox="0 0 24 24" aria-hidden="true" focusable="false" className="h-6 w-6 shrink-0">
      {kind === "site" && (
        <circle cx="12" cy="12" r="7" fill={mapColours.site} stroke="#fff" strokeWidth="2" />
      )}
      {kind === "benchmark" && (
        <circle cx="12" cy="12" r="8" fill="#fff" stroke={mapColours.benchmark} strokeWidth="3" />
      )}
      {kind === "crate" && (
        <circle cx="12" cy="12" r="5" fill={mapColours.crate} stroke="#fff" strokeWidth="1.5" />
      )}
    </svg>
  );
}

export function MapLegend() {
  const kinds: MapPointKind[] = ["site", "benchmark", "crate"];
  return (
    <ul aria-label="Legend" className="flex flex-wrap gap-x-6 gap-y-2">
      {kinds.map((kind) => (
        <li key={kind} className="flex items-center gap-2">
          <PointMark kind={kind} />
          {mapPointKindLabels[kind]}
        </li>
      ))}
    </ul>
  );
}
