// Sign-in, refresh-token rotation with reuse detection, and sign-out.
import { randomUUID } from "node:crypto";
import type { SessionView } from "../../shared/schemas/auth";
import type { Db, Queryable } from "../db/client";
import {
  findRefreshTokenForUpdate,
  insertRefreshToken,
  markRotated,
  revokeFamily,
} from "../db/repositories/refresh-tokens";
import { listCampaignsOfUser } from "../db/repositories/campaigns";
import { findUserByEmail, findUserById } from "../db/repositories/users";
import { withScope } from "../db/scope";
import { scopeTransaction } from "../db/scoped-pool";
import { unauthenticated } from "../http-errors";
import { verifyAgainstDummy, verifyPassword } from "./passwords";
import { assertNotThrottled, recordSignInFailure, recordSignInSuccess } from "./throttle";
import { hashOpaqueToken, newOpaqueToken, type TokenService } from "./tokens";

export const wrongCredentials = "E-mail or password is wrong";

export interface AuthDeps {
  db: Db;
  tokens: TokenService;
  refreshTtlS: number;
}

export interface IssuedSession {
  session: SessionView;
  refreshToken: string;
}

export async function describeUser(q: Queryable, userId: string) {
  const user = await findUserById(q, userId);
  if (!user) throw unauthenticated();
  const campaigns = await listCampaignsOfUser(q, userId);
  const memberships = campaigns.map((c) => ({
    campaignId: c.id,
    campaignName: c.name,
    role: c.role,
  }));
  return { user: { id: user.id, email: user.email, name: user.name }, memberships };
}

async function issue(
  deps: AuthDeps,
  q: Queryable,
  userId: string,
  familyId: string,
): Promise<IssuedSession> {
  const refreshToken = newOpaqueToken();
  const expiresAt = new Date(Date.now() + deps.refreshTtlS * 1000);
  await insertRefreshToken(q, {
    userId,
    familyId,
    tokenHash: hashOpaqueToken(refreshToken),
    expiresAt,
  });
  const accessToken = await deps.tokens.signAccess(userId);
  return { session: { accessToken, ...(await describeUser(q, userId)) }, refreshToken };
}

export async function signIn(deps: AuthDeps, email: string, password: string, address: string) {
  await assertNotThrottled(deps.db, email, address);
  const user = await findUserByEmail(deps.db, email);
  const ok =
    user?.passwordHash && !user.disabledAt
      ? await verifyPassword(user.passwordHash, password)
      : await verifyAgainstDummy(password);
  if (!ok || !user) {
    await recordSignInFailure(deps.db, email, address);
    throw unauthenticated(wrongCredentials);
  }
  await recordSignInSuccess(deps.db, email);
  return withScope({ user: user.id, campaigns: "none" }, () =>
    issue(deps, deps.db, user.id, randomUUID()),
  );
}

export const issueNewSession = (deps: AuthDeps, q: Queryable, userId: string) =>
  issue(deps, q, userId, randomUUID());

type RefreshOutcome = { kind: "ok"; issued: IssuedSession } | { kind: "refused" };

/** A token used a second time means it was stolen or replayed: the whole family is revoked. */
export async function refresh(deps: AuthDeps, refreshToken: string): Promise<IssuedSession> {
  const outcome = await deps.db.transaction(async (tx): Promise<RefreshOutcome> => {
    const row = await findRefreshTokenForUpdate(tx, hashOpaqueToken(refreshToken));
    if (!row || row.revokedAt) return { kind: "refused" };
    if (row.rotatedAt) {
      await revokeFamily(tx, row.familyId);
      return { kind: "refused" };
    }
    if (row.expiresAt.getTime() <= Date.now()) return { kind: "refused" };
    await markRotated(tx, row.id);
    await scopeTransaction(tx, { user: row.userId, campaigns: "none" });
    return { kind: "ok", issued: await issue(deps, tx, row.userId, row.familyId) };
  });
  if (outcome.kind === "refused") throw unauthenticated("Your session has ended. Sign in again.");
  return outcome.issued;
}

export async function signOut(deps: AuthDeps, refreshToken: string): Promise<void> {
  await deps.db.transaction(async (tx) => {
    const row = await findRefreshTokenForUpdate(tx, hashOpaqueToken(refreshToken));
    if (row) await revokeFamily(tx, row.familyId);
  });
}
