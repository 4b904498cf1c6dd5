// The series analysis; polled while the server's worker is still computing it.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { analysisStates, seriesAnalysis } from "../../../../shared/schemas/comparison";
import { apiRequest } from "../../../lib/api";
import { comparisonKeys, runPath } from "./keys";

const analysisResponse = z.object({
  state: z.enum(["none", ...analysisStates]),
  analysis: seriesAnalysis.nullable(),
});
export type AnalysisAnswer = z.infer<typeof analysisResponse>;

const pollMs = 1500;

export function getAnalysis(
  campaignId: string,
  runId: string,
  signal?: AbortSignal,
): Promise<AnalysisAnswer> {
  return apiRequest(`${runPath(campaignId, runId)}/analysis`, { schema: analysisResponse, signal });
}

export function analysisQueryOptions(campaignId: string, runId: string) {
  return queryOptions({
    queryKey: comparisonKeys.analysis(campaignId, runId),
    queryFn: ({ signal }) => getAnalysis(campaignId, runId, signal),
    refetchInterval: (query) => (query.state.data?.state === "running" ? pollMs : false),
  });
}

export function useAnalysis(campaignId: string, runId: string) {
  return useQuery(analysisQueryOptions(campaignId, runId));
}
