export const benchmarkKeys = {
  all: ["benchmarks"] as const,
  lists: () => [...benchmarkKeys.all, "list"] as const,
  list: (campaignId: string) => [...benchmarkKeys.lists(), campaignId] as const,
};
