import { useEffect, useRef } from "react";
import {
  checklistPurposes,
  type ChecklistPurpose,
  type ChecklistTemplateView,
} from "../../../../shared/schemas/checklists";
import { Button } from "../../../components/button";
import { SelectField, TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { StatusShape } from "../../../components/status-shape";
import { useTemplateActions, type TemplateActionsOptions } from "../hooks/use-template-actions";
import { useTemplateDraft } from "../hooks/use-template-draft";
import { assignItemIds } from "../lib/item-ids";
import { purposeLabels } from "../lib/draft";
import { ItemFields } from "./item-fields";

type TemplateEditorProps = Omit<TemplateActionsOptions, "state"> & {
  /** null for a new template. */
  template: ChecklistTemplateView | null;
  online: boolean;
};

const isPurpose = (value: string): value is ChecklistPurpose =>
  checklistPurposes.some((p) => p === value);

function FormError({ message }: { message: string | undefined }) {
  if (message === undefined) return null;
  return (
    <p className="flex items-start gap-2 font-semibold text-danger-ink">
      <StatusShape shape="octagon" className="mt-0.5 text-danger" />
      <span>{message}</span>
    </p>
  );
}

export function TemplateEditor({ template, online, ...options }: TemplateEditorProps) {
  const state = useTemplateDraft(template);
  const actions = useTemplateActions({ ...options, state });
  const { base, draft, errors } = state;
  const ids = assignItemIds(draft.items);
  const formRef = useRef<HTMLFormElement>(null);

  // After a refused save, take the person to the first field that needs them.
  useEffect(() => {
    if (Object.keys(errors).length === 0) return;
    formRef.current?.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus();
  }, [errors]);

  return (
    <form
      ref={formRef}
      noValidate
      aria-label={base === null ? "New checklist template" : `Edit ${base.title}`}
      className="flex flex-col gap-6"
      onSubmit={(e) => {
        e.preventDefault();
        actions.save();
      }}
    >
      <div className="grid gap-5 md:grid-cols-[2fr_1fr]">
        <TextField
          label="Title"
          value={draft.title}
          error={errors.title}
          onChange={(e) => state.edit({ title: e.target.value })}
        />
        <SelectField
          label="Purpose"
          value={draft.purpose}
          error={errors.purpose}
          onChange={(e) => isPurpose(e.target.value) && state.edit({ purpose: e.target.value })}
        >
          {checklistPurposes.map((purpose) => (
            <option key={purpose} value={purpose}>
              {purposeLabels[purpose]}
            </option>
          ))}
        </SelectField>
      </div>
      <section aria-labelledby="template-items-heading" className="flex flex-col gap-4">
        <h2 id="template-items-heading" className="text-2xl font-semibold">
          Items{" "}
          <span className="text-base font-normal text-muted tabular-nums">
            ({draft.items.length})
          </span>
        </h2>
        <FormError message={errors.items} />
        {draft.items.map((item, index) => (
          <ItemFields
            key={item.key}
            item={item}
            index={index}
            count={draft.items.length}
            itemId={ids[index] ?? ""}
            errors={errors}
            onChange={(patch) => state.changeItem(item.key, patch)}
            onMove={(by) => state.move(index, by)}
            onRemove={() => state.removeItem(item.key)}
          />
        ))}
        <div>
          <Button onClick={state.addItem}>Add item</Button>
        </div>
      </section>
      {actions.problem !== null && (
        <Notice
          tone={actions.problem.stale ? "attention" : "danger"}
          title={actions.problem.title}
          live
        >
          <p>{actions.problem.text}</p>
          {actions.problem.stale && (
            <Button className="mt-3" onClick={() => void actions.loadCurrent()} disabled={!online}>
              Load the current version (drops these changes)
            </Button>
          )}
        </Notice>
      )}
      {!online && (
        <Notice tone="attention" title="Offline: not saved">
          Templates are edited with a connection. Your changes stay on this screen until you are
          online again.
        </Notice>
      )}
      <div className="flex flex-wrap items-center gap-3">
        <Button tone="primary" type="submit" disabled={actions.busy || !online}>
          {actions.saving ? "Saving…" : "Save template"}
        </Button>
        <Button tone="quiet" onClick={options.onClose}>
          Back to the list
        </Button>
        {base !== null && (
          <Button
            tone="danger"
            onClick={actions.deleteTemplate}
            disabled={actions.busy || !online}
            className="ml-auto"
          >
            {actions.confirmDelete ? "Tap again to delete" : "Delete template"}
          </Button>
        )}
      </div>
      {actions.confirmDelete && (
        <p className="text-muted">
          Runs already started keep their items; tablets stop offering this checklist after their
          next sync.
        </p>
      )}
    </form>
  );
}
