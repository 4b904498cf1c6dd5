// The one API client. Adds the bearer access token (kept in memory only), refreshes it once on a
// 401 through the httpOnly refresh cookie, and turns every failure into a typed ApiError.
import { z } from "zod";
import { errorBody, requestHeader, sessionView, type SessionView } from "../../shared/schemas";
import { env } from "../config/env";
import { ApiError, type ApiErrorCode } from "./api-error";
import { reportReachable } from "./connectivity";
import { withWebLock } from "./web-lock";

type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";

export interface RequestOptions<S extends z.ZodType> {
  method?: Method;
  body?: unknown;
  /** Parses the response body; use `noContent` for 204 answers. */
  schema: S;
  /** Send the access token (and refresh it when missing or expired). Default true. */
  auth?: boolean;
  signal?: AbortSignal;
}

export type SessionEvent = { type: "refreshed"; session: SessionView } | { type: "expired" };

/** For 204 answers: the body must be empty. */
export const noContent = z.undefined();

let accessToken: string | null = null;
let refreshInFlight: Promise<SessionView> | null = null;
const sessionListeners = new Set<(event: SessionEvent) => void>();

export function setAccessToken(token: string | null): void {
  accessToken = token;
}

export function onSessionEvent(listener: (event: SessionEvent) => void): () => void {
  sessionListeners.add(listener);
  return () => sessionListeners.delete(listener);
}

function emit(event: SessionEvent): void {
  for (const listener of sessionListeners) listener(event);
}

async function send(
  path: string,
  method: Method,
  body: unknown,
  token: string | null,
  signal?: AbortSignal,
): Promise<Response> {
  const headers: Record<string, string> = {
    Accept: "application/json",
    // Every call sends it: the server refuses cookie-carrying calls without it.
    [requestHeader.name]: requestHeader.value,
  };
  if (body !== undefined) headers["Content-Type"] = "application/json";
  if (token !== null) headers.Authorization = `Bearer ${token}`;
  return reachServer(path, {
    method,
    headers,
    body: body === undefined ? undefined : JSON.stringify(body),
    cache: "no-store",
    signal,
  });
}

const fallbackCodes: Record<number, ApiErrorCode> = {
  400: "bad_request",
  401: "unauthenticated",
  403: "forbidden",
  404: "not_found",
  409: "conflict",
  413: "payload_too_large",
  429: "too_many_requests",
  503: "unavailable",
};

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === "") return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

/** The server's error body (or, without one, its status) as an ApiError. */
export function apiErrorFrom(status: number, body: unknown): ApiError {
  const parsed = errorBody.safeParse(body);
  if (parsed.success) {
    const { code, message, details, rows } = parsed.data.error;
    return new ApiError(status, code, message, details ?? [], rows ?? []);
  }
  const code = fallbackCodes[status] ?? "internal";
  return new ApiError(status, code, `The server answered with status ${status}.`);
}

async function toApiError(response: Response): Promise<ApiError> {
  return apiErrorFrom(response.status, await readJson(response));
}

/**
 * For calls that do not speak JSON (file bytes): runs `attempt` with the headers every call needs,
 * the access token among them, and once more after a refresh when the answer is 401.
 */
export async function withAccessToken<T extends { status: number }>(
  attempt: (headers: Record<string, string>) => Promise<T>,
): Promise<T> {
  const headers = () => ({
    [requestHeader.name]: requestHeader.value,
    ...(accessToken === null ? {} : { Authorization: `Bearer ${accessToken}` }),
  });
  if (accessToken === null) await refreshSession();
  const first = await attempt(headers());
  if (first.status !== 401) return first;
  await refreshSession();
  return attempt(headers());
}

/** fetch() with the connectivity report and network failures as ApiError. */
export async function reachServer(path: string, init: RequestInit): Promise<Response> {
  try {
    const response = await fetch(`${env.apiBase}${path}`, { credentials: "same-origin", ...init });
    reportReachable(true);
    return response;
  } catch (cause) {
    if (init.signal?.aborted) throw cause;
    reportReachable(false);
    throw ApiError.network(cause);
  }
}

async function parseBody<S extends z.ZodType>(response: Response, schema: S): Promise<z.output<S>> {
  const result = schema.safeParse(await readJson(response));
  if (result.success) return result.data;
  throw new ApiError(response.status, "bad_response", "The server's answer was not understood.");
}

/**
 * Exchanges the refresh cookie for a new access token. Concurrent callers share one request, and
 * tabs take turns (Web Locks): the server rotates the cookie strictly and treats a second use of
 * the old one as theft, so two tabs refreshing at once would end the session everywhere.
 */
export function refreshSession(): Promise<SessionView> {
  refreshInFlight ??= (async () => {
    try {
      const response = await withWebLock("equipot-refresh", () =>
        send("/auth/refresh", "POST", undefined, null),
      );
      if (!response.ok) {
        const error = await toApiError(response);
        if (response.status === 401) {
          accessToken = null;
          emit({ type: "expired" });
        }
        throw error;
      }
      const session = await parseBody(response, sessionView);
      accessToken = session.accessToken;
      emit({ type: "refreshed", session });
      return session;
    } finally {
      refreshInFlight = null;
    }
  })();
  return refreshInFlight;
}

export async function apiRequest<S extends z.ZodType>(
  path: string,
  options: RequestOptions<S>,
): Promise<z.output<S>> {
  const { method = "GET", body, schema, auth = true, signal } = options;
  if (auth && accessToken === null) await refreshSession();
  let response = await send(path, method, body, auth ? accessToken : null, signal);
  if (auth && response.status === 401) {
    // The access token expired (15 minutes): refresh once, then try once more.
    await refreshSession();
    response = await send(path, method, body, accessToken, signal);
  }
  if (!response.ok) throw await toApiError(response);
  return parseBody(response, schema);
}
