// A free observation at the site, about a crate or about nothing in particular.
import { useState } from "react";
import type { EntryFlags } from "../../../../shared/schemas/field-entries";
import { TextAreaField } from "../../../components/form-field";
import { CrateField, EntryFormFrame, useSaveEntry } from "./entry-form-parts";

interface Props {
  campaignId: string;
  siteId: string;
  onSaved: (id: string, flags: EntryFlags) => void;
}

export function ObservationForm({ campaignId, siteId, onSaved }: Props) {
  const { errors, failure, saving, save } = useSaveEntry(campaignId, onSaved);
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
      saving={saving}
      failure={failure}
      onSubmit={() => void submit()}
    >
      <CrateField
        campaignId={campaignId}
        value={crateId}
        onChange={setCrateId}
        required={false}
        error={errors.crateId}
      />
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
