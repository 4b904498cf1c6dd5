// Each test file gets its own database, cloned from the migrated template: fresh, never the demo data.
import { randomBytes } from "node:crypto";
import pg from "pg";
import { inject } from "vitest";
import { urlAs } from "../../server/db/app-role";
import { connect, type Database } from "../../server/db/client";
import { templateDatabase, withDatabase } from "./admin-url";

/** `db` and `ownerUrl` are the superuser's, for fixtures; `url` is what a server connects with. */
export interface TestDatabase extends Database {
  url: string;
  ownerUrl: string;
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
  const ownerUrl = withDatabase(inject("pgAdminUrl"), name);
  const role = inject("pgAppRole");
  const database = connect(ownerUrl);
  return {
    ...database,
    url: urlAs(ownerUrl, role.name, role.password),
    ownerUrl,
    drop: async () => {
      await database.close();
      await admin((c) => c.query(`drop database if exists ${name} with (force)`));
    },
  };
}
