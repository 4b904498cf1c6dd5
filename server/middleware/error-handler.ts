import type { ErrorRequestHandler, RequestHandler } from "express";
import type { ErrorBody } from "../../shared/schemas/errors";
import { HttpError, notFound } from "../http-errors";

interface BodyParserError {
  type?: string;
  status?: number;
}

function fromBodyParser(err: unknown): HttpError | undefined {
  const e = err as BodyParserError;
  if (e?.type === "entity.too.large")
    return new HttpError(413, "payload_too_large", "The request body is too large");
  if (e?.type === "entity.parse.failed")
    return new HttpError(400, "bad_request", "The request body is not valid JSON");
  if (e?.type === "encoding.unsupported" || e?.type === "charset.unsupported") {
    return new HttpError(
      415 as number,
      "bad_request",
      "The request body encoding is not supported",
    );
  }
  return undefined;
}

// PostgreSQL going away (restart, failover, network): the request may be retried as it is.
// Class 08 is connection exceptions, 57P01–57P03 shutdown and start-up (PostgreSQL's SQLSTATE list).
const unreachable = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "EPIPE",
  "ETIMEDOUT",
  "57P01",
  "57P02",
  "57P03",
]);

function lostConnection(err: unknown): boolean {
  // drizzle wraps the driver's error as its cause; look a few levels down.
  for (
    let e = err as { code?: unknown; message?: unknown; cause?: unknown } | undefined, depth = 0;
    e && depth < 4;
    e = e.cause as typeof e, depth++
  ) {
    const code = typeof e.code === "string" ? e.code : "";
    if (unreachable.has(code) || code.startsWith("08")) return true;
    if (typeof e.message === "string" && /Connection terminated|not queryable/i.test(e.message))
      return true;
  }
  return false;
}

/** The driver's SQLSTATE, under drizzle's wrapping. */
function sqlState(err: unknown): string | undefined {
  const cause = (err as { cause?: { code?: unknown } } | undefined)?.cause;
  const code = (err as { code?: unknown } | undefined)?.code ?? cause?.code;
  return typeof code === "string" ? code : undefined;
}

/**
 * Row-level security refused a row the application's own checks let through: answered as a
 * missing record, so nothing of another campaign shows, and logged as the bug it is.
 */
export const rowSecurityRefused = (err: unknown) => sqlState(err) === "42501";

/** A deadlock or serialisation failure rolled the transaction back whole: it may simply be sent again. */
const mayRetry = (err: unknown) => ["40P01", "40001"].includes(sqlState(err) ?? "");

function fromDatabase(err: unknown): HttpError | undefined {
  if (rowSecurityRefused(err)) return notFound("Not found");
  if (mayRetry(err))
    return new HttpError(
      503,
      "unavailable",
      "The server was busy with another change to this campaign; nothing was saved, try again",
      undefined,
      { "Retry-After": "1" },
    );
  if (!lostConnection(err)) return undefined;
  return new HttpError(
    503,
    "unavailable",
    "The database cannot be reached just now; try again shortly",
    undefined,
    { "Retry-After": "5" },
  );
}

export const apiNotFound: RequestHandler = (_req, _res, next) =>
  next(notFound("No such API route"));

/** Registered last. Unknown errors are logged and answered 500 without internals. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const known = err instanceof HttpError ? err : (fromBodyParser(err) ?? fromDatabase(err));
  if (!known) req.log?.error({ err }, "unhandled error");
  else if (rowSecurityRefused(err))
    req.log?.error({ err }, "row-level security refused a statement");
  else if (mayRetry(err)) req.log?.warn({ err }, "transaction rolled back, may be retried");
  else if (known.status === 503) req.log?.warn({ err }, "database unreachable");
  const error = known ?? new HttpError(500, "internal", "Something went wrong on the server");
  for (const [name, value] of Object.entries(error.headers ?? {})) res.setHeader(name, value);
  const body: ErrorBody = { error: { code: error.code, message: error.message } };
  if (error.details) body.error.details = error.details;
  res.status(error.status).json(body);
};
