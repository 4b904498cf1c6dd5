// A free observation at the site, about a crate or about nothing in particular.
import { useState } from "react";
import { TextAreaField } from "../../../components/form-field";
import { EntryFormFrame, type EntryFormProps, useSaveEntry } from "./entry-form-parts";

export function ObservationForm({ campaignId, siteId, onSaved }: EntryFormProps) {
  const form = useSaveEntry(campaignId, onSaved);
  const { errors, save } = form;
  const [crateId, setCrateId] = useState("");
  const [text, setText] = useState("");
  const submit = () =>
    save({
      siteId,
      crateId: crateId === "" ? null : crateId,
      observedAt: new Date().toISOString(),
      data: { kind: "observation", text },
    });
  return (
    <EntryFormFrame
      label="Observation"
      submitLabel="Save observation"
      campaignId={campaignId}
      state={form}
      crate={{ value: crateId, onChange: setCrateId, required: false }}
      onSubmit={() => void submit()}
    >
      <TextAreaField
        label="What did you see?"
        value={text}
        maxLength={2000}
        onChange={(e) => setText(e.target.value)}
        error={errors["data.text"]}
      />
    </EntryFormFrame>
  );
}
