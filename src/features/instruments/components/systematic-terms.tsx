// The repeatable list of named systematic terms, with their combination in quadrature as typed.
import {
  useFieldArray,
  useWatch,
  type Control,
  type FieldErrors,
  type UseFormRegister,
} from "react-hook-form";
import { geodesyLimits } from "../../../../shared/schemas/geodesy-fields";
import { Button } from "../../../components/button";
import { TextField } from "../../../components/form-field";
import { StatusShape } from "../../../components/status-shape";
import { formatFractional, parseFractional } from "../lib/fractional";
import { quadratureOf, type InstrumentDraft, type InstrumentOutput } from "../lib/instrument-draft";

interface Props {
  control: Control<InstrumentDraft, unknown, InstrumentOutput>;
  register: UseFormRegister<InstrumentDraft>;
  errors: FieldErrors<InstrumentDraft>;
}

function LiveTotal({ control }: Pick<Props, "control">) {
  const terms = useWatch({ control, name: "systematic" });
  const values = terms.filter((t) => t.value.trim() !== "").map((t) => parseFractional(t.value));
  if (values.length === 0) return null;
  const total = quadratureOf(values);
  return (
    <p className="tabular-nums" aria-live="polite">
      Combined in quadrature:{" "}
      <span className="font-semibold">
        {Number.isNaN(total) ? "— (a value is not a number yet)" : formatFractional(total)}
      </span>
    </p>
  );
}

export function SystematicTerms({ control, register, errors }: Props) {
  const { fields, append, remove } = useFieldArray({ control, name: "systematic" });
  const listError = errors.systematic?.root?.message ?? errors.systematic?.message;
  return (
    <fieldset className="flex flex-col gap-3 rounded-lg border-2 border-line p-3">
      <legend className="px-1 font-semibold">Systematic uncertainty terms</legend>
      <p className="text-sm text-muted">
        Each term fractional (1σ), e.g. blackbody radiation 1.2e-18; they are combined in
        quadrature.
      </p>
      {fields.length === 0 && <p className="text-muted">No term: the systematic total is 0.</p>}
      <ol className="flex flex-col gap-3">
        {fields.map((field, i) => (
          <li
            key={field.id}
            className="grid items-start gap-3 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_auto]"
          >
            <TextField
              label={`Term ${i + 1} name`}
              maxLength={geodesyLimits.nameMax}
              autoComplete="off"
              error={errors.systematic?.[i]?.name?.message}
              {...register(`systematic.${i}.name`)}
            />
            <TextField
              label={`Term ${i + 1} value`}
              inputMode="decimal"
              autoComplete="off"
              className="tabular-nums"
              error={errors.systematic?.[i]?.value?.message}
              {...register(`systematic.${i}.value`)}
            />
            <Button
              tone="quiet"
              className="sm:mt-7"
              aria-label={`Remove term ${i + 1}`}
              onClick={() => remove(i)}
            >
              Remove
            </Button>
          </li>
        ))}
      </ol>
      {listError !== undefined && (
        <p className="flex items-start gap-2 font-semibold text-danger-ink" role="alert">
          <StatusShape shape="octagon" className="mt-0.5 text-danger" />
          <span>{listError}</span>
        </p>
      )}
      <LiveTotal control={control} />
      <div>
        <Button
          disabled={fields.length >= geodesyLimits.systematicTermsMax}
          onClick={() => append({ name: "", value: "" })}
        >
          Add term
        </Button>
      </div>
    </fieldset>
  );
}
