import { useNavigate, useParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { LevellingCaution } from "../../features/levelling/components/levelling-caution";
import { OpenSectionForm } from "../../features/levelling/components/open-section-form";
import { SiteSections } from "../../features/levelling/components/site-sections";
import { useLocalSite } from "../../features/sites/hooks/use-local-sites";
import { LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { NotFoundHere } from "../not-found-here";
import { paths } from "../paths";

export function LevellingRoute() {
  const { campaignId, role } = useCampaign();
  const { siteId = "" } = useParams();
  const navigate = useNavigate();
  const site = useLocalSite(campaignId, siteId);
  if (site === undefined) return <Loading label="Reading the site on this device…" />;
  if (site === null) {
    return (
      <NotFoundHere title="Site not found" backHref={paths.sites(campaignId)}>
        It may have been deleted, or it is not on this device yet.
      </NotFoundHere>
    );
  }
  const canRecord = can(role, "levelling.record");
  return (
    <>
      <PageHeader
        title={`Levelling at ${site.name}`}
        lead="Sections between two marks, levelled forward and back."
      />
      <div className="flex flex-col gap-6">
        <LevellingCaution />
        <SiteSections
          campaignId={campaignId}
          siteId={site.id}
          sectionHref={(sectionId) => paths.levellingSection(campaignId, sectionId)}
        />
        {canRecord ? (
          <OpenSectionForm
            campaignId={campaignId}
            siteId={site.id}
            onOpened={(sectionId) => navigate(paths.levellingSection(campaignId, sectionId))}
          />
        ) : (
          <p className="text-muted">Your role can read the field books but not write in them.</p>
        )}
        <div>
          <LinkButton tone="quiet" className="px-0" to={paths.sites(campaignId)}>
            Back to the sites
          </LinkButton>
        </div>
      </div>
    </>
  );
}
