export const heightNetworkKeys = {
  all: ["height-network"] as const,
  observations: (campaignId: string) =>
    [...heightNetworkKeys.all, "observations", campaignId] as const,
  latest: (campaignId: string) => [...heightNetworkKeys.all, "latest", campaignId] as const,
};

export const campaignBase = (campaignId: string) => `/campaigns/${encodeURIComponent(campaignId)}`;
