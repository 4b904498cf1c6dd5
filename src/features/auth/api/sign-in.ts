import { useMutation } from "@tanstack/react-query";
import { sessionView, type SessionView, type SignInInput } from "../../../../shared/schemas";
import { apiRequest } from "../../../lib/api";
import { acceptSession } from "../../../lib/session";

export function signIn(input: SignInInput): Promise<SessionView> {
  return apiRequest("/auth/sign-in", {
    method: "POST",
    body: input,
    schema: sessionView,
    auth: false,
  });
}

export function useSignIn() {
  return useMutation({
    mutationFn: signIn,
    onSuccess: (session) => acceptSession(session),
  });
}
