// A reading taken by hand (a thermometer at the crate): time (now unless changed), °C, optional
// relative humidity and a note. Checked with the shared sample schema, saved as one entry.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { z } from "zod";
import { fieldEntryLimits, temperatureSample } from "../../../../shared/schemas/field-entries";
import { Button } from "../../../components/button";
import { TextAreaField, TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { formatUtc, parseDecimal } from "../../../lib/format";
import { messageOf } from "../../../lib/api-error";
import { toLocalInput } from "../../../lib/local-time";
import { useTemperatureWrites } from "../hooks/use-temperatures";

const localToIso = (value: string) => {
  const d = new Date(value);
  return Number.isNaN(d.getTime()) ? null : d.toISOString();
};

const readingForm = z.object({
  localTime: z.string().refine((v) => localToIso(v) !== null, "Enter the time of the reading"),
  celsius: temperatureSample.shape.celsius,
  humidityPct: temperatureSample.shape.humidityPct,
  note: z
    .string()
    .trim()
    .max(fieldEntryLimits.textMax, `Note must be at most ${fieldEntryLimits.textMax} characters`),
});
type ReadingFormValues = z.input<typeof readingForm>;
type ReadingFormOutput = z.output<typeof readingForm>;

const numeric = { inputMode: "decimal", autoComplete: "off", className: "tabular-nums" } as const;
const optionalDecimal = (v: unknown) =>
  typeof v === "string" && v.trim() === "" ? null : parseDecimal(v);

interface ManualReadingFormProps {
  campaignId: string;
  siteId: string;
  crateId: string;
}

export function ManualReadingForm({ campaignId, siteId, crateId }: ManualReadingFormProps) {
  const writes = useTemperatureWrites(campaignId);
  const [message, setMessage] = useState<{
    ok: boolean;
    text: string;
    exceeded?: boolean;
  } | null>(null);
  const { register, handleSubmit, formState, reset, control } = useForm<
    ReadingFormValues,
    unknown,
    ReadingFormOutput
  >({
    resolver: zodResolver(readingForm),
    defaultValues: { localTime: toLocalInput(new Date()), note: "" },
  });
  const { errors, isSubmitting } = formState;
  const iso = localToIso(useWatch({ control, name: "localTime" }) ?? "");

  const submit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const result = await writes.addReading({
        siteId,
        crateId,
        at: localToIso(values.localTime) ?? "",
        celsius: values.celsius,
        humidityPct: values.humidityPct,
        note: values.note,
      });
      setMessage({
        ok: true,
        text: result?.flags.summary ?? "",
        exceeded: result?.flags.exceeded ?? false,
      });
      reset({ localTime: toLocalInput(new Date()), note: "" });
    } catch (error) {
      setMessage({ ok: false, text: messageOf(error) });
    }
  });

  return (
    <form
      onSubmit={submit}
      noValidate
      aria-label="Manual temperature reading"
      className="flex flex-col gap-4 rounded-xl border-2 border-line bg-surface p-4"
    >
      <h2 className="text-xl font-semibold">Add a reading by hand</h2>
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField
          label="Time"
          type="datetime-local"
          hint={
            iso === null
              ? "Local time of this tablet"
              : `Local time of this tablet · ${formatUtc(iso)}`
          }
          error={errors.localTime?.message}
          {...register("localTime")}
        />
        <TextField
          label="Temperature"
          unit="°C"
          error={errors.celsius?.message}
          {...numeric}
          {...register("celsius", { setValueAs: parseDecimal })}
        />
        <TextField
          label="Relative humidity (optional)"
          unit="%"
          error={errors.humidityPct?.message}
          {...numeric}
          {...register("humidityPct", { setValueAs: optionalDecimal })}
        />
      </div>
      <TextAreaField label="Note (optional)" error={errors.note?.message} {...register("note")} />
      {message !== null &&
        (message.ok ? (
          <Notice tone={message.exceeded ? "danger" : "info"} title="Saved on this device" live>
            {message.text}
          </Notice>
        ) : (
          <Notice tone="danger" title="Not saved" live>
            {message.text}
          </Notice>
        ))}
      <div>
        <Button tone="primary" type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : "Save reading"}
        </Button>
      </div>
    </form>
  );
}
