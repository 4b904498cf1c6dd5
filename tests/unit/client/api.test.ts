// The API client: bearer token, one refresh on 401, typed errors.
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { z } from "zod";
import { ApiError, refusedFileOf } from "../../../src/lib/api-error";
import {
  apiRequest,
  noContent,
  onSessionEvent,
  refreshSession,
  setAccessToken,
  type SessionEvent,
} from "../../../src/lib/api";

type Handler = (url: string, init: RequestInit) => Response | Promise<Response>;

const session = (token: string) => ({
  accessToken: token,
  user: {
    id: "0b6f7a4e-3c1d-4f7a-9a55-2f0c8d1e9b10",
    email: "field@demo.equipot.test",
    name: "Mira",
  },
  memberships: [],
});

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } });

function stubFetch(handler: Handler) {
  const calls: { url: string; init: RequestInit }[] = [];
  vi.stubGlobal(
    "fetch",
    vi.fn(async (url: string, init: RequestInit) => {
      calls.push({ url, init });
      return handler(url, init);
    }),
  );
  return calls;
}

const header = (init: RequestInit, name: string) => (init.headers as Record<string, string>)[name];
const answer = z.object({ ok: z.boolean() });

beforeEach(() => setAccessToken("token-1"));
afterEach(() => {
  vi.unstubAllGlobals();
  setAccessToken(null);
});

describe("apiRequest", () => {
  test.each([
    ["a day fast", 86_400_000],
    ["a day slow", -86_400_000],
  ])(
    "never reads the device clock for expiry: with it %s the token goes out as it is",
    async (_label, offset) => {
      vi.useFakeTimers({ toFake: ["Date"] });
      vi.setSystemTime(Date.now() + offset);
      try {
        const calls = stubFetch(() => json(200, { ok: true }));
        await apiRequest("/campaigns", { schema: answer });
        // One call, no renewal first: the server's clock alone decides when a token has expired.
        expect(calls.map((c) => c.url)).toEqual(["/api/campaigns"]);
        expect(header(calls[0]?.init ?? {}, "Authorization")).toBe("Bearer token-1");
      } finally {
        vi.useRealTimers();
      }
    },
  );

  test("sends the bearer token, the request header and same-origin credentials", async () => {
    const calls = stubFetch(() => json(200, { ok: true }));
    await expect(apiRequest("/campaigns", { schema: answer })).resolves.toEqual({ ok: true });
    const init = calls[0]?.init ?? {};
    expect(calls[0]?.url).toBe("/api/campaigns");
    expect(header(init, "Authorization")).toBe("Bearer token-1");
    expect(header(init, "x-equipot-request")).toBe("1");
    expect(init.credentials).toBe("same-origin");
  });

  test("refreshes once on 401 and repeats the call with the new token", async () => {
    const calls = stubFetch((url, init) => {
      if (url === "/api/auth/refresh") return json(200, session("token-2"));
      return header(init, "Authorization") === "Bearer token-2"
        ? json(200, { ok: true })
        : json(401, { error: { code: "unauthenticated", message: "Token expired" } });
    });
    await expect(apiRequest("/campaigns", { schema: answer })).resolves.toEqual({ ok: true });
    expect(calls.map((c) => c.url)).toEqual([
      "/api/campaigns",
      "/api/auth/refresh",
      "/api/campaigns",
    ]);
  });

  test("a 401 after the refresh is not retried again", async () => {
    const calls = stubFetch((url) =>
      url === "/api/auth/refresh"
        ? json(200, session("token-2"))
        : json(401, { error: { code: "unauthenticated", message: "No" } }),
    );
    await expect(apiRequest("/campaigns", { schema: answer })).rejects.toMatchObject({
      status: 401,
      code: "unauthenticated",
    });
    expect(calls).toHaveLength(3);
  });

  test("concurrent calls that hit 401 share one refresh", async () => {
    const calls = stubFetch((url, init) => {
      if (url === "/api/auth/refresh") return json(200, session("token-2"));
      return header(init, "Authorization") === "Bearer token-2"
        ? json(200, { ok: true })
        : json(401, { error: { code: "unauthenticated", message: "Token expired" } });
    });
    await Promise.all([
      apiRequest("/a", { schema: answer }),
      apiRequest("/b", { schema: answer }),
      apiRequest("/c", { schema: answer }),
    ]);
    expect(calls.filter((c) => c.url === "/api/auth/refresh")).toHaveLength(1);
  });

  test("turns the error body into an ApiError with its details", async () => {
    stubFetch(() =>
      json(400, {
        error: {
          code: "validation_failed",
          message: "Some values were refused",
          details: [{ path: "latitudeDeg", message: "Latitude must be between −90° and 90°" }],
        },
      }),
    );
    const error: unknown = await apiRequest("/x", {
      method: "POST",
      body: {},
      schema: answer,
    }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 400,
      code: "validation_failed",
      message: "Some values were refused",
      details: [{ path: "latitudeDeg", message: "Latitude must be between −90° and 90°" }],
    });
  });

  test("a refused file carries its rows, by row or by line, and reads as a refusal", async () => {
    stubFetch(() =>
      json(422, {
        error: {
          code: "invalid_file",
          message: "2 rows were refused; nothing was stored",
          rows: [
            { row: 3, field: "latitude_deg", message: "Latitude must be a number" },
            { line: 7, field: "value", message: "Value is not a number" },
          ],
        },
      }),
    );
    const error: unknown = await apiRequest("/import", {
      method: "POST",
      body: {},
      schema: answer,
    }).catch((e: unknown) => e);
    expect(refusedFileOf(error)).toEqual({
      message: "2 rows were refused; nothing was stored",
      rows: [
        { row: 3, field: "latitude_deg", message: "Latitude must be a number" },
        { row: 7, field: "value", message: "Value is not a number" },
      ],
    });
  });

  test("other failures are not file refusals", () => {
    expect(refusedFileOf(new ApiError(422, "validation_failed", "No"))).toBeNull();
    expect(refusedFileOf(new Error("x"))).toBeNull();
  });

  test("an error without the usual body still becomes a typed ApiError", async () => {
    stubFetch(() => new Response("<html>Bad gateway</html>", { status: 503 }));
    await expect(apiRequest("/x", { schema: answer })).rejects.toMatchObject({
      status: 503,
      code: "unavailable",
    });
  });

  test("no network gives code 'network' and status 0", async () => {
    stubFetch(() => {
      throw new TypeError("Failed to fetch");
    });
    await expect(apiRequest("/x", { schema: answer })).rejects.toMatchObject({
      status: 0,
      code: "network",
      isNetwork: true,
    });
  });

  test("a 204 answer parses as no content; a body of the wrong shape is refused", async () => {
    stubFetch((url) =>
      url === "/api/gone" ? new Response(null, { status: 204 }) : json(200, { no: 1 }),
    );
    await expect(
      apiRequest("/gone", { method: "DELETE", schema: noContent }),
    ).resolves.toBeUndefined();
    await expect(apiRequest("/odd", { schema: answer })).rejects.toMatchObject({
      code: "bad_response",
    });
  });

  test("without a token it refreshes first; a refused refresh reports the session expired", async () => {
    setAccessToken(null);
    const events: SessionEvent[] = [];
    const stop = onSessionEvent((event) => events.push(event));
    stubFetch(() => json(401, { error: { code: "unauthenticated", message: "No session" } }));
    await expect(apiRequest("/campaigns", { schema: answer })).rejects.toMatchObject({
      status: 401,
    });
    expect(events).toEqual([{ type: "expired" }]);
    stop();
  });

  test("a refresh answer announces the new session", async () => {
    const events: SessionEvent[] = [];
    const stop = onSessionEvent((event) => events.push(event));
    stubFetch(() => json(200, session("token-9")));
    await refreshSession();
    expect(events).toEqual([{ type: "refreshed", session: session("token-9") }]);
    stop();
  });
});
