// A pg pool that hands out each connection with the current row-level-security scope set on it.
// The setting is session-wide and compared on every checkout (and the pool's own query() checks
// out too), so each statement or transaction runs with its caller's scope, whatever ran before.
import { sql } from "drizzle-orm";
import pg from "pg";
import type { Tx } from "./client";
import { currentScope, scopeSettings, type Scope } from "./scope";

const setScope =
  "select set_config('equipot.campaigns', $1, false), set_config('equipot.user', $2, false)";

type Callback = (
  err: Error | undefined,
  client: pg.PoolClient | undefined,
  done: (release?: boolean | Error) => void,
) => void;

export class ScopedPool extends pg.Pool {
  /** What each connection was last set to, so an unchanged scope costs no round trip. */
  private readonly applied = new WeakMap<pg.PoolClient, string>();

  override connect(): Promise<pg.PoolClient>;
  override connect(callback: Callback): void;
  override connect(callback?: Callback): Promise<pg.PoolClient> | void {
    // Read now: the caller's async context, not the one the pool resolves in.
    const wanted = scopeSettings(currentScope());
    const ready = super.connect().then(async (client) => {
      const key = `${wanted.campaigns}|${wanted.user}`;
      if (this.applied.get(client) === key) return client;
      try {
        await client.query(setScope, [wanted.campaigns, wanted.user]);
      } catch (error) {
        client.release(error instanceof Error ? error : true);
        throw error;
      }
      this.applied.set(client, key);
      return client;
    });
    if (!callback) return ready;
    ready.then(
      (client) => callback(undefined, client, client.release),
      (error: unknown) => callback(error as Error, undefined, () => undefined),
    );
  }
}

/**
 * Narrows or widens the scope for the rest of a transaction that is already running (the person is
 * known only after its first statements); at its end the connection's own scope is back.
 */
export async function scopeTransaction(tx: Tx, scope: Scope): Promise<void> {
  const { campaigns, user } = scopeSettings(scope);
  await tx.execute(
    sql`select set_config('equipot.campaigns', ${campaigns}, true), set_config('equipot.user', ${user}, true)`,
  );
}
