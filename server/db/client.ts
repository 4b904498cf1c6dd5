import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import pg from "pg";
import { fileURLToPath } from "node:url";
import * as schema from "./schema";
import { grantAppRole } from "./app-role";
import { ScopedPool } from "./scoped-pool";

/** The pool is reachable for the few statements drizzle does not build (change-feed.ts). */
export type Db = NodePgDatabase<typeof schema> & { $client: pg.Pool };
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
export type Queryable = Db | Tx;

export interface Database {
  db: Db;
  pool: pg.Pool;
  close: () => Promise<void>;
}

export function connect(url: string, max = 10): Database {
  const pool = new ScopedPool({ connectionString: url, max, idleTimeoutMillis: 30_000 });
  // A dropped idle connection must not crash the process; the pool replaces it.
  pool.on("error", () => undefined);
  // Nor one dropped while checked out (a transaction's): the running query fails with the error,
  // and without a listener the client's own 'error' event would be an uncaught exception.
  pool.on("connect", (client) => client.on("error", () => undefined));
  const db = drizzle(pool, { schema });
  return { db, pool, close: () => pool.end() };
}

export const migrationsFolder = fileURLToPath(new URL("../../drizzle", import.meta.url));

/** Migrates as the tables' owner (`ownerUrl`), then grants the application's role its rights. */
export async function applyMigrations(ownerUrl: string, appRole?: string): Promise<void> {
  const database = connect(ownerUrl, 1);
  try {
    await migrate(database.db, { migrationsFolder });
  } finally {
    await database.close();
  }
  if (appRole) await grantAppRole(ownerUrl, appRole);
}
