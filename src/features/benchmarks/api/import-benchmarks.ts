// POST …/benchmarks/import: the file's text and format; a refused file answers 422 with its bad
// rows (line for CSV, feature number for GeoJSON) and nothing is stored.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import {
  benchmarkImportResult,
  importRowError,
  type ImportRowError,
} from "../../../../shared/schemas/benchmarks";
import { apiErrorFrom, reachServer, withAccessToken } from "../../../lib/api";
import { ApiError } from "../../../lib/api-error";
import { benchmarkKeys, benchmarksBase } from "./keys";

const refusal = z.object({
  error: z.object({
    code: z.literal("invalid_file"),
    message: z.string(),
    rows: z.array(importRowError),
  }),
});

export type BenchmarkImportResult = z.infer<typeof benchmarkImportResult>;

export interface BenchmarkImportRequest {
  format: "csv" | "geojson";
  fileName: string;
  content: string;
  onExisting: "refuse" | "update";
}

/** The file was read and refused; nothing was stored. */
export class BenchmarkFileRefused extends Error {
  constructor(
    message: string,
    readonly rows: readonly ImportRowError[],
  ) {
    super(message);
  }
}

export async function importBenchmarks(
  campaignId: string,
  file: BenchmarkImportRequest,
): Promise<BenchmarkImportResult> {
  const response = await withAccessToken((headers) =>
    reachServer(`${benchmarksBase(campaignId)}/import`, {
      method: "POST",
      headers: { ...headers, Accept: "application/json", "Content-Type": "application/json" },
      body: JSON.stringify(file),
      cache: "no-store",
    }),
  );
  const body: unknown = await response.json().catch(() => undefined);
  if (response.status === 422) {
    const refused = refusal.safeParse(body);
    if (refused.success)
      throw new BenchmarkFileRefused(refused.data.error.message, refused.data.error.rows);
  }
  if (!response.ok) throw apiErrorFrom(response.status, body);
  const parsed = benchmarkImportResult.safeParse(body);
  if (!parsed.success)
    throw new ApiError(response.status, "bad_response", "The server's answer was not understood.");
  return parsed.data;
}

export function useImportBenchmarks(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: BenchmarkImportRequest) => importBenchmarks(campaignId, file),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: benchmarkKeys.list(campaignId) }),
  });
}
