// Global setup for the whole test run: one PostgreSQL cluster (or DATABASE_URL's server) and a
// migrated template database from which each test file clones its own fresh database.
import type { TestProject } from "vitest/node";
import pg from "pg";
import { join } from "node:path";
import { startCluster, type Cluster } from "../../scripts/lib/postgres";
import { applyMigrations } from "../../server/db/client";
import { templateDatabase, withDatabase } from "../helpers/admin-url";

declare module "vitest" {
  export interface ProvidedContext {
    pgAdminUrl: string;
  }
}

let cluster: Cluster | undefined;

function adminUrlFromEnv(): string | undefined {
  const url = process.env.DATABASE_URL;
  return url ? withDatabase(url, "postgres") : undefined;
}

export default async function setup(project: TestProject): Promise<() => void> {
  let adminUrl = adminUrlFromEnv();
  if (!adminUrl) {
    const port = Number(process.env.EQUIPOT_TEST_PG_PORT ?? 54331);
    cluster = startCluster({
      dataDir: join(process.cwd(), ".equipot", "pg-test"),
      port,
      durable: false,
    });
    adminUrl = cluster.adminUrl("postgres");
  }
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  await client.query(`drop database if exists ${templateDatabase} with (force)`);
  await client.query(`create database ${templateDatabase}`);
  await client.end();
  await applyMigrations(withDatabase(adminUrl, templateDatabase));
  project.provide("pgAdminUrl", adminUrl);
  return () => {
    if (cluster?.startedHere) cluster.stop();
  };
}
