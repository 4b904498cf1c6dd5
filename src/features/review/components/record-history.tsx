// A record's change history, read from the server when opened (it needs the network).
import { useState } from "react";
import type { TrailEntity } from "../../../../shared/schemas/reviews";
import { Loading } from "../../../components/loading";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { useRecordTrail } from "../api/record-trail";
import { AuditTrail } from "./audit-trail";

interface RecordHistoryProps {
  campaignId: string;
  entity: TrailEntity;
  id: string;
}

export function RecordHistory({ campaignId, entity, id }: RecordHistoryProps) {
  const [open, setOpen] = useState(false);
  const trail = useRecordTrail(campaignId, entity, id, open);
  return (
    <details
      className="mt-8 rounded-lg border-2 border-line p-4"
      onToggle={(e) => setOpen(e.currentTarget.open)}
    >
      <summary className="min-h-touch cursor-pointer text-lg font-semibold">Change history</summary>
      <div className="mt-3">
        {!open ? null : trail.isPending ? (
          <Loading label="Reading the history…" />
        ) : trail.data === undefined ? (
          <Notice tone="danger" title="History not available">
            {messageOf(trail.error)}
          </Notice>
        ) : (
          <AuditTrail events={trail.data} />
        )}
      </div>
    </details>
  );
}
