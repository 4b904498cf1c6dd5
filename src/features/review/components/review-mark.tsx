// On a field record: the office's decision, so the author sees a send-back and knows an approved
// record is read-only until a reviewer reopens it.
import { reviewDecisionLabels, type ReviewView } from "../../../../shared/schemas/reviews";
import { Notice } from "../../../components/notice";
import { formatUtc } from "../../../lib/format";

export function ReviewMark({ review }: { review: ReviewView | null | undefined }) {
  if (!review) return null;
  const by = `${review.decidedByName ?? "a reviewer"}, ${formatUtc(review.decidedAt)}`;
  if (review.decision === "approved")
    return (
      <Notice title="Approved by the office" className="mb-4">
        {by}. It is read-only now; a reviewer can reopen it if something must change.
      </Notice>
    );
  if (review.decision === "sentBack")
    return (
      <div role="status" className="mb-4">
        <Notice tone="attention" title="Sent back by the office">
          <span className="block whitespace-pre-wrap font-semibold">“{review.comment}”</span>
          <span className="block">
            {by}. Add what is missing (a newer entry, a photo or the missing items).
          </span>
        </Notice>
      </div>
    );
  return (
    <Notice title={`${reviewDecisionLabels.reopened} by the office`} className="mb-4">
      {by}
      {review.comment !== "" ? `: “${review.comment}”` : ""}. It can be changed again.
    </Notice>
  );
}

/** Approved records take no changes on the tablet; the server refuses them as well. */
export const isReadOnly = (review: ReviewView | null | undefined) =>
  review?.decision === "approved";
