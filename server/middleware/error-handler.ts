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

export const apiNotFound: RequestHandler = (_req, _res, next) =>
  next(notFound("No such API route"));

/** Registered last. Unknown errors are logged and answered 500 without internals. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const known = err instanceof HttpError ? err : fromBodyParser(err);
  if (!known) req.log?.error({ err }, "unhandled error");
  const error = known ?? new HttpError(500, "internal", "Something went wrong on the server");
  for (const [name, value] of Object.entries(error.headers ?? {})) res.setHeader(name, value);
  const body: ErrorBody = { error: { code: error.code, message: error.message } };
  if (error.details) body.error.details = error.details;
  res.status(error.status).json(body);
};
