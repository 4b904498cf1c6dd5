import { can } from "../../../shared/permissions";
import { ConflictList } from "../../features/sync/components/conflict-list";
import { RecoveryList } from "../../features/sync/components/recovery-list";
import { useCampaignReview } from "../../features/sync/hooks/use-sync-data";
import { Loading } from "../../components/loading";
import { PageHeader } from "../../components/page-header";
import { useLocalSync } from "../../lib/sync-context";
import { useCampaign } from "../layouts/campaign-layout";

export function ConflictsRoute() {
  const { campaignId, role } = useCampaign();
  const { userId } = useLocalSync();
  const review = useCampaignReview(campaignId);
  if (
    review.conflicts === undefined ||
    review.recovery === undefined ||
    review.refusedFiles === undefined
  ) {
    return <Loading label="Reading this device…" />;
  }
  return (
    <>
      <PageHeader
        title="Conflicts"
        lead="The same field changed in two places: choose the value to keep."
      />
      <ConflictList
        campaignId={campaignId}
        conflicts={review.conflicts}
        names={review.names}
        userId={userId}
        canResolve={can(role, "site.write")}
      />
      <section aria-labelledby="recovery-heading" className="mt-10 flex flex-col gap-3">
        <h2 id="recovery-heading" className="text-2xl font-semibold">
          Kept for recovery
        </h2>
        <p className="text-muted">
          Changes from this device that the server refused, with its reason. Nothing is lost:
          download them to enter again or to pass on.
        </p>
        <RecoveryList
          campaignId={campaignId}
          entries={review.recovery}
          files={review.refusedFiles}
          names={review.names}
        />
      </section>
    </>
  );
}
