import { lazy, Suspense } from "react";
import { Loading } from "../../components/loading";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";

// maplibre is large: load the map screen only when someone opens it.
const CampaignMap = lazy(() => import("../../features/map/campaign-map"));

export function MapRoute() {
  const { campaignId } = useCampaign();
  return (
    <>
      <PageHeader title="Map" lead="Sites, benchmarks and where each crate was last recorded" />
      <Suspense fallback={<Loading label="Loading the map…" />}>
        <CampaignMap
          campaignId={campaignId}
          hrefOf={(point) =>
            point.kind === "site"
              ? paths.siteBoard(campaignId, point.id)
              : point.kind === "crate"
                ? paths.crateLabel(campaignId, point.id)
                : undefined
          }
        />
      </Suspense>
    </>
  );
}
