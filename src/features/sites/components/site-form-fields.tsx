import type { FieldErrors, UseFormRegister } from "react-hook-form";
import { limits, siteKindLabels, siteKinds, type SiteFormValues } from "../../../../shared/schemas";
import { SelectField, TextAreaField, TextField } from "../../../components/form-field";
import { parseDecimal } from "../../../lib/format";

interface SiteFormFieldsProps {
  register: UseFormRegister<SiteFormValues>;
  errors: FieldErrors<SiteFormValues>;
}

const minus = (value: number) => String(value).replace("-", "−");
// Typed as text (a decimal comma is fine), read as numbers; empty or unreadable gives NaN.
const decimal = { setValueAs: parseDecimal };
const numeric = { inputMode: "decimal", autoComplete: "off", className: "tabular-nums" } as const;

export function SiteFormFields({ register, errors }: SiteFormFieldsProps) {
  const { min, max } = limits.siteHeightM;
  return (
    <>
      <div className="grid gap-5 md:grid-cols-2">
        <TextField
          label="Name"
          autoComplete="off"
          error={errors.name?.message}
          {...register("name")}
        />
        <SelectField
          label="Kind of site"
          error={errors.kind && "Choose the kind of site"}
          {...register("kind")}
        >
          <option value="">Choose…</option>
          {siteKinds.map((kind) => (
            <option key={kind} value={kind}>
              {siteKindLabels[kind]}
            </option>
          ))}
        </SelectField>
        <TextField
          label="Latitude"
          unit="°"
          hint="Decimal degrees; south is negative."
          error={errors.latitudeDeg?.message}
          {...numeric}
          {...register("latitudeDeg", decimal)}
        />
        <TextField
          label="Longitude"
          unit="°"
          hint="Decimal degrees; west is negative."
          error={errors.longitudeDeg?.message}
          {...numeric}
          {...register("longitudeDeg", decimal)}
        />
        <TextField
          label="Approximate height"
          unit="m"
          hint={`For planning only (${minus(min)} m to ${max} m): a campaign value, not an official height.`}
          error={errors.approxHeightM?.message}
          {...numeric}
          {...register("approxHeightM", decimal)}
        />
      </div>
      <TextAreaField
        label="Notes"
        hint="Access, power, who to call on site."
        error={errors.notes?.message}
        {...register("notes")}
      />
    </>
  );
}
