import { useId, type ComponentPropsWithRef, type ReactNode } from "react";
import { cx } from "../lib/cx";
import { StatusShape } from "./status-shape";

const control =
  "block w-full min-h-touch rounded-lg border bg-surface px-3 py-2 text-base text-ink " +
  "placeholder:text-muted aria-invalid:border-2 aria-invalid:border-danger";

interface FieldFrameProps {
  id: string;
  label: string;
  hint?: ReactNode;
  error?: string;
  unit?: string;
  children: ReactNode;
}

/** Label above, the control, then the hint and the error message right at the field. */
function FieldFrame({ id, label, hint, error, unit, children }: FieldFrameProps) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
        {unit !== undefined && <span className="font-normal text-muted"> ({unit})</span>}
      </label>
      {children}
      {hint !== undefined && (
        <p id={`${id}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      )}
      {error !== undefined && (
        <p id={`${id}-error`} className="flex items-start gap-2 font-semibold text-danger-ink">
          <StatusShape shape="octagon" className="mt-0.5 text-danger" />
          <span>{error}</span>
        </p>
      )}
    </div>
  );
}

function describedBy(id: string, hint: unknown, error: string | undefined): string | undefined {
  const ids = [hint !== undefined && `${id}-hint`, error !== undefined && `${id}-error`];
  const joined = ids.filter(Boolean).join(" ");
  return joined === "" ? undefined : joined;
}

interface Common {
  label: string;
  hint?: ReactNode;
  error?: string;
  unit?: string;
}

type TextFieldProps = Common & ComponentPropsWithRef<"input">;

export function TextField({ label, hint, error, unit, className, id, ...rest }: TextFieldProps) {
  const autoId = useId();
  const fieldId = id ?? autoId;
  return (
    <FieldFrame id={fieldId} label={label} hint={hint} error={error} unit={unit}>
      <input
        id={fieldId}
        aria-invalid={error !== undefined}
        aria-describedby={describedBy(fieldId, hint, error)}
        className={cx(control, className)}
        {...rest}
      />
    </FieldFrame>
  );
}

type SelectFieldProps = Common & ComponentPropsWithRef<"select">;

export function SelectField({ label, hint, error, className, id, ...rest }: SelectFieldProps) {
  const autoId = useId();
  const fieldId = id ?? autoId;
  return (
    <FieldFrame id={fieldId} label={label} hint={hint} error={error}>
      <select
        id={fieldId}
        aria-invalid={error !== undefined}
        aria-describedby={describedBy(fieldId, hint, error)}
        className={cx(control, className)}
        {...rest}
      />
    </FieldFrame>
  );
}

type TextAreaFieldProps = Common & ComponentPropsWithRef<"textarea">;

export function TextAreaField({ label, hint, error, className, id, ...rest }: TextAreaFieldProps) {
  const autoId = useId();
  const fieldId = id ?? autoId;
  return (
    <FieldFrame id={fieldId} label={label} hint={hint} error={error}>
      <textarea
        id={fieldId}
        aria-invalid={error !== undefined}
        aria-describedby={describedBy(fieldId, hint, error)}
        className={cx(control, "min-h-28", className)}
        {...rest}
      />
    </FieldFrame>
  );
}
