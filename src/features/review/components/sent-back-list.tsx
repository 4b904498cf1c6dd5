// On the site board: records the office sent back, with what to fix, until they are decided again.
import { Link } from "react-router-dom";
import { reviewSubjectLabels, type ReviewView } from "../../../../shared/schemas/reviews";
import { formatUtc } from "../../../lib/format";

interface SentBackListProps {
  reviews: ReviewView[];
  recordHref: (review: ReviewView) => string;
}

export function SentBackList({ reviews, recordHref }: SentBackListProps) {
  if (reviews.length === 0) return null;
  return (
    <section
      aria-labelledby="sent-back-heading"
      className="flex flex-col gap-3 rounded-lg border-2 border-attention bg-attention-soft p-4 text-attention-ink"
    >
      <h2 id="sent-back-heading" className="text-xl font-semibold">
        Sent back by the office: {reviews.length}
      </h2>
      <ul className="flex flex-col gap-2">
        {reviews.map((review) => (
          <li key={review.id}>
            <Link to={recordHref(review)} className="font-semibold">
              {reviewSubjectLabels[review.subjectKind]}
            </Link>
            <span>
              {" "}
              · {review.decidedByName ?? "a reviewer"}, {formatUtc(review.decidedAt)}:{" "}
            </span>
            <span className="whitespace-pre-wrap">“{review.comment}”</span>
          </li>
        ))}
      </ul>
    </section>
  );
}
