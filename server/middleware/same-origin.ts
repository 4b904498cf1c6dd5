// Cookie-carrying endpoints refuse cross-site requests: a custom header (which a cross-site form
// cannot send) plus Fetch-Metadata and Origin checks where the browser provides them.
import type { RequestHandler } from "express";
import { requestHeader } from "../../shared/schemas/auth";
import { forbidden } from "../http-errors";

function hostOf(origin: string): string | undefined {
  try {
    return new URL(origin).host;
  } catch {
    return undefined;
  }
}

export function sameOriginOnly(): RequestHandler {
  return (req, _res, next) => {
    if (req.get(requestHeader.name) !== requestHeader.value) {
      throw forbidden(`This request must carry the ${requestHeader.name} header`);
    }
    const site = req.get("sec-fetch-site");
    if (site && site !== "same-origin" && site !== "none")
      throw forbidden("Cross-site requests are refused");
    const origin = req.get("origin");
    if (origin && hostOf(origin) !== req.get("host"))
      throw forbidden("Cross-site requests are refused");
    next();
  };
}
