import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { roleSchema, type InviteInput } from "../../../../shared/schemas";
import { apiRequest } from "../../../lib/api";
import { memberKeys } from "./keys";

const inviteResponse = z.object({
  invite: z.object({ email: z.string(), role: roleSchema, expiresAt: z.string() }),
});
export type InviteView = z.infer<typeof inviteResponse>["invite"];

export async function createInvite(campaignId: string, input: InviteInput): Promise<InviteView> {
  const path = `/campaigns/${encodeURIComponent(campaignId)}/invites`;
  const { invite } = await apiRequest(path, {
    method: "POST",
    body: input,
    schema: inviteResponse,
  });
  return invite;
}

export function useCreateInvite(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteInput) => createInvite(campaignId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: memberKeys.list(campaignId) }),
  });
}
