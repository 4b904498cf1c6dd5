// Editing a crate (logistics, online): the shared crateFields schema checks it here and on the
// server; each error appears at its field. Numbers are typed as text (decimal comma accepted).
import { useState } from "react";
import type { CrateView } from "../../../../shared/schemas/crates";
import {
  crateFields,
  crateStateLabels,
  crateStates,
  logisticsLimits,
  type CrateFields,
} from "../../../../shared/schemas/logistics";
import { Button } from "../../../components/button";
import { SelectField, TextAreaField, TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { isApiError, messageOf } from "../../../lib/api-error";
import { parseDecimal } from "../../../lib/format";
import { useConnectivity } from "../../../lib/use-connectivity";
import { useSaveCrate } from "../api/save-crate";
import { useLogisticsWrites } from "../hooks/use-logistics";

type Draft = Record<
  | "label"
  | "contents"
  | "instrument"
  | "weightKg"
  | "maxShockG"
  | "temperatureMinC"
  | "temperatureMaxC"
  | "maxTiltDeg"
  | "state"
  | "notes",
  string
>;

const draftOf = (c: CrateView | null): Draft => ({
  label: c?.label ?? "",
  contents: c?.contents ?? "",
  instrument: c?.instrument ?? "",
  weightKg: c === null ? "" : String(c.weightKg),
  maxShockG: c === null ? "" : String(c.maxShockG),
  temperatureMinC: c === null ? "" : String(c.temperatureMinC),
  temperatureMaxC: c === null ? "" : String(c.temperatureMaxC),
  maxTiltDeg: c?.maxTiltDeg == null ? "" : String(c.maxTiltDeg),
  state: c?.state ?? "ready",
  notes: c?.notes ?? "",
});

interface Props {
  campaignId: string;
  crate: CrateView | null;
  onDone: (crate: CrateView) => void;
  onCancel: () => void;
}

export function CrateForm({ campaignId, crate, onDone, onCancel }: Props) {
  const online = useConnectivity() === "online";
  const writes = useLogisticsWrites(campaignId);
  const save = useSaveCrate(campaignId, writes.keepCrate);
  const [draft, setDraft] = useState<Draft>(() => draftOf(crate));
  const [errors, setErrors] = useState<Partial<Record<string, string>>>({});
  const [failure, setFailure] = useState<string | null>(null);
  const set = (key: keyof Draft) => (e: { target: { value: string } }) =>
    setDraft((d) => ({ ...d, [key]: e.target.value }));

  const submit = async () => {
    setErrors({});
    setFailure(null);
    const parsed = crateFields.safeParse({
      ...draft,
      weightKg: parseDecimal(draft.weightKg),
      maxShockG: parseDecimal(draft.maxShockG),
      temperatureMinC: parseDecimal(draft.temperatureMinC),
      temperatureMaxC: parseDecimal(draft.temperatureMaxC),
      maxTiltDeg: draft.maxTiltDeg.trim() === "" ? null : parseDecimal(draft.maxTiltDeg),
    });
    if (!parsed.success) {
      const found: Record<string, string> = {};
      for (const issue of parsed.error.issues) found[issue.path.join(".")] ??= issue.message;
      setErrors(found);
      return;
    }
    try {
      const saved = await save.mutateAsync({
        id: crate?.id ?? crypto.randomUUID(),
        baseVersion: crate?.version ?? null,
        crate: parsed.data as CrateFields,
      });
      onDone(saved);
    } catch (error) {
      if (isApiError(error) && error.details.length > 0) {
        const found: Record<string, string> = {};
        for (const d of error.details) found[d.path.replace(/^crate\./, "")] ??= d.message;
        setErrors(found);
      }
      setFailure(messageOf(error));
    }
  };

  if (!online)
    return (
      <Notice tone="attention" title="Needs a connection">
        Crates are edited online. Everything else on this page works offline; try again when the
        tablet has a network.
      </Notice>
    );
  const number = (key: keyof Draft, label: string, unit: string, hint?: string) => (
    <TextField
      label={label}
      unit={unit}
      hint={hint}
      inputMode="decimal"
      value={draft[key]}
      onChange={set(key)}
      error={errors[key]}
      className="tabular-nums"
    />
  );
  return (
    <form
      aria-labelledby="crate-form"
      className="flex flex-col gap-4 rounded-xl border-2 border-line bg-surface p-4"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
      noValidate
    >
      <h2 id="crate-form" className="text-xl font-semibold">
        {crate === null ? "New crate" : `Edit ${crate.label}`}
      </h2>
      <div className="grid gap-4 md:grid-cols-2">
        <TextField
          label="Label"
          value={draft.label}
          maxLength={logisticsLimits.labelMax}
          onChange={set("label")}
          error={errors.label}
        />
        <TextField
          label="Contents"
          value={draft.contents}
          maxLength={logisticsLimits.textMax}
          onChange={set("contents")}
          error={errors.contents}
        />
        <TextField
          label="Instrument (optional)"
          value={draft.instrument}
          maxLength={logisticsLimits.textMax}
          onChange={set("instrument")}
          error={errors.instrument}
        />
        <SelectField label="State" value={draft.state} onChange={set("state")} error={errors.state}>
          {crateStates.map((s) => (
            <option key={s} value={s}>
              {crateStateLabels[s]}
            </option>
          ))}
        </SelectField>
        {number("weightKg", "Weight", "kg")}
        {number("maxShockG", "Highest shock", "g")}
        {number("temperatureMinC", "Lowest temperature", "°C")}
        {number("temperatureMaxC", "Highest temperature", "°C")}
        {number(
          "maxTiltDeg",
          "Largest tilt (optional)",
          "°",
          "Leave empty when tilt does not matter",
        )}
      </div>
      <TextAreaField
        label="Notes"
        value={draft.notes}
        maxLength={logisticsLimits.noteMax}
        onChange={set("notes")}
        error={errors.notes}
      />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" tone="primary" disabled={save.isPending}>
          Save crate
        </Button>
        <Button tone="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
      {failure !== null && (
        <Notice tone="danger" title="Not saved" live>
          {failure}
        </Notice>
      )}
    </form>
  );
}
