// Query keys for sites. Swappable later for the local-first store (src/db + src/sync).
export const siteKeys = {
  all: ["sites"] as const,
  lists: () => [...siteKeys.all, "list"] as const,
  list: (campaignId: string) => [...siteKeys.lists(), campaignId] as const,
};
