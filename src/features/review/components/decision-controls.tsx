// Approve, send back (with what to fix) or reopen one record. The decision names the change
// position the reviewer looked at, so a record that moved on meanwhile is not decided blind.
import { useState } from "react";
import {
  reviewCommentMax,
  reviewSubjectLabels,
  type ReviewQueueItem,
} from "../../../../shared/schemas/reviews";
import { Button } from "../../../components/button";
import { TextAreaField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { useDecide } from "../api/decide";

interface DecisionControlsProps {
  campaignId: string;
  item: ReviewQueueItem;
}

export function DecisionControls({ campaignId, item }: DecisionControlsProps) {
  const decide = useDecide(campaignId);
  const [writing, setWriting] = useState(false);
  const [comment, setComment] = useState("");
  const approved = item.last?.decision === "approved";
  const what = `${reviewSubjectLabels[item.subjectKind].toLowerCase()} ${item.title}`;
  const send = (decision: "approved" | "sentBack" | "reopened", text = "") =>
    decide.mutate(
      {
        subjectKind: item.subjectKind,
        subjectId: item.subjectId,
        decision,
        comment: text,
        reviewedSeq: item.latestSeq,
      },
      { onSuccess: () => (setWriting(false), setComment("")) },
    );
  const tooLong = comment.length > reviewCommentMax;
  return (
    <div className="flex flex-col gap-3">
      {decide.isError && (
        <Notice tone="danger" title="Not decided" live>
          {messageOf(decide.error)}
        </Notice>
      )}
      {writing ? (
        <form
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            if (comment.trim() !== "" && !tooLong) send("sentBack", comment);
          }}
        >
          <TextAreaField
            label="What should the author fix?"
            hint="The author sees this on their tablet after the next sync, and by e-mail."
            value={comment}
            error={tooLong ? `At most ${reviewCommentMax} characters` : undefined}
            onChange={(e) => setComment(e.target.value)}
            autoFocus
          />
          <div className="flex flex-wrap gap-3">
            <Button
              type="submit"
              tone="danger"
              disabled={comment.trim() === "" || tooLong || decide.isPending}
            >
              Send back
            </Button>
            <Button tone="quiet" onClick={() => setWriting(false)}>
              Cancel
            </Button>
          </div>
        </form>
      ) : approved ? (
        <div>
          <Button
            onClick={() => send("reopened")}
            disabled={decide.isPending}
            aria-label={`Reopen ${what}`}
          >
            Reopen
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap gap-3">
          <Button
            tone="primary"
            onClick={() => send("approved")}
            disabled={decide.isPending}
            aria-label={`Approve ${what}`}
          >
            Approve
          </Button>
          <Button onClick={() => setWriting(true)} aria-label={`Send back ${what}`}>
            Send back…
          </Button>
        </div>
      )}
    </div>
  );
}
