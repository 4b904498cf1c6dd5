import { useMutation } from "@tanstack/react-query";
import { apiRequest, noContent } from "../../../lib/api";
import { endSession } from "../../../lib/session";

export async function signOut(): Promise<void> {
  try {
    await apiRequest("/auth/sign-out", { method: "POST", schema: noContent, auth: false });
  } catch {
    // Offline or refused: this device forgets the session all the same; the cookie expires.
  } finally {
    endSession("signed-out");
  }
}

export function useSignOut() {
  return useMutation({ mutationFn: signOut });
}
