// Alerts newest first: open ones marked with the octagon and words; logistics acknowledges each
// with a note saying what was checked.
import { useState } from "react";
import type { CrateView } from "../../../../shared/schemas/crates";
import type { LocalAlert } from "../../../db/database";
import { Button } from "../../../components/button";
import { TextAreaField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { PendingMark } from "../../../components/pending-mark";
import { StatusShape } from "../../../components/status-shape";
import { messageOf } from "../../../lib/api-error";
import { useLogisticsWrites } from "../hooks/use-logistics";
import { TimeText } from "../../../components/local-time-field";

interface Props {
  campaignId: string;
  alerts: readonly LocalAlert[];
  crates: readonly CrateView[];
  canAcknowledge: boolean;
  label?: string;
}

export function AlertList({ campaignId, alerts, crates, canAcknowledge, label = "Alerts" }: Props) {
  if (alerts.length === 0) return <p className="text-muted">No alerts.</p>;
  return (
    <ul aria-label={label} className="flex flex-col gap-3">
      {alerts.map((alert) => (
        <AlertItem
          key={alert.id}
          campaignId={campaignId}
          alert={alert}
          crateLabel={crates.find((c) => c.id === alert.crateId)?.label ?? null}
          canAcknowledge={canAcknowledge}
        />
      ))}
    </ul>
  );
}

function AlertItem({
  campaignId,
  alert,
  crateLabel,
  canAcknowledge,
}: {
  campaignId: string;
  alert: LocalAlert;
  crateLabel: string | null;
  canAcknowledge: boolean;
}) {
  const writes = useLogisticsWrites(campaignId);
  const [open, setOpen] = useState(false);
  const [note, setNote] = useState("");
  const [failure, setFailure] = useState<string | null>(null);
  const acknowledged = alert.acknowledgedAt !== null;
  const save = async () => {
    setFailure(null);
    try {
      await writes.acknowledge(alert.id, note);
      setOpen(false);
    } catch (error) {
      setFailure(messageOf(error));
    }
  };
  return (
    <li
      className={
        acknowledged
          ? "flex flex-col gap-2 rounded-lg border-2 border-line bg-surface p-3"
          : "flex flex-col gap-2 rounded-lg border-2 border-danger bg-danger-soft p-3 text-danger-ink"
      }
    >
      <p className="flex flex-wrap items-center gap-x-3 font-semibold">
        {acknowledged ? (
          <span className="inline-flex items-center gap-2">
            <StatusShape shape="disc" className="text-primary" /> Acknowledged
          </span>
        ) : (
          <span className="inline-flex items-center gap-2">
            <StatusShape shape="octagon" className="text-danger" /> Not yet acknowledged
          </span>
        )}
        {crateLabel !== null && <span>{crateLabel}</span>}
        {alert.pending && <PendingMark />}
      </p>
      <p className="text-lg">{alert.summary}</p>
      <p className="text-sm">
        Raised <TimeText iso={alert.createdAt} />
      </p>
      {acknowledged && alert.acknowledgedAt !== null && (
        <p className="text-sm">
          Acknowledged <TimeText iso={alert.acknowledgedAt} />
          {alert.acknowledgeNote !== "" && `: ${alert.acknowledgeNote}`}
        </p>
      )}
      {!acknowledged && canAcknowledge && !open && (
        <div>
          <Button onClick={() => setOpen(true)}>Acknowledge…</Button>
        </div>
      )}
      {open && (
        <form
          className="flex flex-col gap-3"
          aria-label={`Acknowledge: ${alert.summary}`}
          onSubmit={(e) => {
            e.preventDefault();
            void save();
          }}
        >
          <TextAreaField
            label="What was checked (note)"
            value={note}
            onChange={(e) => setNote(e.target.value)}
          />
          <div className="flex flex-wrap gap-3">
            <Button type="submit" tone="primary">
              Acknowledge
            </Button>
            <Button tone="quiet" onClick={() => setOpen(false)}>
              Cancel
            </Button>
          </div>
          {failure !== null && (
            <Notice tone="danger" title="Not acknowledged" live>
              {failure}
            </Notice>
          )}
        </form>
      )}
    </li>
  );
}
