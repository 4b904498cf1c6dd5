// The queue as a list of cards: big enough to decide on a tablet, one record per card.
import { Link } from "react-router-dom";
import { reviewSubjectLabels, type ReviewQueueItem } from "../../../../shared/schemas/reviews";
import { formatUtc } from "../../../lib/format";
import { DecisionControls } from "./decision-controls";
import { DecisionLine } from "./decision-line";

interface ReviewQueueListProps {
  campaignId: string;
  items: ReviewQueueItem[];
  recordHref: (item: ReviewQueueItem) => string;
  canDecide: boolean;
}

export function ReviewQueueList({
  campaignId,
  items,
  recordHref,
  canDecide,
}: ReviewQueueListProps) {
  return (
    <ul className="flex flex-col gap-3" aria-label="Records">
      {items.map((item) => (
        <li
          key={`${item.subjectKind}:${item.subjectId}`}
          className="flex flex-col gap-3 rounded-lg border-2 border-line bg-surface p-4"
          aria-label={`${reviewSubjectLabels[item.subjectKind]}: ${item.title}`}
        >
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <p className="text-lg font-semibold">
              <span className="text-muted">{reviewSubjectLabels[item.subjectKind]} · </span>
              <Link to={recordHref(item)}>{item.title}</Link>
            </p>
            {item.waiting && item.last !== null && (
              <span className="rounded-full border-2 border-attention px-2 text-sm font-semibold">
                Changed since the last decision
              </span>
            )}
          </div>
          <p className="text-muted">
            {item.detail}
            {" · "}
            {item.siteName ?? "No site"} · {item.authorName ?? "Unknown author"} ·{" "}
            {formatUtc(item.at)}
          </p>
          {item.last !== null && <DecisionLine review={item.last} />}
          {canDecide && <DecisionControls campaignId={campaignId} item={item} />}
        </li>
      ))}
    </ul>
  );
}
