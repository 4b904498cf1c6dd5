import { CampaignPicker } from "../../features/campaigns/components/campaign-picker";
import { PageHeader } from "../../components/page-header";
import { useSession } from "../../lib/use-session";
import { paths } from "../paths";

export function CampaignsRoute() {
  const session = useSession();
  const memberships = session.status === "signed-in" ? session.memberships : [];
  return (
    <>
      <PageHeader title="Choose a campaign" lead="Your campaigns and your role in each." />
      <CampaignPicker memberships={memberships} hrefOf={paths.campaign} />
    </>
  );
}
