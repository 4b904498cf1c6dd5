// The adjustment's options, checked with the server's schema before sending; the button shows
// that the server is computing.
import { useState } from "react";
import {
  adjustmentOptions,
  type AdjustmentOptions,
} from "../../../../shared/schemas/height-network";
import { Button } from "../../../components/button";
import { TextField } from "../../../components/form-field";
import { StatusShape } from "../../../components/status-shape";
import { parseDecimal } from "../../../lib/format";

interface Props {
  sigmaText: string;
  significanceText: string;
  onSigmaText: (value: string) => void;
  onSignificanceText: (value: string) => void;
  excluded: readonly string[];
  pending: boolean;
  onAdjust: (options: AdjustmentOptions) => void;
}

type FieldErrors = Partial<Record<"sigmaPerSqrtKmMm" | "significance", string>>;

export function readOptions(
  sigmaText: string,
  significanceText: string,
  excluded: readonly string[],
): { options: AdjustmentOptions } | { errors: FieldErrors } {
  const parsed = adjustmentOptions.safeParse({
    sigmaPerSqrtKmMm: parseDecimal(sigmaText),
    significance: parseDecimal(significanceText),
    excluded: [...excluded],
  });
  if (parsed.success) return { options: parsed.data };
  const errors: FieldErrors = {};
  for (const issue of parsed.error.issues) {
    const key = issue.path[0];
    if ((key === "sigmaPerSqrtKmMm" || key === "significance") && errors[key] === undefined)
      errors[key] = issue.message;
  }
  return { errors };
}

export function AdjustForm(props: Props) {
  const [errors, setErrors] = useState<FieldErrors>({});
  const submit = () => {
    const read = readOptions(props.sigmaText, props.significanceText, props.excluded);
    if ("errors" in read) {
      setErrors(read.errors);
      return;
    }
    setErrors({});
    props.onAdjust(read.options);
  };
  return (
    <form
      aria-labelledby="options-heading"
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <h2 id="options-heading" className="text-xl font-semibold">
        Adjustment
      </h2>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          label="σ per √km"
          unit="mm"
          inputMode="decimal"
          value={props.sigmaText}
          onChange={(e) => props.onSigmaText(e.target.value)}
          hint="For observations without their own σ: σ = this × √length"
          error={errors.sigmaPerSqrtKmMm}
        />
        <TextField
          label="Significance of the global test"
          inputMode="decimal"
          value={props.significanceText}
          onChange={(e) => props.onSignificanceText(e.target.value)}
          hint="0.05 means 5 %: a χ² test, two-sided"
          error={errors.significance}
        />
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" tone="primary" disabled={props.pending}>
          {props.pending ? "Adjusting…" : "Adjust"}
        </Button>
        {props.pending && (
          <p role="status" className="flex items-center gap-2">
            <StatusShape shape="dots" className="text-primary" />
            Computing on the server…
          </p>
        )}
      </div>
    </form>
  );
}
