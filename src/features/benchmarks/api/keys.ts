// The same keys as the map's benchmark reads, so an edit here refreshes the map's points too.
export const benchmarkKeys = {
  all: ["benchmarks"] as const,
  lists: () => [...benchmarkKeys.all, "list"] as const,
  list: (campaignId: string) => [...benchmarkKeys.lists(), campaignId] as const,
};

export const benchmarksBase = (campaignId: string) =>
  `/campaigns/${encodeURIComponent(campaignId)}/benchmarks`;
export const benchmarkPath = (campaignId: string, benchmarkId: string) =>
  `${benchmarksBase(campaignId)}/${encodeURIComponent(benchmarkId)}`;
