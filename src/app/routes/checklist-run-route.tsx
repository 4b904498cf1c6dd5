import { useParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { ChecklistRun } from "../../features/checklists/components/checklist-run";
import { ReviewMark, isReadOnly } from "../../features/review/components/review-mark";
import { useRecordReview } from "../../features/review/hooks/use-local-reviews";
import { DewPointGate } from "../../features/field-entries/components/dew-point-gate";
import { useCrates, useSiteEntries } from "../../features/field-entries/hooks/use-field-entries";
import { useChecklistRun } from "../../features/checklists/hooks/use-checklists";
import { useLocalSite } from "../../features/sites/hooks/use-local-sites";
import { LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { PageHeader } from "../../components/page-header";
import { formatLocalBeside, formatUtc } from "../../lib/format";
import { useCampaign } from "../layouts/campaign-layout";
import { NotFoundHere } from "../not-found-here";
import { paths } from "../paths";

export function ChecklistRunRoute() {
  const { campaignId, role } = useCampaign();
  const { runId = "" } = useParams();
  const { run, results } = useChecklistRun(campaignId, runId);
  const review = useRecordReview(campaignId, runId);
  const site = useLocalSite(campaignId, run?.siteId ?? "");
  const entries = useSiteEntries(campaignId, run?.siteId ?? "");
  const crates = useCrates(campaignId);
  if (run === undefined || results === undefined)
    return <Loading label="Reading the checklist on this device…" />;
  if (run === null) {
    return (
      <NotFoundHere title="Checklist not found" backHref={paths.sites(campaignId)}>
        It is not on this device yet.
      </NotFoundHere>
    );
  }
  const siteName = site?.name ?? "the site";
  return (
    <>
      <PageHeader
        title={run.title}
        lead={`At ${siteName} · started ${formatUtc(run.startedAt)} (${formatLocalBeside(run.startedAt)})`}
      />
      <div className="mb-4">
        <LinkButton tone="quiet" className="px-0" to={paths.siteBoard(campaignId, run.siteId)}>
          Back to {siteName}
        </LinkButton>
      </div>
      <ReviewMark review={review} />
      <ChecklistRun
        campaignId={campaignId}
        run={run}
        results={results}
        canRecord={can(role, "checklist.record") && !isReadOnly(review)}
        beforeSignOff={
          run.purpose === "unpacking" && (
            <DewPointGate
              runId={run.id}
              entries={entries ?? []}
              crates={crates ?? []}
              checkHref={
                run.signedOffAt === null && can(role, "entry.record")
                  ? paths.newEntry(campaignId, run.siteId, "dew-point", run.id)
                  : null
              }
              entryHref={(id) => paths.entry(campaignId, id)}
            />
          )
        }
      />
    </>
  );
}
