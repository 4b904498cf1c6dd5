// Adding or editing a clock or link (online): the shared instrumentFields schema checks the typed
// values (fractional, like 1e-15); errors appear at their field, unusual values as a warning.
import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useRef, useState } from "react";
import {
  useForm,
  useWatch,
  type Control,
  type Resolver,
  type ResolverResult,
} from "react-hook-form";
import {
  instrumentFields,
  instrumentKindLabels,
  instrumentKinds,
  type InstrumentView,
} from "../../../../shared/schemas/instruments";
import { geodesyLimits } from "../../../../shared/schemas/geodesy-fields";
import { Button } from "../../../components/button";
import { SelectField, TextAreaField, TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { isApiError } from "../../../lib/api-error";
import { applyServerErrors } from "../../../lib/form-errors";
import { useSaveInstrument } from "../api/save-instrument";
import {
  draftFromInstrument,
  fieldsFromDraft,
  type InstrumentDraft,
  type InstrumentOutput,
} from "../lib/instrument-draft";
import { parseFractional } from "../lib/fractional";
import { unusualValues } from "../lib/plausibility";
import { SystematicTerms } from "./systematic-terms";

const schemaResolver = zodResolver(instrumentFields);
// The schema's field names are the draft's, so its errors land on the typed fields.
const instrumentResolver: Resolver<InstrumentDraft, unknown, InstrumentOutput> = async (
  values,
  context,
  options,
) =>
  (await schemaResolver(fieldsFromDraft(values), context, {
    ...options,
    fields: {},
  })) as ResolverResult<InstrumentDraft, InstrumentOutput>;

const fieldNames = ["kind", "name", "description", "instabilityAt1s", "notes"] as const;

function Warnings({ control }: { control: Control<InstrumentDraft, unknown, InstrumentOutput> }) {
  const instabilityText = useWatch({ control, name: "instabilityAt1s" });
  const terms = useWatch({ control, name: "systematic" });
  const warnings = unusualValues({
    instabilityAt1s: parseFractional(instabilityText),
    systematic: terms.map((t) => ({ name: t.name, value: parseFractional(t.value) })),
  });
  if (warnings.length === 0) return null;
  return (
    <Notice tone="attention" title="Unusual values">
      <ul className="list-disc pl-6">
        {warnings.map((w) => (
          <li key={w}>{w}</li>
        ))}
      </ul>
      <p className="mt-1 text-sm">They can be saved as they are.</p>
    </Notice>
  );
}

interface InstrumentFormProps {
  campaignId: string;
  /** null for a new instrument. */
  instrument: InstrumentView | null;
  onSaved: (instrument: InstrumentView) => void;
  onCancel: () => void;
  /** Offered after a stale edit (409): read the stored version and start again from it. */
  onReload?: () => void;
}

export function InstrumentForm(props: InstrumentFormProps) {
  const { campaignId, instrument, onSaved, onCancel, onReload } = props;
  const save = useSaveInstrument(campaignId);
  const [failure, setFailure] = useState<{ message: string; stale: boolean } | null>(null);
  const heading = useRef<HTMLHeadingElement>(null);
  const { register, handleSubmit, formState, setError, control } = useForm<
    InstrumentDraft,
    unknown,
    InstrumentOutput
  >({ resolver: instrumentResolver, defaultValues: draftFromInstrument(instrument) });
  const { errors, isSubmitting } = formState;
  // The form opens above other content: bring it into view (and to the screen reader) at once.
  useEffect(() => heading.current?.focus(), []);

  const submit = handleSubmit(async (fields) => {
    setFailure(null);
    try {
      onSaved(
        await save.mutateAsync({
          id: instrument?.id ?? crypto.randomUUID(),
          baseVersion: instrument?.version ?? null,
          instrument: fields,
        }),
      );
    } catch (error) {
      if (isApiError(error) && error.status === 409)
        setFailure({ message: error.message, stale: instrument !== null });
      else {
        const message = applyServerErrors(error, fieldNames, setError);
        if (message !== null) setFailure({ message, stale: false });
      }
    }
  });

  return (
    <form
      onSubmit={(e) => void submit(e)}
      noValidate
      aria-labelledby="instrument-form-title"
      className="flex flex-col gap-4 rounded-xl border-2 border-line bg-surface p-4"
    >
      <h2
        id="instrument-form-title"
        ref={heading}
        tabIndex={-1}
        className="text-xl font-semibold outline-none"
      >
        {instrument === null ? "New clock or link" : `Edit ${instrument.name}`}
      </h2>
      <div className="grid gap-4 md:grid-cols-2">
        <SelectField label="Kind" error={errors.kind?.message} {...register("kind")}>
          {instrumentKinds.map((k) => (
            <option key={k} value={k}>
              {instrumentKindLabels[k]}
            </option>
          ))}
        </SelectField>
        <TextField
          label="Name"
          maxLength={geodesyLimits.nameMax}
          autoComplete="off"
          error={errors.name?.message}
          {...register("name")}
        />
        <TextField
          label="Instability at 1 s"
          hint="Fractional σ_y(1 s) of white frequency noise, e.g. 1e-15 or 5e-16"
          inputMode="decimal"
          autoComplete="off"
          className="tabular-nums"
          error={errors.instabilityAt1s?.message}
          {...register("instabilityAt1s")}
        />
        <TextField
          label="Description (optional)"
          error={errors.description?.message}
          {...register("description")}
        />
      </div>
      <SystematicTerms control={control} register={register} errors={errors} />
      <TextAreaField
        label="Notes (optional)"
        error={errors.notes?.message}
        {...register("notes")}
      />
      <Warnings control={control} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" tone="primary" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : instrument === null ? "Add instrument" : "Save changes"}
        </Button>
        <Button tone="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
      {failure !== null && (
        <Notice tone="danger" title="Not saved" live>
          <p>{failure.message}</p>
          {failure.stale && onReload !== undefined && (
            <Button className="mt-2" onClick={onReload}>
              Load the current version
            </Button>
          )}
        </Notice>
      )}
    </form>
  );
}
