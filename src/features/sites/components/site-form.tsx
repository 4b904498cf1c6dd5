import { useState, type ReactNode } from "react";
import { useForm, type DefaultValues, type FieldNamesMarkedBoolean } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { siteFormSchema, type SiteFormValues } from "../../../../shared/schemas";
import { Button, LinkButton } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { applyServerErrors } from "../../../lib/form-errors";
import { SiteFormFields } from "./site-form-fields";

export type SiteFormOutput = z.output<typeof siteFormSchema>;
export type SiteFormDirty = Partial<Readonly<FieldNamesMarkedBoolean<SiteFormValues>>>;

const fieldNames = [
  "name",
  "kind",
  "latitudeDeg",
  "longitudeDeg",
  "approxHeightM",
  "notes",
] as const;

interface SiteFormProps {
  defaultValues: DefaultValues<SiteFormValues>;
  submitLabel: string;
  cancelHref: string;
  /** Saves on this device; resolves once committed. A thrown error is shown as "Not saved". */
  onSave: (values: SiteFormOutput, dirty: SiteFormDirty) => Promise<void>;
  /** Shown above the fields, e.g. a conflict notice. */
  banner?: ReactNode;
}

/** The site's fields, checked with the shared schema; saving works with or without a network. */
export function SiteForm({
  defaultValues,
  submitLabel,
  cancelHref,
  onSave,
  banner,
}: SiteFormProps) {
  const [formMessage, setFormMessage] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<
    SiteFormValues,
    unknown,
    SiteFormOutput
  >({ resolver: zodResolver(siteFormSchema), defaultValues });
  const { errors, isSubmitting, dirtyFields } = formState;

  const submit = handleSubmit(async (values) => {
    setFormMessage(null);
    try {
      await onSave(values, dirtyFields);
    } catch (error) {
      const message = applyServerErrors(error, fieldNames, setError);
      setFormMessage(message ?? "Some values were refused: see the fields marked below.");
    }
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-6" aria-label="Site">
      {banner}
      {formMessage !== null && (
        <Notice tone="danger" title="Not saved" live>
          {formMessage}
        </Notice>
      )}
      <SiteFormFields register={register} errors={errors} />
      <div className="flex flex-wrap gap-3">
        <Button tone="primary" type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : submitLabel}
        </Button>
        <LinkButton to={cancelHref}>Cancel</LinkButton>
      </div>
    </form>
  );
}
