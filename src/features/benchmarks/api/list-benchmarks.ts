// The campaign's benchmarks, persisted with the query cache so they read offline.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { benchmarkView, type BenchmarkView } from "../../../../shared/schemas/benchmarks";
import { apiRequest } from "../../../lib/api";
import { benchmarkKeys, benchmarksBase } from "./keys";

const benchmarksResponse = z.object({ benchmarks: z.array(benchmarkView) });

export async function listBenchmarks(
  campaignId: string,
  signal?: AbortSignal,
): Promise<BenchmarkView[]> {
  const { benchmarks } = await apiRequest(benchmarksBase(campaignId), {
    schema: benchmarksResponse,
    signal,
  });
  return benchmarks;
}

export function benchmarksQueryOptions(campaignId: string) {
  return queryOptions({
    queryKey: benchmarkKeys.list(campaignId),
    queryFn: ({ signal }) => listBenchmarks(campaignId, signal),
  });
}

export function useBenchmarks(campaignId: string) {
  return useQuery(benchmarksQueryOptions(campaignId));
}
