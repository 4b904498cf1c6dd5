import type { Request, RequestHandler } from "express";
import { inScope } from "../db/scope";
import { unauthenticated } from "../http-errors";
import type { TokenService } from "../services/tokens";

export function authenticate(tokens: TokenService): RequestHandler {
  return async (req, _res, next) => {
    const header = req.get("authorization") ?? "";
    const match = /^Bearer ([A-Za-z0-9._~+/=-]+)$/.exec(header);
    const claims = match?.[1] ? await tokens.verifyAccess(match[1]) : undefined;
    if (!claims) throw unauthenticated();
    req.auth = claims;
    // Row-level security: the person's own memberships until a campaign route narrows it.
    inScope({ user: claims.userId, campaigns: "none" }, next);
  };
}

export function requireAuth(req: Request): { userId: string } {
  if (!req.auth) throw unauthenticated();
  return req.auth;
}
