import { useLocation, useParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { fieldEntryKindLabels } from "../../../shared/schemas/field-entries";
import { AttachmentPanel } from "../../features/attachments/components/attachment-panel";
import { ReviewMark, isReadOnly } from "../../features/review/components/review-mark";
import { useRecordReview } from "../../features/review/hooks/use-local-reviews";
import { EntryDetails } from "../../features/field-entries/components/entry-details";
import { useCrates, useFieldEntry } from "../../features/field-entries/hooks/use-field-entries";
import { useLocalSite } from "../../features/sites/hooks/use-local-sites";
import { LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { NotFoundHere } from "../not-found-here";
import { paths } from "../paths";
import type { EntrySavedState } from "./entry-new-route";

function SavedNotice() {
  const state = useLocation().state as EntrySavedState | null;
  if (!state?.flags) return null;
  return (
    <div role="status" className="mb-4">
      <Notice tone={state.flags.exceeded ? "danger" : "info"} title="Saved on this device">
        {state.flags.exceeded ? `Limit exceeded: ${state.flags.summary}. ` : ""}
        It is sent to the server when there is a connection. Add a photo below if it helps.
      </Notice>
    </div>
  );
}

export function EntryRoute() {
  const { campaignId, role } = useCampaign();
  const { entryId = "" } = useParams();
  const entry = useFieldEntry(campaignId, entryId);
  const review = useRecordReview(campaignId, entryId);
  const crates = useCrates(campaignId);
  const site = useLocalSite(campaignId, entry?.siteId ?? "");
  if (entry === undefined) return <Loading label="Reading the entry on this device…" />;
  if (entry === null)
    return (
      <NotFoundHere title="Entry not found" backHref={paths.sites(campaignId)}>
        It is not on this device yet.
      </NotFoundHere>
    );
  const crate = crates?.find((c) => c.id === entry.crateId) ?? null;
  const siteName = site?.name ?? "the site";
  const title = `${fieldEntryKindLabels[entry.kind]}${crate ? ` · ${crate.label}` : ""}`;
  const runId = entry.data.kind === "dew-point" ? entry.data.runId : null;
  return (
    <>
      <PageHeader title={title} lead={`At ${siteName}`} />
      <div className="mb-4 flex flex-wrap gap-3">
        <LinkButton tone="quiet" className="px-0" to={paths.siteBoard(campaignId, entry.siteId)}>
          Back to {siteName}
        </LinkButton>
        {runId !== null && (
          <LinkButton to={paths.checklistRun(campaignId, runId)}>Back to the checklist</LinkButton>
        )}
      </div>
      <SavedNotice />
      <ReviewMark review={review} />
      <EntryDetails entry={entry} crate={crate} />
      <AttachmentPanel
        campaignId={campaignId}
        subject={{ kind: "fieldEntry", id: entry.id, label: title }}
        canAdd={can(role, "attachment.write") && !isReadOnly(review)}
      />
    </>
  );
}
