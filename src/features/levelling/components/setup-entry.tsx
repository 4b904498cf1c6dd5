// The entry row under a run: five fields sized for gloves, Enter moves on (and saves from the last
// field), and the reduction of what is typed shows before it is saved.
import { useRef, useState, type KeyboardEvent } from "react";
import type { SetupWarning } from "../../../../shared/levelling-book";
import type { LevellingRun } from "../../../../shared/schemas/levelling";
import type { RunningRow } from "../../../../shared/science/levelling/running";
import { LevellingInputError } from "../../../db/levelling-store";
import { Button } from "../../../components/button";
import { TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { StatusShape } from "../../../components/status-shape";
import { cx } from "../../../lib/cx";
import { messageOf } from "../../../lib/api-error";
import {
  emptyEntry,
  entryFields,
  fieldLabels,
  type EntryField,
  type EntryText,
  type ParsedEntry,
} from "../entry-draft";
import { formatSignedDistanceM, formatSignedM } from "../format";
import { useLevellingWrites } from "../hooks/use-levelling";
import { fallText, riseText, WarningLines } from "./run-table";

const order = ["number", ...entryFields] as const;

interface SetupEntryProps {
  campaignId: string;
  sectionId: string;
  run: LevellingRun;
  runName: string;
  text: EntryText;
  onText: (text: EntryText) => void;
  parsed: ParsedEntry;
  nextNumber: number;
  preview: RunningRow | undefined;
  /** The live misclosure, repeated here because the panel above is out of sight while typing. */
  misclosure: { text: string; within: boolean } | null;
  warnings: readonly SetupWarning[];
}

export function SetupEntry(props: SetupEntryProps) {
  const { campaignId, sectionId, run, runName, text, onText, parsed, nextNumber } = props;
  const writes = useLevellingWrites(campaignId);
  const inputs = useRef<(HTMLInputElement | null)[]>([]);
  const [saveErrors, setSaveErrors] = useState<Partial<Record<string, string>>>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);

  const save = async () => {
    if (saving) return;
    setFailure(null);
    setSaveErrors({});
    const v = parsed.values;
    if (!parsed.complete || parsed.number === null) {
      const missing = entryFields.filter((f) => v[f] === undefined).map((f) => fieldLabels[f]);
      setFailure(
        missing.length > 0 ? `Type ${missing.join(", ")} first` : "Check the setup number",
      );
      return;
    }
    setSaving(true);
    try {
      await writes.setup(sectionId, {
        run,
        number: parsed.number,
        backsightM: v.backsightM ?? Number.NaN,
        foresightM: v.foresightM ?? Number.NaN,
        backsightDistanceM: v.backsightDistanceM ?? Number.NaN,
        foresightDistanceM: v.foresightDistanceM ?? Number.NaN,
      });
      onText(emptyEntry);
      inputs.current[1]?.focus();
    } catch (error) {
      if (error instanceof LevellingInputError && error.field !== "")
        setSaveErrors({ [error.field]: error.message });
      else setFailure(messageOf(error));
    } finally {
      setSaving(false);
    }
  };

  const onKeyDown = (index: number) => (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key !== "Enter") return;
    event.preventDefault();
    const next = inputs.current[index + 1];
    if (next) next.focus();
    else void save();
  };

  const set = (field: EntryField | "number", value: string) => onText({ ...text, [field]: value });
  const errorOf = (field: EntryField | "number") => parsed.errors[field] ?? saveErrors[field];
  const row = props.preview;

  return (
    <form
      aria-label={`New setup, ${runName}`}
      className="flex flex-col gap-3 rounded-xl border-2 border-ink bg-surface p-4"
      onSubmit={(event) => {
        event.preventDefault();
        void save();
      }}
    >
      {text.correcting !== null && (
        <Notice tone="attention" title={`Correcting setup ${text.correcting}`}>
          The new values replace the old ones in the reduction; both stay in the record.
          <div className="mt-2">
            <Button onClick={() => onText(emptyEntry)}>Cancel the correction</Button>
          </div>
        </Notice>
      )}
      <div className="grid grid-cols-[5rem_repeat(4,minmax(0,1fr))] gap-3">
        {order.map((field, index) => (
          <TextField
            key={field}
            ref={(el) => {
              inputs.current[index] = el;
            }}
            label={fieldLabels[field]}
            unit={field === "number" ? undefined : "m"}
            inputMode={field === "number" ? "numeric" : "decimal"}
            enterKeyHint={index === order.length - 1 ? "done" : "next"}
            autoComplete="off"
            className="text-lg tabular-nums"
            value={field === "number" && text.number === "" ? String(nextNumber) : text[field]}
            onChange={(e) => set(field, e.target.value)}
            onKeyDown={onKeyDown(index)}
            error={errorOf(field)}
          />
        ))}
      </div>
      <p className="flex flex-wrap gap-x-6 gap-y-1 tabular-nums">
        {row?.deltaM != null ? (
          <>
            <span>Rise {riseText(row) || "—"} m</span>
            <span>Fall {fallText(row) || "—"} m</span>
            <span>ΔH cum. {formatSignedM(row.cumulativeM)} m</span>
          </>
        ) : (
          <span className="text-muted">Rise and fall show once BS and FS are typed.</span>
        )}
        {row &&
          (parsed.values.backsightDistanceM ?? parsed.values.foresightDistanceM) !== undefined && (
            <span>Imbalance {formatSignedDistanceM(row.imbalanceM)} m</span>
          )}
      </p>
      {props.warnings.length > 0 && <WarningLines warnings={props.warnings} />}
      {props.misclosure !== null && (
        <p className="flex items-start gap-2 tabular-nums">
          <StatusShape
            shape={props.misclosure.within ? "disc" : "octagon"}
            className={cx("mt-0.5", props.misclosure.within ? "text-primary" : "text-danger")}
          />
          <span className={props.misclosure.within ? "" : "font-semibold text-danger-ink"}>
            {props.misclosure.within ? "Within tolerance" : "Out of tolerance"}:{" "}
            {props.misclosure.text}
          </span>
        </p>
      )}
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" tone="primary" disabled={saving}>
          {text.correcting !== null ? `Save correction of setup ${text.correcting}` : "Save setup"}
        </Button>
        {parsed.started && text.correcting === null && (
          <Button onClick={() => onText(emptyEntry)}>Clear</Button>
        )}
      </div>
      {failure !== null && (
        <Notice tone="danger" title="Not saved" live>
          {failure}
        </Notice>
      )}
    </form>
  );
}
