// The real server for the client benchmark: the whole app (API and the built PWA from `staticDir`)
// on loopback, on a freshly migrated and demo-seeded database. The cluster is its own
// (.equipot/pg-bench-client): the other benchmarks' cluster is stopped by whichever starts next, so
// sharing it would let a benchmark run beside this one pull the database away mid-run. Nothing here
// times the database, so fsync is off.
import { randomBytes } from "node:crypto";
import pg from "pg";
import { startCluster, stopCluster } from "../../scripts/lib/postgres";
import { ensureAppRole, urlAs } from "../../server/db/app-role";
import { applyMigrations, connect } from "../../server/db/client";
import { startServer } from "../../server/index";
import { seedDemo } from "../../server/seed/demo";
import { testConfig } from "../../tests/helpers/config";
import { freePort } from "../sync/postgres";

export interface ClientServer {
  baseUrl: string;
  databaseUrl: string;
  stop: () => Promise<void>;
}

const dataDir = ".equipot/pg-bench-client";
const databaseName = "equipot_bench_client";
const appRole = "equipot_bench_app";

async function freshDatabase(adminUrl: string): Promise<void> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`drop database if exists ${databaseName} with (force)`);
    await client.query(`create database ${databaseName}`);
  } finally {
    await client.end();
  }
}

export async function startClientServer(staticDir: string): Promise<ClientServer> {
  // A run that was killed leaves its cluster up on another port: stop it, then start on ours.
  stopCluster(dataDir);
  const cluster = startCluster({ dataDir, port: await freePort(), durable: false, log: () => {} });
  try {
    await freshDatabase(cluster.adminUrl("postgres"));
    const databaseUrl = cluster.adminUrl(databaseName);
    const password = randomBytes(18).toString("base64url");
    await ensureAppRole(cluster.adminUrl("postgres"), appRole, password);
    await applyMigrations(databaseUrl, appRole);
    const seeded = connect(databaseUrl, 1);
    await seedDemo(seeded.db, "test").finally(() => seeded.close());
    const running = await startServer(
      testConfig({
        DATABASE_URL: urlAs(databaseUrl, appRole, password),
        STATIC_DIR: staticDir,
        DEMO: "true",
        // Long enough that no token refresh falls inside a measured reload.
        ACCESS_TOKEN_TTL_S: "3600",
      }),
    );
    return {
      baseUrl: running.url,
      databaseUrl,
      stop: async () => {
        await running.close();
        cluster.stop();
      },
    };
  } catch (error) {
    cluster.stop();
    throw error;
  }
}
