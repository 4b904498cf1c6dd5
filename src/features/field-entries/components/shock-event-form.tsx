// One shock-logger event typed from the logger's display: peak per axis and pulse duration.
import { useState } from "react";
import { TextField } from "../../../components/form-field";
import {
  EntryFormFrame,
  type EntryFormProps,
  optionalNumber,
  useSaveEntry,
} from "./entry-form-parts";
import { LocalTimeField } from "../../../components/local-time-field";
import { fromLocalInput, toLocalInput } from "../../../lib/local-time";

export function ShockEventForm({ campaignId, siteId, onSaved }: EntryFormProps) {
  const form = useSaveEntry(campaignId, onSaved);
  const { errors, save } = form;
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
      campaignId={campaignId}
      state={form}
      crate={{ value: crateId, onChange: setCrateId, required: true }}
      onSubmit={() => void submit()}
    >
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
