import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ChecklistTemplateUpdateInput } from "../../../../shared/schemas/checklist-templates";
import type { ChecklistTemplateView } from "../../../../shared/schemas/checklists";
import { apiRequest } from "../../../lib/api";
import { templateResponse } from "./create-checklist-template";
import { templatesPath } from "./get-checklist-templates";
import { checklistTemplateKeys } from "./keys";

export async function updateChecklistTemplate(
  campaignId: string,
  templateId: string,
  input: ChecklistTemplateUpdateInput,
): Promise<ChecklistTemplateView> {
  const path = `${templatesPath(campaignId)}/${encodeURIComponent(templateId)}`;
  const { template } = await apiRequest(path, {
    method: "PUT",
    body: input,
    schema: templateResponse,
  });
  return template;
}

export function useUpdateChecklistTemplate(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({
      templateId,
      input,
    }: {
      templateId: string;
      input: ChecklistTemplateUpdateInput;
    }) => updateChecklistTemplate(campaignId, templateId, input),
    onSuccess: (saved) =>
      queryClient.setQueryData<ChecklistTemplateView[]>(
        checklistTemplateKeys.list(campaignId),
        (list) => list?.map((t) => (t.id === saved.id ? saved : t)),
      ),
    // A 409 also refreshes the list, so "load the current version" has it at hand.
    onSettled: () =>
      queryClient.invalidateQueries({ queryKey: checklistTemplateKeys.list(campaignId) }),
  });
}
