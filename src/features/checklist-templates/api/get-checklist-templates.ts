import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import {
  checklistTemplateView,
  type ChecklistTemplateView,
} from "../../../../shared/schemas/checklists";
import { apiRequest } from "../../../lib/api";
import { checklistTemplateKeys } from "./keys";

const templatesResponse = z.object({ templates: z.array(checklistTemplateView) });

export const templatesPath = (campaignId: string) =>
  `/campaigns/${encodeURIComponent(campaignId)}/checklist-templates`;

export async function getChecklistTemplates(
  campaignId: string,
  signal?: AbortSignal,
): Promise<ChecklistTemplateView[]> {
  const { templates } = await apiRequest(templatesPath(campaignId), {
    schema: templatesResponse,
    signal,
  });
  return templates;
}

export function checklistTemplatesQueryOptions(campaignId: string) {
  return queryOptions({
    queryKey: checklistTemplateKeys.list(campaignId),
    queryFn: ({ signal }) => getChecklistTemplates(campaignId, signal),
  });
}

export function useChecklistTemplates(campaignId: string) {
  return useQuery(checklistTemplatesQueryOptions(campaignId));
}
