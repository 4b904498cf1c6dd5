// The sites on a printed overview map, drawn as SVG from the bundled land outlines: vector lines
// print sharply and need neither WebGL nor a network, unlike the screen's interactive map.
import { useMemo, type ReactNode } from "react";
import type { Feature, FeatureCollection } from "geojson";
import { fitView, landPath, scaleBarKm } from "../lib/map-projection";

export type ReportMapKind = "site" | "benchmark" | "crate";

export interface ReportMapPoint {
  id: string;
  kind: ReportMapKind;
  name: string;
  latitudeDeg: number;
  longitudeDeg: number;
}

export interface ReportMapColours {
  water: string;
  land: string;
  coast: string;
  site: string;
  benchmark: string;
  crate: string;
}

interface SiteMapFigureProps {
  land: FeatureCollection | Feature;
  points: readonly ReportMapPoint[];
  colours: ReportMapColours;
  /** Explains the marks (the map screen's own legend). */
  legend: ReactNode;
}

const widthPx = 640;
const heightPx = 420;

function Mark({
  point,
  colours,
  x,
  y,
}: {
  point: ReportMapPoint;
  colours: ReportMapColours;
  x: number;
  y: number;
}) {
  if (point.kind === "benchmark")
    return <circle cx={x} cy={y} r={9} fill="#fff" stroke={colours.benchmark} strokeWidth={3} />;
  if (point.kind === "crate")
    return (
      <circle cx={x + 12} cy={y - 12} r={4} fill={colours.crate} stroke="#fff" strokeWidth={1.5} />
    );
  return (
    <>
      <circle cx={x} cy={y} r={6.5} fill={colours.site} stroke="#fff" strokeWidth={2} />
      <text
        x={x + 11}
        y={y + 4}
        fontSize={13}
        fontWeight={600}
        fill="#000"
        stroke="#fff"
        strokeWidth={3}
        paintOrder="stroke"
      >
        {point.name}
      </text>
    </>
  );
}

export function SiteMapFigure({ land, points, colours, legend }: SiteMapFigureProps) {
  const { view, path } = useMemo(() => {
    const fitted = fitView(points, widthPx, heightPx);
    return { view: fitted, path: landPath(land, fitted) };
  }, [land, points]);
  const barKm = scaleBarKm(view);
  const barPx = barKm / view.kmPerPx;
  // Benchmarks under sites, crates on top: the same order as the screen map.
  const order: ReportMapKind[] = ["benchmark", "site", "crate"];
  return (
    <figure data-report-keep="" data-testid="report-map" className="flex flex-col gap-2">
      <svg
        viewBox={`0 0 ${widthPx} ${heightPx}`}
        role="img"
        aria-label={`Overview map of ${points.filter((p) => p.kind === "site").length} sites`}
        className="h-auto w-full border-2 border-ink"
        style={{ printColorAdjust: "exact" }}
      >
        <rect width={widthPx} height={heightPx} fill={colours.water} />
        <path d={path} fill={colours.land} stroke={colours.coast} strokeWidth={1} />
        {order.flatMap((kind) =>
          points
            .filter((p) => p.kind === kind)
            .map((p) => {
              const { x, y } = view.project(p.longitudeDeg, p.latitudeDeg);
              return <Mark key={`${kind}-${p.id}`} point={p} colours={colours} x={x} y={y} />;
            }),
        )}
        <g transform={`translate(16 ${heightPx - 20})`}>
          <rect x={-6} y={-20} width={barPx + 60} height={30} fill="#fff" opacity={0.85} />
          <line x1={0} y1={0} x2={barPx} y2={0} stroke="#000" strokeWidth={3} />
          <line x1={0} y1={-5} x2={0} y2={5} stroke="#000" strokeWidth={2} />
          <line x1={barPx} y1={-5} x2={barPx} y2={5} stroke="#000" strokeWidth={2} />
          <text x={barPx + 8} y={5} fontSize={13} fill="#000">
            {barKm} km
          </text>
        </g>
      </svg>
      {legend}
      <figcaption className="text-sm text-muted">
        Equirectangular overview; land outlines at 1:110 million, for orientation only. Positions
        are in the table below.
      </figcaption>
    </figure>
  );
}
