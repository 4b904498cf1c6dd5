export const comparisonKeys = {
  all: ["comparison-runs"] as const,
  list: (campaignId: string) => [...comparisonKeys.all, "list", campaignId] as const,
  run: (campaignId: string, runId: string) =>
    [...comparisonKeys.all, "run", campaignId, runId] as const,
  analysis: (campaignId: string, runId: string) =>
    [...comparisonKeys.run(campaignId, runId), "analysis"] as const,
  result: (campaignId: string, runId: string) =>
    [...comparisonKeys.run(campaignId, runId), "result"] as const,
  instruments: (campaignId: string) => ["instruments", "list", campaignId] as const,
};

export const runsBase = (campaignId: string) =>
  `/campaigns/${encodeURIComponent(campaignId)}/comparison-runs`;
export const runPath = (campaignId: string, runId: string) =>
  `${runsBase(campaignId)}/${encodeURIComponent(runId)}`;
