// Campaign scope comes from the caller's membership, never from the request body.
import type { Request, RequestHandler } from "express";
import { z } from "zod";
import { can, type Action, type Role } from "../../shared/permissions";
import type { Db } from "../db/client";
import { inScope, withScope } from "../db/scope";
import { findMembership } from "../db/repositories/users";
import { forbidden, notFound } from "../http-errors";
import { requireAuth } from "./authenticate";

const campaignIdParam = z.uuid();

/** Loads the caller's membership of :campaignId; non-members get 404 so nothing of the campaign leaks. */
export function campaignMember(db: Db): RequestHandler & { readonly campaignScope: true } {
  const member: RequestHandler = async (req, _res, next) => {
    const { userId } = requireAuth(req);
    const parsed = campaignIdParam.safeParse(req.params.campaignId);
    if (!parsed.success) throw notFound("Campaign not found");
    // Row-level security: this campaign only, from the check to the response. The check runs in
    // the same scope as the handler, so a pooled connection needs its setting changed only when
    // the person or campaign changes; one's own membership row is readable in it.
    const scope = { user: userId, campaigns: [parsed.data] };
    const membership = await withScope(scope, () => findMembership(db, userId, parsed.data));
    if (!membership) throw notFound("Campaign not found");
    req.membership = { campaignId: parsed.data, role: membership.role };
    inScope(scope, next);
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
