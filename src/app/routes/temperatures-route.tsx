import { useParams, useSearchParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { useLocalSite } from "../../features/sites/hooks/use-local-sites";
import { CrateTemperatures } from "../../features/temperatures/components/crate-temperatures";
import { LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { NotFoundHere } from "../not-found-here";
import { paths } from "../paths";

export function TemperaturesRoute() {
  const { campaignId, role } = useCampaign();
  const { siteId = "" } = useParams();
  const [search] = useSearchParams();
  const site = useLocalSite(campaignId, siteId);
  if (site === undefined) return <Loading label="Reading the site on this device…" />;
  if (site === null)
    return (
      <NotFoundHere title="Site not found" backHref={paths.sites(campaignId)}>
        It may have been deleted, or it is not on this device yet.
      </NotFoundHere>
    );
  return (
    <>
      <PageHeader title="Temperatures" lead={`Crates at ${site.name}, against each crate's band`} />
      <div className="mb-4">
        <LinkButton tone="quiet" className="px-0" to={paths.siteBoard(campaignId, siteId)}>
          Back to {site.name}
        </LinkButton>
      </div>
      <CrateTemperatures
        campaignId={campaignId}
        siteId={siteId}
        canRecord={can(role, "entry.record")}
        importHref={paths.entryImport(campaignId, siteId, "temperatures")}
        initialCrateId={search.get("crate") ?? undefined}
      />
    </>
  );
}
