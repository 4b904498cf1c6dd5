import { useNavigate, useParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { useSite } from "../../features/sites/api/get-sites";
import { DeleteSiteControl } from "../../features/sites/components/delete-site-control";
import { EditSiteForm } from "../../features/sites/components/edit-site-form";
import { LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";
import { NotAllowed } from "../not-allowed";

export function SiteEditRoute() {
  const { campaignId, role } = useCampaign();
  const { siteId = "" } = useParams();
  const navigate = useNavigate();
  const site = useSite(campaignId, siteId);
  const back = paths.sites(campaignId);

  if (!can(role, "site.write")) {
    return <NotAllowed what="Your role can read sites but not change them." backHref={back} />;
  }
  if (site.data === undefined) return <Loading label="Loading the site…" />;
  if (site.data === null) {
    return (
      <div className="flex flex-col gap-4">
        <Notice tone="attention" title="Site not found">
          It may have been deleted.
        </Notice>
        <div>
          <LinkButton to={back}>Back to the sites</LinkButton>
        </div>
      </div>
    );
  }
  return (
    <>
      <PageHeader title={`Edit ${site.data.name}`} lead={`Version ${site.data.version}`} />
      <EditSiteForm
        campaignId={campaignId}
        site={site.data}
        cancelHref={back}
        onSaved={() => navigate(back)}
      />
      {can(role, "site.delete") && (
        <section aria-label="Delete" className="mt-10 border-t-2 border-line pt-6">
          <DeleteSiteControl
            campaignId={campaignId}
            site={site.data}
            onDeleted={() => navigate(back, { replace: true })}
          />
        </section>
      )}
    </>
  );
}
