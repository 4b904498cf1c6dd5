// POST …/height-ties/import: the file's text; a refused file answers 422 invalid_file with its bad
// rows by line and nothing is stored.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { heightTieView, type HeightTieView } from "../../../../shared/schemas/height-network";
import { apiRequest } from "../../../lib/api";
import { campaignBase, heightNetworkKeys } from "./keys";

const imported = z.object({ ties: z.array(heightTieView) });

export async function importTies(
  campaignId: string,
  file: { fileName: string; content: string },
): Promise<HeightTieView[]> {
  const { ties } = await apiRequest(`${campaignBase(campaignId)}/height-ties/import`, {
    method: "POST",
    body: file,
    schema: imported,
  });
  return ties;
}

export function useImportTies(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: { fileName: string; content: string }) => importTies(campaignId, file),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: heightNetworkKeys.observations(campaignId) }),
  });
}
