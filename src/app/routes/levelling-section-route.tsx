import { useParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { findLevellingClass } from "../../../shared/science/levelling/misclosure";
import { AttachmentPanel } from "../../features/attachments/components/attachment-panel";
import { FieldBook } from "../../features/levelling/components/field-book";
import { LevellingCaution } from "../../features/levelling/components/levelling-caution";
import { useLevellingSection } from "../../features/levelling/hooks/use-levelling";
import { ReviewMark, isReadOnly } from "../../features/review/components/review-mark";
import { useRecordReview } from "../../features/review/hooks/use-local-reviews";
import { useLocalSite } from "../../features/sites/hooks/use-local-sites";
import { LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { PageHeader } from "../../components/page-header";
import { PendingMark } from "../../components/pending-mark";
import { useCampaign } from "../layouts/campaign-layout";
import { NotFoundHere } from "../not-found-here";
import { paths } from "../paths";

export function LevellingSectionRoute() {
  const { campaignId, role } = useCampaign();
  const { sectionId = "" } = useParams();
  const { section, setups } = useLevellingSection(campaignId, sectionId);
  const site = useLocalSite(campaignId, section?.siteId ?? "");
  const review = useRecordReview(campaignId, sectionId);
  if (section === undefined || setups === undefined)
    return <Loading label="Reading the field book on this device…" />;
  if (section === null) {
    return (
      <NotFoundHere title="Section not found" backHref={paths.sites(campaignId)}>
        It is not on this device yet.
      </NotFoundHere>
    );
  }
  const levellingClass = findLevellingClass(section.classId);
  const readOnly = isReadOnly(review);
  const canRecord = can(role, "levelling.record") && !readOnly;
  return (
    <>
      <PageHeader
        title={`${section.fromMark} → ${section.toMark}`}
        lead={
          <span className="inline-flex flex-wrap items-center gap-3">
            <span>
              {site?.name ?? "Site"} · {levellingClass.name}
              {section.instrument !== "" && ` · ${section.instrument}`}
            </span>
            {section.pending && <PendingMark />}
          </span>
        }
      />
      <div className="mb-4">
        <LinkButton tone="quiet" className="px-0" to={paths.levelling(campaignId, section.siteId)}>
          All sections at {site?.name ?? "this site"}
        </LinkButton>
      </div>
      <div className="flex flex-col gap-6">
        {section.closedAt === null && canRecord && <LevellingCaution />}
        <ReviewMark review={review} />
        {!canRecord && !readOnly && (
          <p className="text-muted">Your role can read this field book but not write in it.</p>
        )}
        <FieldBook
          campaignId={campaignId}
          section={section}
          setups={setups}
          canRecord={canRecord}
        />
      </div>
      <AttachmentPanel
        campaignId={campaignId}
        subject={{
          kind: "levellingSection",
          id: section.id,
          label: `${section.fromMark} → ${section.toMark}`,
        }}
        canAdd={can(role, "attachment.write") && !readOnly}
      />
    </>
  );
}
