import { can } from "../../../shared/permissions";
import { SiteList } from "../../features/sites/components/site-list";
import { LinkButton } from "../../components/button";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";

export function SitesRoute() {
  const { campaignId, role } = useCampaign();
  const canWrite = can(role, "site.write");
  return (
    <>
      <PageHeader
        title="Sites"
        lead="Where the clocks go: reference labs, remote sites and depots."
        actions={
          canWrite ? (
            <LinkButton tone="primary" to={paths.newSite(campaignId)}>
              Add site
            </LinkButton>
          ) : undefined
        }
      />
      <SiteList
        campaignId={campaignId}
        editHrefOf={canWrite ? (siteId) => paths.editSite(campaignId, siteId) : null}
      />
    </>
  );
}
