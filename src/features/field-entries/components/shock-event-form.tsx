// One shock-logger event typed from the logger's display: peak per axis and pulse duration.
import { useState } from "react";
import type { EntryFlags } from "../../../../shared/schemas/field-entries";
import { TextField } from "../../../components/form-field";
import { CrateField, EntryFormFrame, optionalNumber, useSaveEntry } from "./entry-form-parts";
import { fromLocalInput, LocalTimeField, toLocalInput } from "./local-time-field";

interface Props {
  campaignId: string;
  siteId: string;
  onSaved: (id: string, flags: EntryFlags) => void;
}

export function ShockEventForm({ campaignId, siteId, onSaved }: Props) {
  const { errors, failure, saving, save } = useSaveEntry(campaignId, onSaved);
  const [crateId, setCrateId] = useState("");
  const [time, setTime] = useState(() => toLocalInput(new Date()));
  const [peaks, setPeaks] = useState({ x: "", y: "", z: "" });
  const [duration, setDuration] = useState("");
  const [model, setModel] = useState("");
  const [note, setNote] = useState("");
  const submit = () => {
    const at = fromLocalInput(time);
    return save({
      siteId,
      crateId: crateId === "" ? null : crateId,
      observedAt: at,
      note,
      data: {
        kind: "shock-log",
        source: "manual",
        loggerModel: model,
        events: [
          {
            at,
            xG: optionalNumber(peaks.x),
            yG: optionalNumber(peaks.y),
            zG: optionalNumber(peaks.z),
            durationMs: optionalNumber(duration),
          },
        ],
      },
    });
  };
  const axis = (name: "x" | "y" | "z") => (
    <TextField
      key={name}
      label={`Peak ${name}`}
      unit="g"
      inputMode="decimal"
      autoComplete="off"
      value={peaks[name]}
      onChange={(e) => setPeaks((p) => ({ ...p, [name]: e.target.value }))}
      error={errors[`data.events.0.${name}G`]}
    />
  );
  return (
    <EntryFormFrame
      label="Shock logger event"
      submitLabel="Save event"
      saving={saving}
      failure={failure}
      onSubmit={() => void submit()}
    >
      <CrateField
        campaignId={campaignId}
        value={crateId}
        onChange={setCrateId}
        required
        error={errors.crateId}
      />
      <LocalTimeField
        label="Time of the event"
        value={time}
        onChange={setTime}
        error={errors.observedAt}
      />
      <div className="grid grid-cols-3 gap-3">{(["x", "y", "z"] as const).map(axis)}</div>
      <TextField
        label="Pulse duration (optional)"
        unit="ms"
        inputMode="decimal"
        autoComplete="off"
        value={duration}
        onChange={(e) => setDuration(e.target.value)}
        error={errors["data.events.0.durationMs"]}
      />
      <TextField
        label="Logger model (optional)"
        value={model}
        maxLength={120}
        onChange={(e) => setModel(e.target.value)}
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
