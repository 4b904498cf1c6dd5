// The height result and the time left; persisted, so the site board shows the last one offline.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { heightResultView, type HeightResultView } from "../../../../shared/schemas/comparison";
import { apiRequest } from "../../../lib/api";
import { comparisonKeys, runPath } from "./keys";

const pollMs = 1500;

export function getResult(
  campaignId: string,
  runId: string,
  signal?: AbortSignal,
): Promise<HeightResultView> {
  return apiRequest(`${runPath(campaignId, runId)}/result`, { schema: heightResultView, signal });
}

export function resultQueryOptions(campaignId: string, runId: string) {
  return queryOptions({
    queryKey: comparisonKeys.result(campaignId, runId),
    queryFn: ({ signal }) => getResult(campaignId, runId, signal),
    refetchInterval: (query) => (query.state.data?.analysis.state === "running" ? pollMs : false),
  });
}

export function useResult(campaignId: string, runId: string) {
  return useQuery(resultQueryOptions(campaignId, runId));
}
