// One closed set of typed HTTP errors; the error middleware turns them into the one error body.
import type { ErrorCode, FieldIssue } from "../shared/schemas/errors";

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly details?: FieldIssue[],
    readonly headers?: Record<string, string>,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, details?: FieldIssue[]) =>
  new HttpError(400, "bad_request", message, details);
export const validationFailed = (details: FieldIssue[]) => {
  const first = details[0];
  const message = first ? `${first.path || "body"}: ${first.message}` : "The request is invalid";
  return new HttpError(400, "validation_failed", message, details);
};
export const unauthenticated = (message = "Sign in to continue") =>
  new HttpError(401, "unauthenticated", message);
export const forbidden = (message = "Your role in this campaign does not allow this") =>
  new HttpError(403, "forbidden", message);
export const notFound = (message = "Not found") => new HttpError(404, "not_found", message);
export const conflict = (message: string, details?: FieldIssue[]) =>
  new HttpError(409, "conflict", message, details);
export const tooManyRequests = (retryAfterS: number) =>
  new HttpError(
    429,
    "too_many_requests",
    `Too many attempts. Try again in ${retryAfterS} s.`,
    undefined,
    {
      "Retry-After": String(retryAfterS),
    },
  );
export const unavailable = (message: string) => new HttpError(503, "unavailable", message);
