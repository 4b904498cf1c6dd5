// Each run's height result beside the run, for the lists (heights page, site board).
import { useQueries } from "@tanstack/react-query";
import type { ComparisonRunView, HeightResultView } from "../../../../shared/schemas/comparison";
import { resultQueryOptions } from "../api/get-result";

export interface RunWithResult {
  run: ComparisonRunView;
  result: HeightResultView | undefined;
  /** When the result was last fetched (ms since epoch), 0 when never. */
  fetchedAtMs: number;
  error: unknown;
}

export function useRunResults(
  campaignId: string,
  runs: readonly ComparisonRunView[],
): RunWithResult[] {
  const results = useQueries({
    queries: runs.map((run) => resultQueryOptions(campaignId, run.id)),
  });
  return runs.map((run, i) => ({
    run,
    result: results[i]?.data,
    fetchedAtMs: results[i]?.dataUpdatedAt ?? 0,
    error: results[i]?.error ?? null,
  }));
}
