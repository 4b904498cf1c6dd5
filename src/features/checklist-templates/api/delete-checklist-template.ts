import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiRequest, noContent } from "../../../lib/api";
import { templatesPath } from "./get-checklist-templates";
import { checklistTemplateKeys } from "./keys";

export async function deleteChecklistTemplate(
  campaignId: string,
  templateId: string,
): Promise<void> {
  const path = `${templatesPath(campaignId)}/${encodeURIComponent(templateId)}`;
  await apiRequest(path, { method: "DELETE", schema: noContent });
}

export function useDeleteChecklistTemplate(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (templateId: string) => deleteChecklistTemplate(campaignId, templateId),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: checklistTemplateKeys.list(campaignId) }),
  });
}
