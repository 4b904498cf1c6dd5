// Office review: the queue of synced records with filters, and one record with its trail.
import { useParams, useSearchParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import {
  reviewQueueQuery,
  reviewSubjectKind,
  reviewSubjectLabels,
  type ReviewQueueItem,
  type ReviewQueueQuery,
} from "../../../shared/schemas/reviews";
import { useReviewQueue } from "../../features/review/api/review-queue";
import { useReviewRecord } from "../../features/review/api/review-record";
import {
  useSetSummarySubscription,
  useSummarySubscription,
} from "../../features/review/api/summary-subscription";
import { ApproveShown } from "../../features/review/components/approve-shown";
import { AuditTrail } from "../../features/review/components/audit-trail";
import { DecisionControls } from "../../features/review/components/decision-controls";
import { DecisionLine } from "../../features/review/components/decision-line";
import { ReviewFilters, showLabels } from "../../features/review/components/review-filters";
import { ReviewQueueList } from "../../features/review/components/review-queue-list";
import { useLocalSites } from "../../features/sites/hooks/use-local-sites";
import { LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { messageOf } from "../../lib/api-error";
import { formatUtc } from "../../lib/format";
import { NotAllowed } from "../not-allowed";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";

function SummaryToggle({ campaignId }: { campaignId: string }) {
  const summary = useSummarySubscription(campaignId);
  const set = useSetSummarySubscription(campaignId);
  if (summary.data === undefined) return null;
  return (
    <label className="flex min-h-touch items-center gap-3">
      <input
        type="checkbox"
        className="size-6"
        checked={summary.data.weekly}
        disabled={set.isPending}
        onChange={(e) => set.mutate(e.target.checked)}
      />
      E-mail me a weekly summary of this queue
    </label>
  );
}

export function ReviewRoute() {
  const { campaignId, role } = useCampaign();
  const [params, setParams] = useSearchParams();
  const parsed = reviewQueueQuery.safeParse(Object.fromEntries(params));
  const query: ReviewQueueQuery = parsed.success ? parsed.data : { show: "waiting" };
  const queue = useReviewQueue(campaignId, query, can(role, "entry.review"));
  const { sites } = useLocalSites(campaignId);
  if (!can(role, "entry.review"))
    return (
      <NotAllowed
        what="Reviewing records is for reviewers and administrators."
        backHref={paths.sites(campaignId)}
      />
    );
  const setQuery = (next: ReviewQueueQuery) =>
    setParams(
      Object.fromEntries(Object.entries(next).filter(([, v]) => v !== undefined && v !== "")),
      { replace: true },
    );
  const recordHref = (item: ReviewQueueItem) =>
    paths.reviewRecord(campaignId, item.subjectKind, item.subjectId);
  return (
    <>
      <PageHeader
        title="Review"
        lead="Records synced from the field: approve them, or send them back with what to fix"
        actions={<SummaryToggle campaignId={campaignId} />}
      />
      <div className="flex flex-col gap-4">
        <ReviewFilters
          value={query}
          onChange={setQuery}
          sites={(sites ?? []).map((s) => ({ id: s.id, name: s.name }))}
          people={queue.data?.people ?? []}
        />
        {queue.isPending ? (
          <Loading label="Reading the queue…" />
        ) : queue.data === undefined ? (
          <Notice tone="danger" title="Queue not available">
            {messageOf(queue.error)}
          </Notice>
        ) : (
          <section aria-labelledby="queue-heading" className="flex flex-col gap-3">
            <h2 id="queue-heading" className="text-xl font-semibold">
              {showLabels[query.show ?? "waiting"]}: {queue.data.items.length}
              {queue.data.truncated ? "+" : ""}
            </h2>
            {queue.data.truncated && (
              <Notice tone="attention" title="More records than shown">
                Narrow the filters (a site, a person or dates) to see the rest.
              </Notice>
            )}
            <ApproveShown campaignId={campaignId} items={queue.data.items} />
            {queue.data.items.length === 0 ? (
              <p className="text-muted">Nothing here with these filters.</p>
            ) : (
              <ReviewQueueList
                campaignId={campaignId}
                items={queue.data.items}
                recordHref={recordHref}
                canDecide
              />
            )}
          </section>
        )}
      </div>
    </>
  );
}

export function ReviewRecordRoute() {
  const { campaignId, role } = useCampaign();
  const { kind: rawKind = "", recordId = "" } = useParams();
  const kind = reviewSubjectKind.safeParse(rawKind);
  // Nothing is asked for a kind that is not reviewed, nor by a role that may not read the trail.
  const record = useReviewRecord(
    campaignId,
    kind.success ? kind.data : "fieldEntry",
    recordId,
    kind.success && can(role, "audit.read"),
  );
  if (!can(role, "audit.read"))
    return (
      <NotAllowed
        what="The audit trail is for geodesists, reviewers and administrators."
        backHref={paths.sites(campaignId)}
      />
    );
  if (!kind.success)
    return (
      <Notice tone="danger" title="Not a kind of record">
        “{rawKind}” is not a kind of record that is reviewed.
      </Notice>
    );
  if (record.isPending) return <Loading label="Reading the record…" />;
  if (record.data === undefined)
    return (
      <Notice tone="danger" title="Record not available">
        {messageOf(record.error)}
      </Notice>
    );
  const { item, decisions, trail } = record.data;
  return (
    <>
      <PageHeader
        title={`${reviewSubjectLabels[item.subjectKind]}: ${item.title}`}
        lead={`${item.detail} · ${item.siteName ?? "No site"} · ${item.authorName ?? "Unknown author"} · ${formatUtc(item.at)}`}
      />
      <div className="flex flex-col gap-6">
        <div className="flex flex-wrap gap-3">
          {can(role, "entry.review") && (
            <LinkButton tone="quiet" className="px-0" to={paths.review(campaignId)}>
              Back to the queue
            </LinkButton>
          )}
          <LinkButton to={paths.reviewSubject(campaignId, item.subjectKind, item.subjectId)}>
            Open the record
          </LinkButton>
        </div>
        <section aria-labelledby="decision-heading" className="flex flex-col gap-3">
          <h2 id="decision-heading" className="text-xl font-semibold">
            Decision
          </h2>
          {decisions.length === 0 ? (
            <p className="text-muted">Not reviewed yet.</p>
          ) : (
            <ul className="flex flex-col gap-2">
              {decisions.map((d) => (
                <li key={d.id}>
                  <DecisionLine review={d} />
                </li>
              ))}
            </ul>
          )}
          {can(role, "entry.review") && <DecisionControls campaignId={campaignId} item={item} />}
        </section>
        <section aria-labelledby="trail-heading" className="flex flex-col gap-3">
          <h2 id="trail-heading" className="text-xl font-semibold">
            Audit trail
          </h2>
          <AuditTrail events={trail} />
        </section>
      </div>
    </>
  );
}
