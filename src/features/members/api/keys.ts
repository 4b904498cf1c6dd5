export const memberKeys = {
  all: ["members"] as const,
  lists: () => [...memberKeys.all, "list"] as const,
  list: (campaignId: string) => [...memberKeys.lists(), campaignId] as const,
};
