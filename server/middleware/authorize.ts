// Campaign scope comes from the caller's membership, never from the request body.
import type { Request, RequestHandler } from "express";
import { z } from "zod";
import { can, type Action, type Role } from "../../shared/permissions";
import type { Db } from "../db/client";
import { inScope } from "../db/scope";
import { findMembership } from "../db/repositories/users";
import { forbidden, notFound } from "../http-errors";
import { requireAuth } from "./authenticate";

const campaignIdParam = z.uuid();

/** Loads the caller's membership of :campaignId; non-members get 404 so nothing of the campaign leaks. */
export function campaignMember(db: Db): RequestHandler & { readonly campaignScope: true } {
  const member: RequestHandler = async (req, _res, next) => {
    const { userId } = requireAuth(req);
    const parsed = campaignIdParam.safeParse(req.params.campaignId);
    const membership = parsed.success ? await findMembership(db, userId, parsed.data) : undefined;
    if (!parsed.success || !membership) throw notFound("Campaign not found");
    req.membership = { campaignId: parsed.data, role: membership.role };
    // Row-level security: this campaign only, from here to the response.
    inScope({ user: userId, campaigns: [parsed.data] }, next);
  };
  return Object.assign(member, { campaignScope: true as const });
}

/** The handler names its action, so the route table can be read off the app (access tests). */
export type ActionGuard = RequestHandler & { readonly action: Action };

export function requireAction(action: Action): ActionGuard {
  const guard: RequestHandler = (req, _res, next) => {
    if (!can(req.membership?.role, action)) throw forbidden();
    next();
  };
  return Object.assign(guard, { action });
}

export function scope(req: Request): { campaignId: string; role: Role; userId: string } {
  const { userId } = requireAuth(req);
  if (!req.membership) throw notFound("Campaign not found");
  return { ...req.membership, userId };
}
