// "Approve all shown": for a queue the reviewer has read through. Asks once more before it acts.
import { useState } from "react";
import { bulkApproveMax, type ReviewQueueItem } from "../../../../shared/schemas/reviews";
import { Button } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { useApproveMany } from "../api/approve-many";

export function ApproveShown({
  campaignId,
  items,
}: {
  campaignId: string;
  items: ReviewQueueItem[];
}) {
  const approve = useApproveMany(campaignId);
  const [asking, setAsking] = useState(false);
  const open = items.filter((i) => i.last?.decision !== "approved").slice(0, bulkApproveMax);
  if (open.length < 2 && !approve.data) return null;
  const run = () =>
    approve.mutate(
      {
        items: open.map((i) => ({
          subjectKind: i.subjectKind,
          subjectId: i.subjectId,
          reviewedSeq: i.latestSeq,
        })),
      },
      { onSettled: () => setAsking(false) },
    );
  return (
    <div className="flex flex-col gap-3">
      {approve.data && (
        <Notice title="Approved" live>
          {approve.data.approved} approved
          {approve.data.skipped > 0 &&
            `; ${approve.data.skipped} changed or were decided meanwhile and are still here for a look`}
          .
        </Notice>
      )}
      {approve.isError && (
        <Notice tone="danger" title="Not approved" live>
          {messageOf(approve.error)}
        </Notice>
      )}
      {open.length >= 2 &&
        (asking ? (
          <div className="flex flex-wrap items-center gap-3">
            <span className="font-semibold">Approve all {open.length} records shown?</span>
            <Button tone="primary" onClick={run} disabled={approve.isPending}>
              Yes, approve {open.length}
            </Button>
            <Button tone="quiet" onClick={() => setAsking(false)}>
              Cancel
            </Button>
          </div>
        ) : (
          <div>
            <Button onClick={() => setAsking(true)}>Approve all {open.length} shown…</Button>
          </div>
        ))}
    </div>
  );
}
