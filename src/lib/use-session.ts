import { useSyncExternalStore } from "react";
import { getSession, subscribeSession, type SessionState } from "./session";

export function useSession(): SessionState {
  return useSyncExternalStore(subscribeSession, getSession, getSession);
}
