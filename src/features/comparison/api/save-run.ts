// Runs are edited online (REST); the answer is the run as stored.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import {
  comparisonRunView,
  type ComparisonRunFields,
  type ComparisonRunView,
} from "../../../../shared/schemas/comparison";
import { apiRequest } from "../../../lib/api";
import { comparisonKeys, runPath, runsBase } from "./keys";

const runResponse = z.object({ run: comparisonRunView });

export async function createRun(campaignId: string, id: string, run: ComparisonRunFields) {
  const res = await apiRequest(runsBase(campaignId), {
    method: "POST",
    body: { id, run },
    schema: runResponse,
  });
  return res.run;
}

export async function editRun(
  campaignId: string,
  runId: string,
  baseVersion: number,
  run: ComparisonRunFields,
): Promise<ComparisonRunView> {
  const res = await apiRequest(runPath(campaignId, runId), {
    method: "PUT",
    body: { baseVersion, run },
    schema: runResponse,
  });
  return res.run;
}

export function useSaveRun(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { id: string; baseVersion: number | null; run: ComparisonRunFields }) =>
      input.baseVersion === null
        ? createRun(campaignId, input.id, input.run)
        : editRun(campaignId, input.id, input.baseVersion, input.run),
    onSuccess: async (run) => {
      await queryClient.invalidateQueries({ queryKey: comparisonKeys.list(campaignId) });
      await queryClient.invalidateQueries({ queryKey: comparisonKeys.run(campaignId, run.id) });
    },
  });
}
