import { useState } from "react";
import type { ChecklistTemplateView } from "../../../../shared/schemas/checklists";
import { ApiError, messageOf } from "../../../lib/api-error";
import { useCreateChecklistTemplate } from "../api/create-checklist-template";
import { useDeleteChecklistTemplate } from "../api/delete-checklist-template";
import { useUpdateChecklistTemplate } from "../api/update-checklist-template";
import { checkDraft, type FieldErrors } from "../lib/draft";
import type { TemplateDraftState } from "./use-template-draft";

export interface Problem {
  title: string;
  text: string;
  /** Someone else saved first (409): offer to load their version. */
  stale: boolean;
}

export interface TemplateActionsOptions {
  campaignId: string;
  state: TemplateDraftState;
  /** Fetches the list again and gives this template as the server has it now. */
  reload: () => Promise<ChecklistTemplateView | undefined>;
  onSaved: (template: ChecklistTemplateView, created: boolean) => void;
  onDeleted: (template: ChecklistTemplateView) => void;
  onClose: () => void;
}

/** The server's 400 details by field path ("items.2.max"), as the shared schema names them. */
function errorsFrom(error: unknown): FieldErrors {
  const errors: FieldErrors = {};
  if (error instanceof ApiError)
    for (const issue of error.details)
      errors[issue.path.replace(/^body\./, "") || "form"] ??= issue.message;
  return errors;
}

/** Save (create or update against the opened version), delete after a second tap, reload. */
export function useTemplateActions(options: TemplateActionsOptions) {
  const { campaignId, state, reload, onSaved, onDeleted, onClose } = options;
  const [problem, setProblem] = useState<Problem | null>(null);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const create = useCreateChecklistTemplate(campaignId);
  const update = useUpdateChecklistTemplate(campaignId);
  const remove = useDeleteChecklistTemplate(campaignId);
  const { base } = state;

  const failed = (error: unknown) => {
    const stale = error instanceof ApiError && error.status === 409;
    state.setErrors(errorsFrom(error));
    const title = stale ? "Changed by someone else" : "Not saved";
    setProblem({ title, text: messageOf(error), stale });
  };

  const save = () => {
    setProblem(null);
    const { fields, errors } = checkDraft(state.draft);
    state.setErrors(errors);
    if (Object.keys(errors).length > 0)
      return setProblem({ title: "Not saved", text: "Check the marked fields.", stale: false });
    if (base === null) {
      const input = { id: crypto.randomUUID(), ...fields };
      return create.mutate(input, {
        onSuccess: (saved) => onSaved(saved, true),
        onError: failed,
      });
    }
    update.mutate(
      { templateId: base.id, input: { baseVersion: base.version, ...fields } },
      {
        onSuccess: (saved) => {
          state.reset(saved);
          onSaved(saved, false);
        },
        onError: failed,
      },
    );
  };

  const loadCurrent = async () => {
    const current = await reload();
    if (current === undefined) return onClose();
    state.reset(current);
    setProblem(null);
  };

  const deleteTemplate = () => {
    if (base === null) return;
    if (!confirmDelete) return setConfirmDelete(true);
    remove.mutate(base.id, { onSuccess: () => onDeleted(base), onError: failed });
  };

  return {
    problem,
    confirmDelete,
    saving: create.isPending || update.isPending,
    busy: create.isPending || update.isPending || remove.isPending,
    save,
    loadCurrent,
    deleteTemplate,
  };
}
