import { can } from "../../../shared/permissions";
import { InviteMemberForm } from "../../features/members/components/invite-member-form";
import { MemberList } from "../../features/members/components/member-list";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";
import { NotAllowed } from "../not-allowed";

export function MembersRoute() {
  const { campaignId, role } = useCampaign();

  if (!can(role, "member.read")) {
    return (
      <NotAllowed
        what="Members and invites are managed by the campaign's administrators."
        backHref={paths.sites(campaignId)}
      />
    );
  }
  return (
    <>
      <PageHeader title="Members" lead="Who works on this campaign, and in which role." />
      <MemberList campaignId={campaignId} />
      {can(role, "invite.create") && (
        <section aria-labelledby="invite-heading" className="mt-10">
          <h2 id="invite-heading" className="mb-4 text-2xl font-semibold">
            Invite someone
          </h2>
          <div className="rounded-xl border-2 border-line bg-surface p-5 md:p-6">
            <InviteMemberForm campaignId={campaignId} />
          </div>
        </section>
      )}
    </>
  );
}
