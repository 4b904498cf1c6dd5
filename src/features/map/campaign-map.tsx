// The map screen: map, legend, and the same points as a list. The route loads this module on
// demand, so maplibre stays out of the main bundle.
import { useState, useSyncExternalStore } from "react";
import { Loading } from "../../components/loading";
import CampaignMapCanvas from "./campaign-map-canvas";
import { Notice } from "../../components/notice";
import type { MapPoint } from "./map-data";
import { MapLegend } from "./map-legend";
import { MapPointsList } from "./map-points-list";
import { readTileUrl } from "./tile-setting";
import { TileSettingForm } from "./tile-setting-form";
import { useMapPoints } from "./use-map-points";

function subscribeOnline(notify: () => void) {
  window.addEventListener("online", notify);
  window.addEventListener("offline", notify);
  return () => {
    window.removeEventListener("online", notify);
    window.removeEventListener("offline", notify);
  };
}

interface Props {
  campaignId: string;
  hrefOf: (point: MapPoint) => string | undefined;
}

export default function CampaignMap({ campaignId, hrefOf }: Props) {
  const { points, benchmarks } = useMapPoints(campaignId);
  const [tileUrl, setTileUrl] = useState(() => readTileUrl(window.localStorage));
  const online = useSyncExternalStore(subscribeOnline, () => navigator.onLine);
  if (points === undefined) return <Loading label="Reading the campaign on this device…" />;
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(18rem,2fr)]">
      <div className="flex flex-col gap-3">
        <CampaignMapCanvas points={points} tileUrl={online ? tileUrl : null} />
        <MapLegend />
        {tileUrl !== null && !online && (
          <p className="text-sm text-muted">
            Offline: online tiles are hidden until the connection returns.
          </p>
        )}
        <TileSettingForm url={tileUrl} onChange={setTileUrl} />
      </div>
      <div className="flex flex-col gap-3">
        {benchmarks === "unavailable" && (
          <Notice tone="attention" title="Benchmarks not shown">
            The benchmarks were never loaded on this device; they appear once it has been online.
          </Notice>
        )}
        <MapPointsList points={points} hrefOf={hrefOf} />
      </div>
    </div>
  );
}
