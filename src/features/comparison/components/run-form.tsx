// Creating or editing a comparison run (online): the shared comparisonRunFields schema checks the
// typed values, converted to SI first (σ and target typed in mm, uptime in %); errors at fields.
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm, type Resolver, type ResolverResult } from "react-hook-form";
import { comparisonRunFields, type ComparisonRunView } from "../../../../shared/schemas/comparison";
import type { InstrumentView } from "../../../../shared/schemas/instruments";
import { Button } from "../../../components/button";
import { SelectField, TextAreaField, TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { isApiError } from "../../../lib/api-error";
import { applyServerErrors } from "../../../lib/form-errors";
import { useSaveRun } from "../api/save-run";
import { draftFromRun, fieldsFromDraft, type RunDraft } from "../lib/run-draft";

type RunOutput = ReturnType<typeof comparisonRunFields.parse>;

const schemaResolver = zodResolver(comparisonRunFields);
// The schema's field names are the draft's, so its errors land on the typed fields.
const runResolver: Resolver<RunDraft, unknown, RunOutput> = async (values, context, options) =>
  (await schemaResolver(fieldsFromDraft(values), context, {
    ...options,
    fields: {},
  })) as ResolverResult<RunDraft, RunOutput>;

const fieldNames = Object.keys(draftFromRun(null)) as (keyof RunDraft)[];
const numeric = { inputMode: "decimal", autoComplete: "off", className: "tabular-nums" } as const;

export interface SiteChoice {
  id: string;
  name: string;
}

interface RunFormProps {
  campaignId: string;
  run: ComparisonRunView | null;
  sites: readonly SiteChoice[];
  instruments: readonly InstrumentView[];
  onSaved: (run: ComparisonRunView) => void;
  onCancel: () => void;
}

export function RunForm({ campaignId, run, sites, instruments, onSaved, onCancel }: RunFormProps) {
  const save = useSaveRun(campaignId);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError, getValues, setValue } = useForm<
    RunDraft,
    unknown,
    RunOutput
  >({ resolver: runResolver, defaultValues: draftFromRun(run) });
  const { errors, isSubmitting } = formState;
  const clocks = instruments.filter((i) => i.kind === "clock");
  const links = instruments.filter((i) => i.kind === "link");

  const submit = handleSubmit(async (fields) => {
    setFailure(null);
    try {
      const saved = await save.mutateAsync({
        id: run?.id ?? crypto.randomUUID(),
        baseVersion: run?.version ?? null,
        run: fields,
      });
      onSaved(saved);
    } catch (error) {
      if (isApiError(error) && error.status === 409)
        setFailure("Someone changed this run meanwhile. Open it again to see their version.");
      else setFailure(applyServerErrors(error, fieldNames, setError));
    }
  });

  const clockOptions = (
    <>
      <option value="">Choose a clock</option>
      {clocks.map((c) => (
        <option key={c.id} value={c.id}>
          {c.name}
        </option>
      ))}
    </>
  );
  return (
    <form
      onSubmit={(e) => void submit(e)}
      noValidate
      aria-labelledby="run-form-title"
      className="flex flex-col gap-4 rounded-xl border-2 border-line bg-surface p-4"
    >
      <h2 id="run-form-title" className="text-xl font-semibold">
        {run === null ? "New comparison run" : `Edit ${run.name}`}
      </h2>
      {clocks.length < 2 && (
        <Notice tone="attention" title="Two clocks needed">
          A run compares two clocks. Add them under Instruments first.
        </Notice>
      )}
      <div className="grid gap-4 md:grid-cols-2">
        <TextField label="Name" error={errors.name?.message} {...register("name")} />
        <SelectField
          label="Remote site"
          error={errors.remoteSiteId?.message}
          {...register("remoteSiteId")}
        >
          <option value="">Choose a site</option>
          {sites.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Remote clock"
          error={errors.remoteClockId?.message}
          {...register("remoteClockId")}
        >
          {clockOptions}
        </SelectField>
        <SelectField
          label="Reference clock"
          error={errors.referenceClockId?.message}
          {...register("referenceClockId")}
        >
          {clockOptions}
        </SelectField>
        <SelectField
          label="Link instrument (optional)"
          hint="With its own instability and systematic terms in the budget"
          error={errors.linkId?.message}
          {...register("linkId", {
            onChange: (e: { target: { value: string } }) => {
              const chosen = links.find((l) => l.id === e.target.value);
              if (chosen !== undefined && getValues("linkName").trim() === "")
                setValue("linkName", chosen.name);
            },
          })}
        >
          <option value="">None</option>
          {links.map((l) => (
            <option key={l.id} value={l.id}>
              {l.name}
            </option>
          ))}
        </SelectField>
        <TextField label="Link name" error={errors.linkName?.message} {...register("linkName")} />
        <TextField
          label="Remote mark (optional)"
          hint="The levelled point at the remote clock, as named in the levelling network"
          error={errors.remoteMark?.message}
          {...register("remoteMark")}
        />
        <TextField
          label="Target height uncertainty"
          unit="mm"
          error={errors.targetHeightUncertaintyM?.message}
          {...numeric}
          {...register("targetHeightUncertaintyM")}
        />
        <TextField
          label="Reference height (optional)"
          unit="m"
          hint="Height of the reference clock's point; give its uncertainty with it"
          error={errors.referenceHeightM?.message}
          {...numeric}
          {...register("referenceHeightM")}
        />
        <TextField
          label="Reference height uncertainty (optional)"
          unit="mm"
          error={errors.referenceHeightSigmaM?.message}
          {...numeric}
          {...register("referenceHeightSigmaM")}
        />
        <TextField
          label="Planned uptime"
          unit="%"
          hint="Valid data per wall-clock time expected before data comes in"
          error={errors.plannedUptime?.message}
          {...numeric}
          {...register("plannedUptime")}
        />
      </div>
      <TextAreaField label="Notes" error={errors.notes?.message} {...register("notes")} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" tone="primary" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : "Save run"}
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
