// The report's map: the map feature's points and bundled land outlines, drawn by the report's
// printable SVG figure. Loaded on demand, so the outlines stay out of the main bundle.
import { Loading } from "../../../components/loading";
import { landOutlines } from "../../../features/map/land";
import { MapLegend, mapColours } from "../../../features/map/map-legend";
import { useMapPoints } from "../../../features/map/use-map-points";
import { SiteMapFigure } from "../../../features/report/components/site-map-figure";

export default function ReportMap({ campaignId }: { campaignId: string }) {
  const { points } = useMapPoints(campaignId);
  if (points === undefined) return <Loading label="Reading the campaign on this device…" />;
  return (
    <SiteMapFigure
      land={landOutlines}
      points={points}
      colours={mapColours}
      legend={<MapLegend />}
    />
  );
}
