// POST …/benchmarks/import: the file's text and format; a refused file answers 422 invalid_file
// with its bad rows (line for CSV, feature number for GeoJSON) and nothing is stored.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { z } from "zod";
import { benchmarkImportResult } from "../../../../shared/schemas/benchmarks";
import { apiRequest } from "../../../lib/api";
import { benchmarkKeys, benchmarksBase } from "./keys";

export type BenchmarkImportResult = z.infer<typeof benchmarkImportResult>;

export interface BenchmarkImportRequest {
  format: "csv" | "geojson";
  fileName: string;
  content: string;
  onExisting: "refuse" | "update";
}

export function importBenchmarks(
  campaignId: string,
  file: BenchmarkImportRequest,
): Promise<BenchmarkImportResult> {
  return apiRequest(`${benchmarksBase(campaignId)}/import`, {
    method: "POST",
    body: file,
    schema: benchmarkImportResult,
  });
}

export function useImportBenchmarks(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: BenchmarkImportRequest) => importBenchmarks(campaignId, file),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: benchmarkKeys.list(campaignId) }),
  });
}
