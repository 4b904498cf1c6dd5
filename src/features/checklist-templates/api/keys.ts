export const checklistTemplateKeys = {
  all: ["checklist-templates"] as const,
  lists: () => [...checklistTemplateKeys.all, "list"] as const,
  list: (campaignId: string) => [...checklistTemplateKeys.lists(), campaignId] as const,
};
