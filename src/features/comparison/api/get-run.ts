import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { comparisonFileView, comparisonRunView } from "../../../../shared/schemas/comparison";
import { apiRequest } from "../../../lib/api";
import { comparisonKeys, runPath } from "./keys";

const runResponse = z.object({ run: comparisonRunView, files: z.array(comparisonFileView) });
export type RunWithFiles = z.infer<typeof runResponse>;

export function getRun(
  campaignId: string,
  runId: string,
  signal?: AbortSignal,
): Promise<RunWithFiles> {
  return apiRequest(runPath(campaignId, runId), { schema: runResponse, signal });
}

export function runQueryOptions(campaignId: string, runId: string) {
  return queryOptions({
    queryKey: comparisonKeys.run(campaignId, runId),
    queryFn: ({ signal }) => getRun(campaignId, runId, signal),
  });
}

export function useRun(campaignId: string, runId: string) {
  return useQuery(runQueryOptions(campaignId, runId));
}
