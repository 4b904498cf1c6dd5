// Working through a checklist at the site: each item with its caution, its control and its latest
// result; a number outside its range is flagged at once; sign-off when every required item is done.
import { useState, type ReactNode } from "react";
import type { ChecklistItem } from "../../../../shared/schemas/checklists";
import { describeRange } from "../../../../shared/checklists";
import { hazardLabels } from "../../../../shared/schemas/checklists";
import type { LocalChecklistResult, LocalChecklistRun } from "../../../db/database";
import { Button } from "../../../components/button";
import { TextAreaField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { PendingMark } from "../../../components/pending-mark";
import { StatusShape } from "../../../components/status-shape";
import { messageOf } from "../../../lib/api-error";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import { useChecklistWrites } from "../hooks/use-checklists";
import { ChecklistItemInput } from "./checklist-item-input";

function shown(item: ChecklistItem, result: LocalChecklistResult): string {
  if (item.kind === "check") return result.value === true ? "Done" : "Not done";
  if (item.kind === "photo") return "Photo kept";
  if (item.kind === "number") return `${String(result.value)}${item.unit ? ` ${item.unit}` : ""}`;
  return String(result.value);
}

function Result({
  item,
  result,
}: {
  item: ChecklistItem;
  result: LocalChecklistResult | undefined;
}) {
  if (!result) return <p className="text-sm text-muted">No result yet</p>;
  return (
    <div className="flex flex-wrap items-center gap-2">
      {result.outOfRange ? (
        <p className="flex items-center gap-2 font-semibold text-danger-ink">
          <StatusShape shape="octagon" className="text-danger" />
          {shown(item, result)} — outside the allowed range
          {item.kind === "number" ? ` (${describeRange(item)})` : ""}
        </p>
      ) : (
        <p className="flex items-center gap-2 font-semibold">
          <StatusShape shape="disc" className="text-primary" />
          {shown(item, result)}
        </p>
      )}
      <span className="text-sm text-muted tabular-nums">
        {formatUtc(result.recordedAt)} ({formatLocalBeside(result.recordedAt)})
        {result.recordedByName !== null && ` · ${result.recordedByName}`}
      </span>
      {result.pending && <PendingMark />}
    </div>
  );
}

interface ChecklistRunProps {
  campaignId: string;
  run: LocalChecklistRun;
  results: ReadonlyMap<string, LocalChecklistResult>;
  canRecord: boolean;
  /** Shown above the sign-off: a check the run needs before it can be signed off. */
  beforeSignOff?: ReactNode;
}

export function ChecklistRun({
  campaignId,
  run,
  results,
  canRecord,
  beforeSignOff,
}: ChecklistRunProps) {
  const writes = useChecklistWrites(campaignId);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [note, setNote] = useState("");
  const [signOffError, setSignOffError] = useState<string | null>(null);
  const closed = run.signedOffAt !== null;

  const attempt = (itemId: string, work: () => Promise<unknown>) => async () => {
    setErrors(({ [itemId]: _gone, ...rest }) => rest);
    try {
      await work();
    } catch (error) {
      setErrors((all) => ({ ...all, [itemId]: messageOf(error) }));
    }
  };

  return (
    <div className="flex max-w-3xl flex-col gap-4">
      <ol aria-label={`Items of ${run.title}`} className="flex flex-col gap-3">
        {run.items.map((item, index) => (
          <li
            key={item.id}
            className="flex flex-col gap-3 rounded-xl border-2 border-line bg-surface p-4"
          >
            <h3 className="text-lg font-semibold">
              {index + 1}. {item.label}
              {!item.required && <span className="font-normal text-muted"> (optional)</span>}
            </h3>
            {item.help !== "" && <p className="text-muted">{item.help}</p>}
            {item.caution !== null && (
              <Notice tone="attention" title={`Caution: ${hazardLabels[item.caution.hazard]}`}>
                {item.caution.text}
              </Notice>
            )}
            <Result item={item} result={results.get(item.id)} />
            {!closed && canRecord && (
              <ChecklistItemInput
                item={item}
                current={results.get(item.id)?.value}
                disabled={false}
                onValue={(value) => attempt(item.id, () => writes.record(run.id, item.id, value))()}
                onPhoto={(file) => attempt(item.id, () => writes.photo(run.id, item.id, file))()}
              />
            )}
            {errors[item.id] !== undefined && (
              <Notice tone="danger" title="Not recorded" live>
                {errors[item.id]}
              </Notice>
            )}
          </li>
        ))}
      </ol>
      {beforeSignOff}
      {closed ? (
        <Notice title="Signed off">
          {formatUtc(run.signedOffAt ?? "")} ({formatLocalBeside(run.signedOffAt ?? "")})
          {run.signOffNote !== "" && <> · {run.signOffNote}</>}
        </Notice>
      ) : (
        canRecord && (
          <section
            aria-label="Sign-off"
            className="flex flex-col gap-3 rounded-xl border-2 border-ink p-4"
          >
            <TextAreaField
              label="Note with the sign-off (optional)"
              value={note}
              maxLength={500}
              onChange={(e) => setNote(e.target.value)}
            />
            <div>
              <Button
                tone="primary"
                onClick={() => {
                  setSignOffError(null);
                  writes
                    .signOff(run.id, note)
                    .catch((error: unknown) => setSignOffError(messageOf(error)));
                }}
              >
                Sign off
              </Button>
            </div>
            {signOffError !== null && (
              <Notice tone="danger" title="Not signed off" live>
                {signOffError}
              </Notice>
            )}
          </section>
        )
      )}
    </div>
  );
}
