import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import type { ChecklistTemplateCreateInput } from "../../../../shared/schemas/checklist-templates";
import {
  checklistTemplateView,
  type ChecklistTemplateView,
} from "../../../../shared/schemas/checklists";
import { apiRequest } from "../../../lib/api";
import { templatesPath } from "./get-checklist-templates";
import { checklistTemplateKeys } from "./keys";

export const templateResponse = z.object({ template: checklistTemplateView });

export async function createChecklistTemplate(
  campaignId: string,
  input: ChecklistTemplateCreateInput,
): Promise<ChecklistTemplateView> {
  const { template } = await apiRequest(templatesPath(campaignId), {
    method: "POST",
    body: input,
    schema: templateResponse,
  });
  return template;
}

export function useCreateChecklistTemplate(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ChecklistTemplateCreateInput) => createChecklistTemplate(campaignId, input),
    onSuccess: (created) => {
      // The editor reopens on the new template at once, before the list is fetched again.
      queryClient.setQueryData<ChecklistTemplateView[]>(
        checklistTemplateKeys.list(campaignId),
        (list) => (list === undefined ? list : [...list, created]),
      );
      return queryClient.invalidateQueries({ queryKey: checklistTemplateKeys.list(campaignId) });
    },
  });
}
