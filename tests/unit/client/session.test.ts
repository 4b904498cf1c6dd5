// The remembered session: what lets the app open signed in with no network.
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { memoryStorage } from "../../helpers/memory-storage";

const user = {
  id: "0b6f7a4e-3c1d-4f7a-9a55-2f0c8d1e9b10",
  email: "field@demo.equipot.test",
  name: "Mira",
};
const memberships = [
  {
    campaignId: "7d1c9a2e-5b4f-4c3d-8e2a-1f0b9c8d7e6a",
    campaignName: "Kestrel",
    role: "field" as const,
  },
];

let storage: Storage;

beforeEach(() => {
  vi.resetModules();
  storage = memoryStorage();
  vi.stubGlobal("localStorage", storage);
});

afterEach(() => vi.unstubAllGlobals());

describe("the session store", () => {
  test("opens signed in, unverified, from a remembered session", async () => {
    storage.setItem("equipot.session.v1", JSON.stringify({ user, memberships, savedAt: "x" }));
    const { getSession } = await import("../../../src/lib/session");
    expect(getSession()).toEqual({ status: "signed-in", user, memberships, verified: false });
  });

  test("a damaged remembered session opens signed out", async () => {
    storage.setItem("equipot.session.v1", "{not json");
    const { getSession } = await import("../../../src/lib/session");
    expect(getSession()).toEqual({ status: "signed-out" });
  });

  test("remembers the user and memberships but never the access token", async () => {
    const { acceptSession, getSession } = await import("../../../src/lib/session");
    acceptSession({ accessToken: "secret-token", user, memberships });
    expect(getSession()).toMatchObject({ status: "signed-in", verified: true });
    const stored = storage.getItem("equipot.session.v1") ?? "";
    expect(stored).toContain(user.email);
    expect(stored).not.toContain("secret-token");
  });

  test("keeps an offline session when the refresh cannot reach the server", async () => {
    storage.setItem("equipot.session.v1", JSON.stringify({ user, memberships, savedAt: "x" }));
    vi.stubGlobal(
      "fetch",
      vi.fn(() => Promise.reject(new TypeError("Failed to fetch"))),
    );
    const { getSession, resumeSession } = await import("../../../src/lib/session");
    await resumeSession();
    expect(getSession()).toMatchObject({ status: "signed-in", verified: false });
  });

  test("ends the session, as expired, when the server refuses the refresh", async () => {
    storage.setItem("equipot.session.v1", JSON.stringify({ user, memberships, savedAt: "x" }));
    const body = JSON.stringify({ error: { code: "unauthenticated", message: "No session" } });
    vi.stubGlobal(
      "fetch",
      vi.fn(() => Promise.resolve(new Response(body, { status: 401 }))),
    );
    const { getSession, onUserDataReset, resumeSession } = await import("../../../src/lib/session");
    const reset = vi.fn();
    onUserDataReset(reset);
    await resumeSession();
    expect(getSession()).toEqual({ status: "signed-out", reason: "expired" });
    expect(storage.getItem("equipot.session.v1")).toBeNull();
    expect(reset).toHaveBeenCalledOnce();
  });

  test("another person signing in drops the previous person's cached data", async () => {
    const { acceptSession, onUserDataReset } = await import("../../../src/lib/session");
    const reset = vi.fn();
    onUserDataReset(reset);
    acceptSession({ accessToken: "a", user, memberships });
    acceptSession({ accessToken: "b", user, memberships });
    expect(reset).not.toHaveBeenCalled();
    acceptSession({
      accessToken: "c",
      user: { ...user, id: "5e0c2b7a-1d3f-4a6b-9c8e-7f2a1b0c9d8e" },
      memberships,
    });
    expect(reset).toHaveBeenCalledOnce();
  });
});

describe("the query cache", () => {
  test("keeps unused queries (a finite gcTime above 2^31 ms would collect them at once)", async () => {
    const { createQueryClient } = await import("../../../src/lib/query-client");
    const gcTime = createQueryClient().getDefaultOptions().queries?.gcTime;
    expect(gcTime === Infinity || (typeof gcTime === "number" && gcTime < 2 ** 31)).toBe(true);
  });
});
