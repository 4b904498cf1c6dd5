export const crateKeys = {
  all: ["crates"] as const,
  list: (campaignId: string) => [...crateKeys.all, "list", campaignId] as const,
};
