// Each test file gets its own database, cloned from the migrated template: fresh, never the demo data.
import { randomBytes } from "node:crypto";
import pg from "pg";
import { inject } from "vitest";
import { connect, type Database } from "../../server/db/client";
import { templateDatabase, withDatabase } from "./admin-url";

export interface TestDatabase extends Database {
  url: string;
  drop: () => Promise<void>;
}

async function admin<T>(run: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: inject("pgAdminUrl") });
  await client.connect();
  try {
    return await run(client);
  } finally {
    await client.end();
  }
}

export async function createTestDatabase(): Promise<TestDatabase> {
  const name = `equipot_t_${randomBytes(6).toString("hex")}`;
  await admin((c) => c.query(`create database ${name} template ${templateDatabase}`));
  const url = withDatabase(inject("pgAdminUrl"), name);
  const database = connect(url);
  return {
    ...database,
    url,
    drop: async () => {
      await database.close();
      await admin((c) => c.query(`drop database if exists ${name} with (force)`));
    },
  };
}
