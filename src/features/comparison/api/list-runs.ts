// The campaign's comparison runs; persisted with the query cache, so the board reads them offline.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { comparisonRunView, type ComparisonRunView } from "../../../../shared/schemas/comparison";
import { apiRequest } from "../../../lib/api";
import { comparisonKeys, runsBase } from "./keys";

const runsResponse = z.object({ runs: z.array(comparisonRunView) });

export async function listRuns(
  campaignId: string,
  signal?: AbortSignal,
): Promise<ComparisonRunView[]> {
  const { runs } = await apiRequest(runsBase(campaignId), { schema: runsResponse, signal });
  return runs;
}

export function runsQueryOptions(campaignId: string) {
  return queryOptions({
    queryKey: comparisonKeys.list(campaignId),
    queryFn: ({ signal }) => listRuns(campaignId, signal),
  });
}

export function useRuns(campaignId: string) {
  return useQuery(runsQueryOptions(campaignId));
}
