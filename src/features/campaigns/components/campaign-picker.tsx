import { Link } from "react-router-dom";
import { roleLabels } from "../../../../shared/permissions";
import type { CampaignView, MembershipView } from "../../../../shared/schemas";
import { Loading } from "../../../components/loading";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { useCampaigns } from "../api/get-campaigns";

interface CampaignPickerProps {
  /** From the remembered session: shown when the list was never loaded on this device. */
  memberships: readonly MembershipView[];
  hrefOf: (campaignId: string) => string;
}

type PickerEntry = Pick<CampaignView, "id" | "name" | "description" | "role">;

function fromMemberships(memberships: readonly MembershipView[]): PickerEntry[] {
  return memberships.map((m) => ({
    id: m.campaignId,
    name: m.campaignName,
    description: "",
    role: m.role,
  }));
}

export function CampaignPicker({ memberships, hrefOf }: CampaignPickerProps) {
  const campaigns = useCampaigns();
  const entries: PickerEntry[] = campaigns.data ?? fromMemberships(memberships);

  if (campaigns.isPending && entries.length === 0 && campaigns.fetchStatus === "fetching") {
    return <Loading label="Loading your campaigns…" />;
  }
  return (
    <div className="flex flex-col gap-4">
      {campaigns.isError && campaigns.data === undefined && (
        <Notice tone="attention" title="Campaign list not refreshed">
          {messageOf(campaigns.error)} Showing the campaigns remembered on this device.
        </Notice>
      )}
      {entries.length === 0 ? (
        <Notice title="No campaigns yet">
          You are not a member of any campaign. Ask a campaign administrator for an invite.
        </Notice>
      ) : (
        <ul className="grid gap-4 md:grid-cols-2" aria-label="Your campaigns">
          {entries.map((entry) => (
            <li key={entry.id}>
              <Link
                to={hrefOf(entry.id)}
                className="flex min-h-24 flex-col justify-center gap-1 rounded-xl border-2 border-line bg-surface px-5 py-4 no-underline hover:border-primary hover:bg-primary-soft"
              >
                <span className="text-xl font-semibold">{entry.name}</span>
                {entry.description !== "" && (
                  <span className="text-muted">{entry.description}</span>
                )}
                <span className="text-sm">
                  Your role: <span className="font-semibold">{roleLabels[entry.role]}</span>
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
