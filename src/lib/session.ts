// The signed-in person, kept so that the app opens signed in when offline. The user and their
// memberships are remembered in localStorage; the access token lives only in memory (api.ts) and
// the refresh token only in an httpOnly cookie.
import { z } from "zod";
import {
  membershipView,
  userView,
  type MembershipView,
  type SessionView,
  type UserView,
} from "../../shared/schemas";
import { onSessionEvent, refreshSession, setAccessToken } from "./api";

export type SessionState =
  | {
      status: "signed-out";
      /** "expired": the server no longer accepts the session; "signed-out": the person chose to. */
      reason?: "expired" | "signed-out";
    }
  | {
      status: "signed-in";
      user: UserView;
      memberships: MembershipView[];
      /** True once the server confirmed the session during this page's life. */
      verified: boolean;
    };

const storageKey = "equipot.session.v1";
const rememberedSchema = z.object({
  user: userView,
  memberships: z.array(membershipView),
  savedAt: z.string(),
});

type Listener = () => void;
const listeners = new Set<Listener>();
const resetListeners = new Set<Listener>();
let state: SessionState = readRemembered();

function readRemembered(): SessionState {
  try {
    const raw = localStorage.getItem(storageKey);
    if (raw === null) return { status: "signed-out" };
    const parsed = rememberedSchema.safeParse(JSON.parse(raw));
    if (!parsed.success) return { status: "signed-out" };
    const { user, memberships } = parsed.data;
    return { status: "signed-in", user, memberships, verified: false };
  } catch {
    return { status: "signed-out" };
  }
}

function setState(next: SessionState): void {
  state = next;
  for (const listener of listeners) listener();
}

function resetUserData(): void {
  for (const listener of resetListeners) listener();
}

export function getSession(): SessionState {
  return state;
}

export function subscribeSession(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Called when the person signs out or another person signs in: drop their cached data. */
export function onUserDataReset(listener: Listener): () => void {
  resetListeners.add(listener);
  return () => resetListeners.delete(listener);
}

/** Takes a session answered by sign-in, invite acceptance or refresh. */
export function acceptSession(session: SessionView): void {
  const previous = state.status === "signed-in" ? state.user.id : null;
  if (previous !== null && previous !== session.user.id) resetUserData();
  setAccessToken(session.accessToken);
  const { user, memberships } = session;
  const remembered = { user, memberships, savedAt: new Date().toISOString() };
  try {
    localStorage.setItem(storageKey, JSON.stringify(remembered));
  } catch {
    // Storage full or blocked: the session still works until the tab closes.
  }
  setState({ status: "signed-in", user, memberships, verified: true });
}

export function endSession(reason: "expired" | "signed-out"): void {
  setAccessToken(null);
  try {
    localStorage.removeItem(storageKey);
  } catch {
    // Storage blocked: nothing was remembered.
  }
  resetUserData();
  setState({ status: "signed-out", reason });
}

/**
 * Confirms a remembered session with the server. A 401 ends it (through the "expired" event);
 * no network keeps it, unverified, so the app still opens offline.
 */
export async function resumeSession(): Promise<void> {
  if (state.status !== "signed-in" || state.verified) return;
  try {
    await refreshSession();
  } catch {
    // Handled by the session events, or kept as an offline session.
  }
}

onSessionEvent((event) => {
  if (event.type === "refreshed") acceptSession(event.session);
  else if (state.status === "signed-in") endSession("expired");
});
