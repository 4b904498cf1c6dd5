// Benchmarks are edited online (REST): a new one carries a client-made id, an edit the version it
// started from (409 when someone else changed it meanwhile, or when the code is taken).
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import {
  benchmarkView,
  type BenchmarkFields,
  type BenchmarkView,
} from "../../../../shared/schemas/benchmarks";
import { apiRequest } from "../../../lib/api";
import { benchmarkKeys, benchmarkPath, benchmarksBase } from "./keys";

const benchmarkResponse = z.object({ benchmark: benchmarkView });

export interface SaveBenchmarkInput {
  id: string;
  /** null for a new benchmark. */
  baseVersion: number | null;
  benchmark: BenchmarkFields;
}

export async function saveBenchmark(
  campaignId: string,
  input: SaveBenchmarkInput,
): Promise<BenchmarkView> {
  const res =
    input.baseVersion === null
      ? await apiRequest(benchmarksBase(campaignId), {
          method: "POST",
          body: { id: input.id, benchmark: input.benchmark },
          schema: benchmarkResponse,
        })
      : await apiRequest(benchmarkPath(campaignId, input.id), {
          method: "PUT",
          body: { baseVersion: input.baseVersion, benchmark: input.benchmark },
          schema: benchmarkResponse,
        });
  return res.benchmark;
}

export function useSaveBenchmark(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveBenchmarkInput) => saveBenchmark(campaignId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: benchmarkKeys.list(campaignId) }),
  });
}
