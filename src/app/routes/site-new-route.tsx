import { useNavigate } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { CreateSiteForm } from "../../features/sites/components/create-site-form";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";
import { NotAllowed } from "../not-allowed";
import type { SavedState } from "./sites-route";

export function SiteNewRoute() {
  const { campaignId, role } = useCampaign();
  const navigate = useNavigate();
  const back = paths.sites(campaignId);

  if (!can(role, "site.write")) {
    return <NotAllowed what="Your role can read sites but not add them." backHref={back} />;
  }
  const onCreated = (name: string) => {
    const state: SavedState = { saved: `“${name}” was added.` };
    navigate(back, { state });
  };
  return (
    <>
      <PageHeader title="Add a site" />
      <CreateSiteForm campaignId={campaignId} cancelHref={back} onCreated={onCreated} />
    </>
  );
}
