// The decision in force on a record, in words: who decided, when, and the comment.
import { reviewDecisionLabels, type ReviewView } from "../../../../shared/schemas/reviews";
import { StatusShape, type StatusShapeName } from "../../../components/status-shape";
import { formatUtc } from "../../../lib/format";

const shapes: Record<ReviewView["decision"], StatusShapeName> = {
  approved: "disc",
  sentBack: "triangle",
  reopened: "ring",
};

export function DecisionLine({ review }: { review: ReviewView }) {
  return (
    <div className="flex items-start gap-2">
      <StatusShape shape={shapes[review.decision]} className="mt-1 text-primary" />
      <div className="min-w-0">
        <p>
          <span className="font-semibold">{reviewDecisionLabels[review.decision]}</span> by{" "}
          {review.decidedByName ?? "a reviewer"}, {formatUtc(review.decidedAt)}
        </p>
        {review.comment !== "" && <p className="whitespace-pre-wrap">“{review.comment}”</p>}
      </div>
    </div>
  );
}
