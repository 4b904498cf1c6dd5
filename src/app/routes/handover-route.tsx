import { useNavigate, useParams, useSearchParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { handoverConditionLabels } from "../../../shared/schemas/logistics";
import { ReviewMark, isReadOnly } from "../../features/review/components/review-mark";
import { useRecordReview } from "../../features/review/hooks/use-local-reviews";
import { AttachmentPanel } from "../../features/attachments/components/attachment-panel";
import { LabelScanner } from "../../features/labels/label-scanner";
import { HandoverForm } from "../../features/logistics/components/handover-form";
import { TimeText } from "../../components/local-time-field";
import { useHandoverRecord, useLogistics } from "../../features/logistics/hooks/use-logistics";
import { LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { PendingMark } from "../../components/pending-mark";
import { useCampaign } from "../layouts/campaign-layout";
import { NotAllowed } from "../not-allowed";
import { NotFoundHere } from "../not-found-here";
import { paths } from "../paths";

/** Recording a handover; `?crate=<id>` chooses the crate beforehand. */
export function HandoverRoute() {
  const { campaignId, role } = useCampaign();
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const data = useLogistics(campaignId);
  if (!can(role, "handover.record"))
    return (
      <NotAllowed what="Your role cannot record handovers." backHref={paths.crates(campaignId)} />
    );
  if (data === undefined) return <Loading label="Reading the crates on this device…" />;
  return (
    <>
      <PageHeader
        title="Hand over a crate"
        lead="Custody passes when the receiver types their name"
      />
      <HandoverForm
        campaignId={campaignId}
        crates={data.crates}
        handovers={data.handovers}
        legs={data.legs}
        sites={data.sites}
        initialCrateId={search.get("crate") ?? undefined}
        scanner={(onLabel) => <LabelScanner onLabel={onLabel} />}
        onSaved={(id) => void navigate(paths.handoverRecord(campaignId, id))}
      />
    </>
  );
}

/** One handover, with its photos. */
export function HandoverRecordRoute() {
  const { campaignId, role } = useCampaign();
  const { handoverId = "" } = useParams();
  const record = useHandoverRecord(campaignId, handoverId);
  const review = useRecordReview(campaignId, handoverId);
  if (record === undefined) return <Loading label="Reading the handover on this device…" />;
  if (record === null)
    return (
      <NotFoundHere title="Handover not found" backHref={paths.crates(campaignId)}>
        It is not on this device yet.
      </NotFoundHere>
    );
  const { handover, crate } = record;
  const label = crate?.label ?? "Crate";
  return (
    <>
      <PageHeader
        title={`${label}: ${handover.fromName} → ${handover.toName}`}
        lead={
          <span className="inline-flex flex-wrap items-center gap-3">
            <TimeText iso={handover.at} />
            {handover.pending && <PendingMark />}
          </span>
        }
      />
      <ReviewMark review={review} />
      <div className="mb-4 flex flex-col gap-4">
        {handover.pending && <Notice title="Saved on this device">Sent with the next sync.</Notice>}
        <p>
          Condition: {handoverConditionLabels[handover.condition]}
          {handover.place !== "" && ` · ${handover.place}`}
        </p>
        <p>Signed by typed name: {handover.toName}</p>
        {handover.note !== "" && <p className="whitespace-pre-line">{handover.note}</p>}
        {crate !== null && (
          <div>
            <LinkButton to={paths.crate(campaignId, crate.id)}>
              Chain of custody of {label}
            </LinkButton>
          </div>
        )}
      </div>
      <AttachmentPanel
        campaignId={campaignId}
        subject={{ kind: "handover", id: handover.id, label: `${label} handover` }}
        canAdd={can(role, "attachment.write") && !isReadOnly(review)}
      />
    </>
  );
}
