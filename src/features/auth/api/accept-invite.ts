import { useMutation } from "@tanstack/react-query";
import { sessionView, type AcceptInviteInput, type SessionView } from "../../../../shared/schemas";
import { apiRequest } from "../../../lib/api";
import { acceptSession } from "../../../lib/session";

export function acceptInvite(input: AcceptInviteInput): Promise<SessionView> {
  return apiRequest("/invites/accept", {
    method: "POST",
    body: input,
    schema: sessionView,
    auth: false,
  });
}

export function useAcceptInvite() {
  return useMutation({
    mutationFn: acceptInvite,
    onSuccess: (session) => acceptSession(session),
  });
}
