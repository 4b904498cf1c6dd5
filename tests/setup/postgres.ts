// Global setup for the whole test run: one PostgreSQL cluster (or DATABASE_URL's server) and a
// migrated template database from which each test file clones its own fresh database.
import type { TestProject } from "vitest/node";
import pg from "pg";
import { existsSync, readdirSync, rmSync } from "node:fs";
import { createServer } from "node:net";
import { join } from "node:path";
import { startCluster, stopCluster, type Cluster } from "../../scripts/lib/postgres";
import { randomBytes } from "node:crypto";
import { ensureAppRole } from "../../server/db/app-role";
import { applyMigrations } from "../../server/db/client";
import { templateDatabase, withDatabase } from "../helpers/admin-url";

declare module "vitest" {
  export interface ProvidedContext {
    pgAdminUrl: string;
    /** The application's role (no superuser, no BYPASSRLS, owns nothing) and its password. */
    pgAppRole: { name: string; password: string };
  }
}

let cluster: Cluster | undefined;

// Each run gets its own throw-away cluster on a free port, so runs side by side never share state.
const freePort = () =>
  new Promise<number>((resolve, reject) => {
    const server = createServer()
      .once("error", reject)
      .listen(0, "127.0.0.1", () => {
        const address = server.address();
        const port = typeof address === "object" && address ? address.port : 0;
        server.close(() => resolve(port));
      });
  });

const runsDir = join(process.cwd(), ".equipot", "pg-test");

const isAlive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

/** A run that was killed leaves its cluster behind: stop and remove those of dead runs. */
function removeStaleRuns(): void {
  if (!existsSync(runsDir)) return;
  for (const entry of readdirSync(runsDir)) {
    const pid = Number(/^run-(\d+)$/.exec(entry)?.[1]);
    if (!pid || isAlive(pid)) continue;
    const dataDir = join(runsDir, entry);
    stopCluster(dataDir);
    rmSync(dataDir, { recursive: true, force: true });
    rmSync(`${dataDir}.password`, { force: true });
  }
}

function adminUrlFromEnv(): string | undefined {
  const url = process.env.DATABASE_URL;
  return url ? withDatabase(url, "postgres") : undefined;
}

export default async function setup(project: TestProject): Promise<() => void> {
  let adminUrl = adminUrlFromEnv();
  if (!adminUrl) {
    removeStaleRuns();
    const port = await freePort();
    const dataDir = join(runsDir, `run-${process.pid}`);
    cluster = startCluster({ dataDir, port, durable: false });
    adminUrl = cluster.adminUrl("postgres");
  }
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  await client.query(`drop database if exists ${templateDatabase} with (force)`);
  await client.query(`create database ${templateDatabase}`);
  await client.end();
  const appRole = { name: "equipot_test_app", password: randomBytes(18).toString("base64url") };
  await ensureAppRole(adminUrl, appRole.name, appRole.password);
  // Grants are copied with the template into every test database.
  await applyMigrations(withDatabase(adminUrl, templateDatabase), appRole.name);
  project.provide("pgAdminUrl", adminUrl);
  project.provide("pgAppRole", appRole);
  return () => {
    if (!cluster) return;
    cluster.stop();
    rmSync(cluster.dataDir, { recursive: true, force: true });
    rmSync(`${cluster.dataDir}.password`, { force: true });
  };
}
