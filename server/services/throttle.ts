// Sign-in throttling per account and per client address, checked before any password hashing.
// Kept in PostgreSQL so that several server instances agree.
import type { Queryable } from "../db/client";
import { clearThrottle, findThrottles, recordFailure } from "../db/repositories/throttle";
import { tooManyRequests } from "../http-errors";

const windowS = 15 * 60;
const accountFreeFailures = 5;
const addressFreeFailures = 50;
const maxBlockS = 15 * 60;

const accountKey = (email: string) => `account:${email.toLowerCase()}`;
const addressKey = (address: string) => `address:${address}`;

// After the free attempts, each failure doubles the wait: 1 s, 2 s, 4 s … up to 15 min.
const accountBlock = (failures: number) =>
  failures < accountFreeFailures ? 0 : Math.min(maxBlockS, 2 ** (failures - accountFreeFailures));
const addressBlock = (failures: number) => (failures < addressFreeFailures ? 0 : 5 * 60);

export async function assertNotThrottled(
  q: Queryable,
  email: string,
  address: string,
): Promise<void> {
  const rows = await findThrottles(q, [accountKey(email), addressKey(address)]);
  const now = Date.now();
  const waitMs = Math.max(
    0,
    ...rows.map((r) => (r.blockedUntil ? r.blockedUntil.getTime() - now : 0)),
  );
  if (waitMs > 0) throw tooManyRequests(Math.ceil(waitMs / 1000));
}

export async function recordSignInFailure(
  q: Queryable,
  email: string,
  address: string,
): Promise<void> {
  await recordFailure(q, accountKey(email), windowS, accountBlock);
  await recordFailure(q, addressKey(address), windowS, addressBlock);
}

export const recordSignInSuccess = (q: Queryable, email: string) =>
  clearThrottle(q, accountKey(email));
