// The check before a cold crate is opened: the coldest surface inside must be warmer than the
// room's dew point plus a margin, or the optics fog. Shown live while typing; a crate opened
// against the check needs a reason, which is kept with the entry.
import { useState } from "react";
import { dewPointVerdict } from "../../../../shared/field-entries";
import { TextAreaField, TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { EntryFormFrame, type EntryFormProps, typedNumber, useSaveEntry } from "./entry-form-parts";

interface Props extends EntryFormProps {
  /** The unpacking checklist this check clears, when it was started from one. */
  runId: string | null;
}

const c = (v: number) => `${v.toFixed(1)} °C`;

function Verdict({ room, humidity, surface, margin }: Record<string, number>) {
  if (![room, humidity, surface, margin].every(Number.isFinite)) return null;
  let verdict;
  try {
    verdict = dewPointVerdict({
      kind: "dew-point",
      runId: null,
      roomTemperatureC: room ?? Number.NaN,
      roomHumidityPct: humidity ?? Number.NaN,
      surfaceTemperatureC: surface ?? Number.NaN,
      marginK: margin ?? Number.NaN,
      overrideReason: "",
    });
  } catch {
    return null;
  }
  const figures = `Dew point ${c(verdict.dewPointC)}; the surface must be at least ${c(verdict.requiredSurfaceC)}.`;
  if (verdict.mayOpen)
    return (
      <Notice title="May open" live>
        {figures}
      </Notice>
    );
  return (
    <Notice tone="danger" title="Do not open yet" live>
      {figures}{" "}
      {verdict.status === "room-too-humid"
        ? "The room itself is too humid: warming the crate will not get there. Dry or warm the room."
        : "Let the crate warm up, closed, and measure again."}
    </Notice>
  );
}

export function DewPointForm({ campaignId, siteId, runId, onSaved }: Props) {
  const form = useSaveEntry(campaignId, onSaved);
  const { errors, save } = form;
  const [crateId, setCrateId] = useState("");
  const [room, setRoom] = useState("");
  const [humidity, setHumidity] = useState("");
  const [surface, setSurface] = useState("");
  const [margin, setMargin] = useState("3");
  const [reason, setReason] = useState("");
  const typed = {
    room: typedNumber(room),
    humidity: typedNumber(humidity),
    surface: typedNumber(surface),
    margin: typedNumber(margin),
  };
  const submit = () =>
    save({
      siteId,
      crateId: crateId === "" ? null : crateId,
      observedAt: new Date().toISOString(),
      data: {
        kind: "dew-point",
        runId,
        roomTemperatureC: typed.room,
        roomHumidityPct: typed.humidity,
        surfaceTemperatureC: typed.surface,
        marginK: typed.margin,
        overrideReason: reason,
      },
    });
  const number = (
    label: string,
    unit: string,
    value: string,
    set: (v: string) => void,
    field: string,
    hint?: string,
  ) => (
    <TextField
      label={label}
      unit={unit}
      inputMode="decimal"
      autoComplete="off"
      value={value}
      hint={hint}
      onChange={(e) => set(e.target.value)}
      error={errors[`data.${field}`]}
    />
  );
  return (
    <EntryFormFrame
      label="Dew-point check"
      submitLabel="Save check"
      campaignId={campaignId}
      state={form}
      crate={{ value: crateId, onChange: setCrateId, required: true }}
      onSubmit={() => void submit()}
    >
      <div className="grid gap-4 sm:grid-cols-2">
        {number("Room temperature", "°C", room, setRoom, "roomTemperatureC")}
        {number("Room relative humidity", "%", humidity, setHumidity, "roomHumidityPct")}
        {number(
          "Crate surface temperature",
          "°C",
          surface,
          setSurface,
          "surfaceTemperatureC",
          "The coldest surface inside, measured through the port or on the lid",
        )}
        {number("Margin above the dew point", "K", margin, setMargin, "marginK", "3 K is usual")}
      </div>
      <Verdict {...typed} />
      <TextAreaField
        label="Reason to open anyway (only if the check does not pass)"
        value={reason}
        maxLength={2000}
        onChange={(e) => setReason(e.target.value)}
        error={errors["data.overrideReason"]}
        hint="Kept with the entry and shown to the office. Leave empty when the check passes."
      />
    </EntryFormFrame>
  );
}
