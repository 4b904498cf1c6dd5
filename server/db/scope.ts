// The row-level-security scope of the work in progress (see drizzle/0009_row_security.sql). It rides
// on AsyncLocalStorage from the request's middleware to the queries, and the pool (client.ts) sets it
// on the connection at every checkout, so each statement and transaction runs with its own scope and
// a connection never carries a scope from its previous user.
import { AsyncLocalStorage } from "node:async_hooks";

export type Scope =
  /** A signed-in person outside any campaign: their own memberships and campaigns only. */
  | { user: string; campaigns: "none" }
  /** These campaigns, each only while the person is a member of it. */
  | { user: string; campaigns: readonly string[] }
  /** Named system work (workers, campaign creation, invitations): the reason is for reading code. */
  | { system: string };

const storage = new AsyncLocalStorage<Scope>();

export const currentScope = (): Scope | undefined => storage.getStore();

/** Runs `run` (a middleware's next(), say) and all it starts in `scope`. */
export function inScope<T>(scope: Scope, run: () => T): T {
  return storage.run(scope, run);
}

/**
 * Database work in `scope`. It is awaited inside the scope: a drizzle query starts only when
 * awaited, so one returned unawaited from `run` would start outside it.
 */
export const withScope = <T>(scope: Scope, run: () => PromiseLike<T>): Promise<T> =>
  storage.run(scope, async () => await run());

/** Runs system work that spans campaigns, outside any person's scope. */
export const asSystem = <T>(reason: string, run: () => PromiseLike<T>): Promise<T> =>
  withScope({ system: reason }, run);

/** The two settings for a scope; no scope at all sees no campaign data. */
export function scopeSettings(scope: Scope | undefined): { campaigns: string; user: string } {
  if (!scope) return { campaigns: "none", user: "" };
  if ("system" in scope) return { campaigns: "all", user: "" };
  const campaigns =
    typeof scope.campaigns === "string" ? scope.campaigns : scope.campaigns.join(",");
  return { campaigns: campaigns || "none", user: scope.user };
}
