import { useLocation } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { SiteList } from "../../features/sites/components/site-list";
import { LinkButton } from "../../components/button";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";

/** Set by the site forms once a write committed on this device. */
export interface SavedState {
  saved?: string;
}

function SavedNotice() {
  const state = useLocation().state as SavedState | null;
  if (typeof state?.saved !== "string") return null;
  return (
    <div role="status" className="mb-4">
      <Notice title="Saved on this device">
        {state.saved} It is sent to the server when there is a connection.
      </Notice>
    </div>
  );
}

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
      <SavedNotice />
      <SiteList
        campaignId={campaignId}
        editHrefOf={canWrite ? (siteId) => paths.editSite(campaignId, siteId) : null}
        boardHrefOf={(siteId) => paths.siteBoard(campaignId, siteId)}
      />
    </>
  );
}
