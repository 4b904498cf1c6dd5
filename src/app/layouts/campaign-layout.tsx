import { NavLink, Outlet, useLocation, useOutletContext, useParams } from "react-router-dom";
import { can, roleLabels, type Role } from "../../../shared/permissions";
import { LinkButton } from "../../components/button";
import { Notice } from "../../components/notice";
import { useReviewCount } from "../../features/sync/hooks/use-sync-data";
import { cx } from "../../lib/cx";
import { useSession } from "../../lib/use-session";
import { paths } from "../paths";

export interface CampaignContext {
  campaignId: string;
  campaignName: string;
  role: Role;
}

export function useCampaign(): CampaignContext {
  return useOutletContext<CampaignContext>();
}

const tabClass = ({ isActive }: { isActive: boolean }) =>
  cx(
    "inline-flex min-h-touch items-center rounded-t-lg border-2 border-b-0 px-5 font-semibold no-underline",
    isActive ? "border-line bg-surface" : "border-transparent text-muted hover:text-ink",
  );

/** Always shown, so people learn where conflicts appear; the count says when one waits. */
function ConflictsTab({ campaignId }: { campaignId: string }) {
  const count = useReviewCount(campaignId);
  return (
    <NavLink to={paths.conflicts(campaignId)} className={tabClass}>
      Conflicts
      {count > 0 && (
        <span className="ml-2 inline-flex min-w-7 items-center justify-center rounded-full border-2 border-attention bg-attention-soft px-1.5 text-sm text-attention-ink tabular-nums">
          {count}
          <span className="sr-only"> to check</span>
        </span>
      )}
    </NavLink>
  );
}

function CampaignNav({ campaign }: { campaign: CampaignContext }) {
  // A site's board and its entries live under /sites/:id, but belong to the board tab.
  const { pathname } = useLocation();
  const onBoard =
    /\/sites\/(?!new$)[^/]+(\/(entries\/.*|levelling|import|temperatures))?$/.test(pathname) ||
    /\/(entries|levelling|checklists)\//.test(pathname);
  return (
    <nav
      aria-label="Campaign"
      className="mb-6 flex flex-wrap items-end gap-1 border-b-2 border-line"
    >
      <NavLink
        to={paths.board(campaign.campaignId)}
        className={({ isActive }) => tabClass({ isActive: isActive || onBoard })}
      >
        Site board
      </NavLink>
      <NavLink
        to={paths.sites(campaign.campaignId)}
        className={({ isActive }) => tabClass({ isActive: isActive && !onBoard })}
      >
        Sites
      </NavLink>
      <NavLink to={paths.crates(campaign.campaignId)} className={tabClass}>
        Crates
      </NavLink>
      {can(campaign.role, "leg.plan") && (
        <NavLink to={paths.logistics(campaign.campaignId)} className={tabClass}>
          Logistics
        </NavLink>
      )}
      <NavLink to={paths.map(campaign.campaignId)} className={tabClass}>
        Map
      </NavLink>
      <NavLink to={paths.heights(campaign.campaignId)} className={tabClass}>
        Heights
      </NavLink>
      <ConflictsTab campaignId={campaign.campaignId} />
      {can(campaign.role, "entry.review") && (
        <NavLink to={paths.review(campaign.campaignId)} className={tabClass}>
          Review
        </NavLink>
      )}
      {can(campaign.role, "campaign.export") && (
        <>
          <NavLink to={paths.report(campaign.campaignId)} className={tabClass}>
            Report
          </NavLink>
          <NavLink to={paths.exports(campaign.campaignId)} className={tabClass}>
            Exports
          </NavLink>
        </>
      )}
      {can(campaign.role, "member.read") && (
        <NavLink to={paths.members(campaign.campaignId)} className={tabClass}>
          Members
        </NavLink>
      )}
      {can(campaign.role, "checklist.template.write") && (
        <NavLink to={paths.checklistTemplates(campaign.campaignId)} className={tabClass}>
          Checklist templates
        </NavLink>
      )}
    </nav>
  );
}

/** Resolves the campaign and the person's role in it from the session's memberships. */
export function CampaignLayout() {
  const { campaignId = "" } = useParams();
  const session = useSession();
  const memberships = session.status === "signed-in" ? session.memberships : [];
  const membership = memberships.find((m) => m.campaignId === campaignId);

  if (membership === undefined) {
    return (
      <div className="flex flex-col gap-4">
        <Notice tone="attention" title="Not one of your campaigns">
          This campaign does not exist or you are not a member of it.
        </Notice>
        <div>
          <LinkButton to={paths.campaigns}>Choose a campaign</LinkButton>
        </div>
      </div>
    );
  }
  const campaign: CampaignContext = {
    campaignId,
    campaignName: membership.campaignName,
    role: membership.role,
  };
  return (
    <div>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-x-4">
        <p>
          <span className="text-lg font-semibold">{campaign.campaignName}</span>
          <span className="text-muted"> · your role: {roleLabels[campaign.role]}</span>
        </p>
        <LinkButton tone="quiet" to={paths.campaigns} className="px-2">
          Change campaign
        </LinkButton>
      </div>
      <CampaignNav campaign={campaign} />
      <Outlet context={campaign} />
    </div>
  );
}
