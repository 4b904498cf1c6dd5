import { Router, type CookieOptions, type Response } from "express";
import { refreshCookieName, signInInput } from "../../../shared/schemas/auth";
import { unauthenticated } from "../../http-errors";
import { authenticate, requireAuth } from "../../middleware/authenticate";
import { sameOriginOnly } from "../../middleware/same-origin";
import { parseInput } from "../../middleware/validate";
import {
  describeUser,
  refresh,
  signIn,
  signOut,
  type AuthDeps,
  type IssuedSession,
} from "../../services/auth.service";

export interface AuthRouterDeps extends AuthDeps {
  secureCookies: boolean;
}

export function refreshCookieOptions(deps: AuthRouterDeps): CookieOptions {
  return {
    httpOnly: true,
    sameSite: "strict",
    secure: deps.secureCookies,
    path: "/api/auth",
    maxAge: deps.refreshTtlS * 1000,
  };
}

export function sendSession(
  res: Response,
  deps: AuthRouterDeps,
  issued: IssuedSession,
  status = 200,
) {
  res.cookie(refreshCookieName, issued.refreshToken, refreshCookieOptions(deps));
  res.setHeader("Cache-Control", "no-store");
  res.status(status).json(issued.session);
}

function cookieToken(cookies: unknown): string | undefined {
  const value = (cookies as Record<string, unknown> | undefined)?.[refreshCookieName];
  return typeof value === "string" && value.length > 0 ? value : undefined;
}

export function authRouter(deps: AuthRouterDeps): Router {
  const router = Router();
  const clearCookie = (res: Response) => {
    const { maxAge: _maxAge, ...options } = refreshCookieOptions(deps);
    res.clearCookie(refreshCookieName, options);
  };

  router.post("/sign-in", sameOriginOnly(), async (req, res) => {
    const input = parseInput(signInInput, req.body);
    sendSession(res, deps, await signIn(deps, input.email, input.password, req.ip ?? "unknown"));
  });

  router.post("/refresh", sameOriginOnly(), async (req, res) => {
    const token = cookieToken(req.cookies);
    if (!token) throw unauthenticated("Your session has ended. Sign in again.");
    try {
      sendSession(res, deps, await refresh(deps, token));
    } catch (error) {
      clearCookie(res);
      throw error;
    }
  });

  router.post("/sign-out", sameOriginOnly(), async (req, res) => {
    const token = cookieToken(req.cookies);
    if (token) await signOut(deps, token);
    clearCookie(res);
    res.status(204).end();
  });

  router.get("/me", authenticate(deps.tokens), async (req, res) => {
    res.json(await describeUser(deps.db, requireAuth(req).userId));
  });
  return router;
}
