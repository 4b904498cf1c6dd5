// Refused (409) while a comparison run uses the instrument; the message names the run.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiRequest, noContent } from "../../../lib/api";
import { instrumentKeys, instrumentPath } from "./keys";

export async function deleteInstrument(campaignId: string, instrumentId: string): Promise<void> {
  await apiRequest(instrumentPath(campaignId, instrumentId), {
    method: "DELETE",
    schema: noContent,
  });
}

export function useDeleteInstrument(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (instrumentId: string) => deleteInstrument(campaignId, instrumentId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: instrumentKeys.list(campaignId) }),
  });
}
