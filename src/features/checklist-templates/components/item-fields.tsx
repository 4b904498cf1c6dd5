import { useId } from "react";
import {
  checklistItemKinds,
  hazardKinds,
  hazardLabels,
} from "../../../../shared/schemas/checklists";
import { Button } from "../../../components/button";
import { SelectField, TextAreaField, TextField } from "../../../components/form-field";
import { StatusShape } from "../../../components/status-shape";
import { kindLabels, type DraftItem, type FieldErrors } from "../lib/draft";

/** The select's value as one of its known options (a select can only give those). */
function oneOf<T extends string>(list: readonly T[], value: string, fallback: T): T {
  return list.find((option) => option === value) ?? fallback;
}

interface CheckboxProps {
  label: string;
  checked: boolean;
  onChange: (checked: boolean) => void;
}

function Checkbox({ label, checked, onChange }: CheckboxProps) {
  const id = useId();
  return (
    <div className="flex min-h-touch items-center gap-3">
      <input
        id={id}
        type="checkbox"
        checked={checked}
        onChange={(e) => onChange(e.target.checked)}
        className="h-6 w-6 accent-primary"
      />
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
    </div>
  );
}

interface ItemFieldsProps {
  item: DraftItem;
  index: number;
  count: number;
  /** The id it will be saved under: kept for a saved item, made from the label for a new one. */
  itemId: string;
  errors: FieldErrors;
  onChange: (patch: Partial<DraftItem>) => void;
  onMove: (by: -1 | 1) => void;
  onRemove: () => void;
}

/** One item of the template: its common fields, then the ones its kind needs. */
export function ItemFields(props: ItemFieldsProps) {
  const { item, index, count, itemId, errors, onChange, onMove, onRemove } = props;
  const at = (field: string) => errors[`items.${index}.${field}`];
  const number = index + 1;
  const name = item.label.trim() === "" ? `item ${number}` : `“${item.label.trim()}”`;
  const itemError = errors[`items.${index}`] ?? at("id") ?? at("kind");
  return (
    <fieldset className="flex flex-col gap-4 rounded-xl border-2 border-line bg-surface p-4 md:p-5">
      <legend className="px-2 text-lg font-semibold">Item {number}</legend>
      {itemError !== undefined && (
        <p className="flex items-start gap-2 font-semibold text-danger-ink">
          <StatusShape shape="octagon" className="mt-0.5 text-danger" />
          <span>{itemError}</span>
        </p>
      )}
      <div className="grid gap-4 md:grid-cols-[2fr_1fr]">
        <TextField
          label="Label"
          value={item.label}
          error={at("label")}
          hint={
            <>
              Item id <code className="tabular-nums">{itemId}</code>
              {item.id !== null && " (kept when the label changes, so results stay tied)"}
            </>
          }
          onChange={(e) => onChange({ label: e.target.value })}
        />
        <SelectField
          label="Kind"
          value={item.kind}
          error={at("kind")}
          onChange={(e) => onChange({ kind: oneOf(checklistItemKinds, e.target.value, item.kind) })}
        >
          {checklistItemKinds.map((kind) => (
            <option key={kind} value={kind}>
              {kindLabels[kind]}
            </option>
          ))}
        </SelectField>
      </div>
      {item.kind === "number" && (
        <div className="grid gap-4 md:grid-cols-3">
          <TextField
            label="Unit"
            value={item.unit}
            error={at("unit")}
            hint="e.g. °C, %, hPa"
            onChange={(e) => onChange({ unit: e.target.value })}
          />
          <TextField
            label="Lowest allowed"
            inputMode="decimal"
            className="tabular-nums"
            value={item.min}
            error={at("min")}
            hint="Empty: no lower limit"
            onChange={(e) => onChange({ min: e.target.value })}
          />
          <TextField
            label="Highest allowed"
            inputMode="decimal"
            className="tabular-nums"
            value={item.max}
            error={at("max")}
            hint="Empty: no upper limit"
            onChange={(e) => onChange({ max: e.target.value })}
          />
        </div>
      )}
      {item.kind === "choice" && (
        <TextAreaField
          label="Options"
          value={item.options}
          error={at("options") ?? firstOptionError(errors, index)}
          hint="One per line, at least two."
          onChange={(e) => onChange({ options: e.target.value })}
        />
      )}
      <TextAreaField
        label="Help"
        value={item.help}
        error={at("help")}
        hint="Optional: what to look for, shown under the item."
        onChange={(e) => onChange({ help: e.target.value })}
      />
      <Checkbox
        label="Required before sign-off"
        checked={item.required}
        onChange={(required) => onChange({ required })}
      />
      <Checkbox
        label="This step can hurt someone: show a caution"
        checked={item.hasCaution}
        onChange={(hasCaution) => onChange({ hasCaution })}
      />
      {item.hasCaution && (
        <div className="grid gap-4 rounded-lg border-2 border-attention bg-attention-soft p-4 md:grid-cols-[1fr_2fr]">
          <SelectField
            label="Hazard"
            value={item.hazard}
            error={at("caution.hazard")}
            onChange={(e) => onChange({ hazard: oneOf(hazardKinds, e.target.value, item.hazard) })}
          >
            {hazardKinds.map((hazard) => (
              <option key={hazard} value={hazard}>
                {hazardLabels[hazard]}
              </option>
            ))}
          </SelectField>
          <TextAreaField
            label="Caution text"
            value={item.cautionText}
            error={at("caution.text") ?? at("caution")}
            hint="Defer to local rules and the site's safety officer; a caution does not make a step safe."
            onChange={(e) => onChange({ cautionText: e.target.value })}
          />
        </div>
      )}
      <div className="flex flex-wrap gap-3">
        <Button onClick={() => onMove(-1)} disabled={index === 0} aria-label={`Move ${name} up`}>
          Move up
        </Button>
        <Button
          onClick={() => onMove(1)}
          disabled={index === count - 1}
          aria-label={`Move ${name} down`}
        >
          Move down
        </Button>
        <Button tone="danger" onClick={onRemove} aria-label={`Remove ${name}`}>
          Remove
        </Button>
      </div>
    </fieldset>
  );
}

function firstOptionError(errors: FieldErrors, index: number): string | undefined {
  const prefix = `items.${index}.options.`;
  const key = Object.keys(errors).find((k) => k.startsWith(prefix));
  return key === undefined ? undefined : errors[key];
}
