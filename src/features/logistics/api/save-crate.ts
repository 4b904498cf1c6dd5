// Crate editing is online (REST), for logistics: create and edit answer with the crate as stored.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { crateView, type CrateView } from "../../../../shared/schemas/crates";
import type { CrateFields } from "../../../../shared/schemas/logistics";
import { apiRequest } from "../../../lib/api";
import { crateKeys } from "./keys";

const crateResponse = z.object({ crate: crateView });
const base = (campaignId: string) => `/campaigns/${encodeURIComponent(campaignId)}/crates`;

export async function createCrate(campaignId: string, id: string, crate: CrateFields) {
  const res = await apiRequest(base(campaignId), {
    method: "POST",
    body: { id, crate },
    schema: crateResponse,
  });
  return res.crate;
}

export async function editCrate(
  campaignId: string,
  crateId: string,
  baseVersion: number,
  crate: CrateFields,
): Promise<CrateView> {
  const res = await apiRequest(`${base(campaignId)}/${encodeURIComponent(crateId)}`, {
    method: "PUT",
    body: { baseVersion, crate },
    schema: crateResponse,
  });
  return res.crate;
}

export function useSaveCrate(campaignId: string, onSaved: (crate: CrateView) => Promise<void>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { id: string; baseVersion: number | null; crate: CrateFields }) =>
      input.baseVersion === null
        ? createCrate(campaignId, input.id, input.crate)
        : editCrate(campaignId, input.id, input.baseVersion, input.crate),
    onSuccess: async (crate) => {
      await onSaved(crate);
      await queryClient.invalidateQueries({ queryKey: crateKeys.list(campaignId) });
    },
  });
}
