// Adding or editing a benchmark (online): the shared benchmarkFields schema checks the typed values,
// converted to SI first (σ typed in mm); each error appears at its field.
import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect, useRef, useState } from "react";
import { useForm, type Resolver, type ResolverResult } from "react-hook-form";
import { benchmarkFields, type BenchmarkView } from "../../../../shared/schemas/benchmarks";
import { geodesyLimits } from "../../../../shared/schemas/geodesy-fields";
import { Button } from "../../../components/button";
import { TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { isApiError } from "../../../lib/api-error";
import { applyServerErrors } from "../../../lib/form-errors";
import { useSaveBenchmark } from "../api/save-benchmark";
import { draftFromBenchmark, fieldsFromDraft, type BenchmarkDraft } from "../lib/benchmark-draft";

type BenchmarkOutput = ReturnType<typeof benchmarkFields.parse>;

const schemaResolver = zodResolver(benchmarkFields);
// The schema's field names are the draft's, so its errors land on the typed fields.
const benchmarkResolver: Resolver<BenchmarkDraft, unknown, BenchmarkOutput> = async (
  values,
  context,
  options,
) =>
  (await schemaResolver(fieldsFromDraft(values), context, {
    ...options,
    fields: {},
  })) as ResolverResult<BenchmarkDraft, BenchmarkOutput>;

const fieldNames = Object.keys(draftFromBenchmark(null)) as (keyof BenchmarkDraft)[];
const numeric = { inputMode: "decimal", autoComplete: "off", className: "tabular-nums" } as const;

interface BenchmarkFormProps {
  campaignId: string;
  /** null for a new benchmark. */
  benchmark: BenchmarkView | null;
  /** Height system and datum a new benchmark starts with. */
  like?: Pick<BenchmarkView, "heightSystem" | "datum">;
  onSaved: (benchmark: BenchmarkView) => void;
  onCancel: () => void;
}

export function BenchmarkForm({
  campaignId,
  benchmark,
  like,
  onSaved,
  onCancel,
}: BenchmarkFormProps) {
  const save = useSaveBenchmark(campaignId);
  const [failure, setFailure] = useState<string | null>(null);
  const heading = useRef<HTMLHeadingElement>(null);
  const { register, handleSubmit, formState, setError } = useForm<
    BenchmarkDraft,
    unknown,
    BenchmarkOutput
  >({ resolver: benchmarkResolver, defaultValues: draftFromBenchmark(benchmark, like) });
  const { errors, isSubmitting } = formState;
  // The form opens above the list: bring it into view (and to the screen reader) at once.
  useEffect(() => heading.current?.focus(), []);

  const submit = handleSubmit(async (fields) => {
    setFailure(null);
    try {
      onSaved(
        await save.mutateAsync({
          id: benchmark?.id ?? crypto.randomUUID(),
          baseVersion: benchmark?.version ?? null,
          benchmark: fields,
        }),
      );
    } catch (error) {
      if (isApiError(error) && error.status === 409) {
        // A new benchmark's only conflict is its code; an edit may also be stale.
        if (benchmark === null) setError("code", { type: "server", message: error.message });
        setFailure(error.message);
      } else setFailure(applyServerErrors(error, fieldNames, setError));
    }
  });

  const title = benchmark === null ? "New benchmark" : `Edit ${benchmark.code}`;
  return (
    <form
      onSubmit={(e) => void submit(e)}
      noValidate
      aria-labelledby="benchmark-form-title"
      className="flex flex-col gap-4 rounded-xl border-2 border-line bg-surface p-4"
    >
      <h2
        id="benchmark-form-title"
        ref={heading}
        tabIndex={-1}
        className="text-xl font-semibold outline-none"
      >
        {title}
      </h2>
      <div className="grid gap-4 md:grid-cols-2">
        <TextField
          label="Code"
          maxLength={geodesyLimits.codeMax}
          autoComplete="off"
          error={errors.code?.message}
          {...register("code")}
        />
        <TextField
          label="Description (optional)"
          error={errors.description?.message}
          {...register("description")}
        />
        <TextField
          label="Latitude"
          unit="°"
          hint="Decimal degrees, north positive"
          error={errors.latitudeDeg?.message}
          {...numeric}
          {...register("latitudeDeg")}
        />
        <TextField
          label="Longitude"
          unit="°"
          hint="Decimal degrees, east positive"
          error={errors.longitudeDeg?.message}
          {...numeric}
          {...register("longitudeDeg")}
        />
        <TextField
          label="Published height"
          unit="m"
          error={errors.heightM?.message}
          {...numeric}
          {...register("heightM")}
        />
        <TextField
          label="Height uncertainty (1σ)"
          unit="mm"
          error={errors.heightSigmaM?.message}
          {...numeric}
          {...register("heightSigmaM")}
        />
        <TextField
          label="Height system"
          hint="For example normal heights"
          error={errors.heightSystem?.message}
          {...register("heightSystem")}
        />
        <TextField
          label="Datum (optional)"
          hint="The realisation and its epoch"
          error={errors.datum?.message}
          {...register("datum")}
        />
        <TextField
          label="Source (optional)"
          hint="Where the published height comes from"
          error={errors.source?.message}
          {...register("source")}
        />
      </div>
      <div className="flex flex-wrap gap-3">
        <Button type="submit" tone="primary" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : benchmark === null ? "Add benchmark" : "Save changes"}
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
