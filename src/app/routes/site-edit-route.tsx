import { useNavigate, useParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { AttachmentPanel } from "../../features/attachments/components/attachment-panel";
import { RecordHistory } from "../../features/review/components/record-history";
import { DeleteSiteControl } from "../../features/sites/components/delete-site-control";
import { EditSiteForm } from "../../features/sites/components/edit-site-form";
import { useLocalSite } from "../../features/sites/hooks/use-local-sites";
import { Loading } from "../../components/loading";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { NotFoundHere } from "../not-found-here";
import { paths } from "../paths";
import { NotAllowed } from "../not-allowed";
import type { SavedState } from "./sites-route";

export function SiteEditRoute() {
  const { campaignId, role } = useCampaign();
  const { siteId = "" } = useParams();
  const navigate = useNavigate();
  const site = useLocalSite(campaignId, siteId);
  const back = paths.sites(campaignId);

  if (!can(role, "site.write")) {
    return <NotAllowed what="Your role can read sites but not change them." backHref={back} />;
  }
  if (site === undefined) return <Loading label="Reading the site on this device…" />;
  if (site === null) {
    return (
      <NotFoundHere title="Site not found" backHref={back}>
        It may have been deleted, or it is not on this device yet.
      </NotFoundHere>
    );
  }
  const onSaved = (name: string, changed: boolean) => {
    const state: SavedState | undefined = changed ? { saved: `“${name}” was changed.` } : undefined;
    navigate(back, { state });
  };
  const lead =
    site.version === 0 ? "Not yet on the server" : `Version ${site.version} on the server`;
  return (
    <>
      <PageHeader title={`Edit ${site.name}`} lead={lead} />
      <EditSiteForm campaignId={campaignId} site={site} cancelHref={back} onSaved={onSaved} />
      <AttachmentPanel
        campaignId={campaignId}
        subject={{ kind: "site", id: site.id, label: site.name }}
        canAdd={can(role, "attachment.write")}
      />
      {can(role, "audit.read") && (
        <RecordHistory campaignId={campaignId} entity="site" id={site.id} />
      )}
      {can(role, "site.delete") && (
        <section aria-label="Delete" className="mt-10 border-t-2 border-line pt-6">
          <DeleteSiteControl
            campaignId={campaignId}
            site={site}
            onDeleted={() => navigate(back, { replace: true })}
          />
        </section>
      )}
    </>
  );
}
