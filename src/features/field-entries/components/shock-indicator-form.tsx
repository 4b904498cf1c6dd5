// A shock indicator as read on the crate: its rating and whether it has tripped.
import { useState } from "react";
import { TextField } from "../../../components/form-field";
import {
  EntryFormFrame,
  type EntryFormProps,
  typedNumber,
  useSaveEntry,
  YesNoField,
} from "./entry-form-parts";

export function ShockIndicatorForm({ campaignId, siteId, onSaved }: EntryFormProps) {
  const form = useSaveEntry(campaignId, onSaved);
  const { errors, save } = form;
  const [crateId, setCrateId] = useState("");
  const [rating, setRating] = useState("");
  const [tripped, setTripped] = useState<boolean | null>(null);
  const [label, setLabel] = useState("");
  const [note, setNote] = useState("");
  const submit = () =>
    save({
      siteId,
      crateId: crateId === "" ? null : crateId,
      observedAt: new Date().toISOString(),
      note,
      data: {
        kind: "shock-indicator",
        ratingG: typedNumber(rating),
        // The schema names a missing answer; null is not a boolean.
        tripped: tripped as boolean,
        indicatorLabel: label,
      },
    });
  return (
    <EntryFormFrame
      label="Shock indicator"
      submitLabel="Save reading"
      campaignId={campaignId}
      state={form}
      crate={{ value: crateId, onChange: setCrateId, required: true }}
      onSubmit={() => void submit()}
    >
      <TextField
        label="Rating"
        unit="g"
        inputMode="decimal"
        autoComplete="off"
        value={rating}
        onChange={(e) => setRating(e.target.value)}
        hint="The level printed on the label, e.g. 25"
        error={errors["data.ratingG"]}
      />
      <YesNoField
        legend="Has it tripped?"
        value={tripped}
        onChange={setTripped}
        yes="Tripped"
        no="Not tripped"
        error={errors["data.tripped"]}
      />
      <TextField
        label="Where on the crate (optional)"
        value={label}
        maxLength={120}
        onChange={(e) => setLabel(e.target.value)}
        error={errors["data.indicatorLabel"]}
      />
      <TextField
        label="Note (optional)"
        value={note}
        maxLength={2000}
        onChange={(e) => setNote(e.target.value)}
        error={errors.note}
      />
    </EntryFormFrame>
  );
}
