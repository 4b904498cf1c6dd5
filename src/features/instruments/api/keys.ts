// The list key is the one the comparison run form reads, so an edit here refreshes its choices.
export const instrumentKeys = {
  all: ["instruments"] as const,
  list: (campaignId: string) => [...instrumentKeys.all, "list", campaignId] as const,
  one: (campaignId: string, instrumentId: string) =>
    [...instrumentKeys.all, "one", campaignId, instrumentId] as const,
  history: (campaignId: string, instrumentId: string) =>
    [...instrumentKeys.one(campaignId, instrumentId), "history"] as const,
};

export const instrumentsBase = (campaignId: string) =>
  `/campaigns/${encodeURIComponent(campaignId)}/instruments`;
export const instrumentPath = (campaignId: string, instrumentId: string) =>
  `${instrumentsBase(campaignId)}/${encodeURIComponent(instrumentId)}`;
