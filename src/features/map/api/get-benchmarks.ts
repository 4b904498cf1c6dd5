import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { benchmarkView, type BenchmarkView } from "../../../../shared/schemas/benchmarks";
import { apiRequest } from "../../../lib/api";
import { benchmarkKeys } from "./keys";

const benchmarksResponse = z.object({ benchmarks: z.array(benchmarkView) });

export async function getBenchmarks(
  campaignId: string,
  signal?: AbortSignal,
): Promise<BenchmarkView[]> {
  const { benchmarks } = await apiRequest(
    `/campaigns/${encodeURIComponent(campaignId)}/benchmarks`,
    { schema: benchmarksResponse, signal },
  );
  return benchmarks;
}

// Persisted with the rest of the query cache, so the benchmarks seen online stay on the map offline.
export function benchmarksQueryOptions(campaignId: string) {
  return queryOptions({
    queryKey: benchmarkKeys.list(campaignId),
    queryFn: ({ signal }) => getBenchmarks(campaignId, signal),
  });
}

export function useBenchmarks(campaignId: string) {
  return useQuery(benchmarksQueryOptions(campaignId));
}
