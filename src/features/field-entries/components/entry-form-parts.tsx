// Pieces every field-entry form shares: saving with errors at their fields, the crate choice, the
// frame with the save button, and typed-number helpers (decimal comma accepted).
import { useId, useState, type FormEvent, type ReactNode } from "react";
import { EntryInputError, type FieldEntryDraft } from "../../../db/field-entry-store";
import type { EntryFlags } from "../../../../shared/schemas/field-entries";
import { Button } from "../../../components/button";
import { SelectField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { parseDecimal } from "../../../lib/format";
import { useCrates, useEntryWrites } from "../hooks/use-field-entries";

export type FieldErrors = Record<string, string>;

/** What every entry form is given by its route. */
export interface EntryFormProps {
  campaignId: string;
  siteId: string;
  onSaved: (id: string, flags: EntryFlags) => void;
}

export function useSaveEntry(campaignId: string, onSaved: (id: string, flags: EntryFlags) => void) {
  const writes = useEntryWrites(campaignId);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const save = async (draft: FieldEntryDraft) => {
    setErrors({});
    setFailure(null);
    setSaving(true);
    try {
      const { id, flags } = await writes.add(draft);
      onSaved(id, flags);
    } catch (error) {
      if (error instanceof EntryInputError) {
        setErrors(Object.fromEntries(error.issues.map((i) => [i.field, i.message])));
        const n = error.issues.length;
        setFailure(n === 1 ? error.message : `${n} fields need attention: see the marked fields.`);
      } else setFailure(messageOf(error));
    } finally {
      setSaving(false);
    }
  };
  return { errors, failure, saving, save };
}

/** A typed number, or NaN (refused by the schema with the field's name) when unreadable. */
export const typedNumber = (text: string) => parseDecimal(text);

/** A typed number where empty means "not given". */
export const optionalNumber = (text: string) => (text.trim() === "" ? null : parseDecimal(text));

interface CrateFieldProps {
  campaignId: string;
  value: string;
  onChange: (crateId: string) => void;
  required: boolean;
  error?: string;
}

export function CrateField({ campaignId, value, onChange, required, error }: CrateFieldProps) {
  const crates = useCrates(campaignId);
  return (
    <SelectField
      label="Crate"
      value={value}
      error={error}
      required={required}
      onChange={(e) => onChange(e.target.value)}
      hint={crates?.length === 0 ? "No crates on this device yet: sync once online." : undefined}
    >
      <option value="">{required ? "Choose a crate" : "No particular crate"}</option>
      {crates?.map((crate) => (
        <option key={crate.id} value={crate.id}>
          {crate.label} — {crate.contents}
        </option>
      ))}
    </SelectField>
  );
}

interface EntryFormFrameProps {
  label: string;
  submitLabel: string;
  campaignId: string;
  state: Pick<ReturnType<typeof useSaveEntry>, "errors" | "failure" | "saving">;
  /** The crate the entry is about, chosen first. */
  crate: { value: string; onChange: (crateId: string) => void; required: boolean };
  onSubmit: () => void;
  children: ReactNode;
}

/** The crate choice, the kind's own fields, what went wrong and the save button. */
export function EntryFormFrame(props: EntryFormFrameProps) {
  const { errors, failure, saving } = props.state;
  const submit = (event: FormEvent) => {
    event.preventDefault();
    props.onSubmit();
  };
  return (
    <form
      aria-label={props.label}
      noValidate
      onSubmit={submit}
      className="flex max-w-2xl flex-col gap-5"
    >
      <CrateField campaignId={props.campaignId} {...props.crate} error={errors.crateId} />
      {props.children}
      {failure !== null && (
        <Notice tone="danger" title="Not saved" live>
          {failure}
        </Notice>
      )}
      <div>
        <Button type="submit" tone="primary" disabled={saving}>
          {saving ? "Saving…" : props.submitLabel}
        </Button>
      </div>
    </form>
  );
}

/** Two large choices for a yes/no reading, easy to hit with gloves. */
export function YesNoField({
  legend,
  value,
  onChange,
  yes,
  no,
  error,
}: {
  legend: string;
  value: boolean | null;
  onChange: (value: boolean) => void;
  yes: string;
  no: string;
  error?: string;
}) {
  const name = useId();
  const option = (checked: boolean, label: string, onPick: () => void) => (
    <label
      className={`flex min-h-touch min-w-32 cursor-pointer items-center justify-center gap-2 rounded-lg border-2 px-5 font-semibold has-[:focus-visible]:ring-4 has-[:focus-visible]:ring-primary ${
        checked ? "border-primary bg-primary text-on-primary" : "border-ink bg-surface"
      }`}
    >
      <input type="radio" name={name} className="sr-only" checked={checked} onChange={onPick} />
      {label}
    </label>
  );
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 font-semibold">{legend}</legend>
      <div className="flex flex-wrap gap-3">
        {option(value === true, yes, () => onChange(true))}
        {option(value === false, no, () => onChange(false))}
      </div>
      {error !== undefined && <p className="font-semibold text-danger-ink">{error}</p>}
    </fieldset>
  );
}
