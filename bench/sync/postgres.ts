// The benchmark's own durable PostgreSQL cluster (fsync on, like production) on a free port, a
// migrated template with the demo accounts, and a fresh clone of it per round.
import { randomBytes } from "node:crypto";
import { createServer } from "node:net";
import pg from "pg";
import { startCluster, stopCluster, type Cluster } from "../../scripts/lib/postgres";
import { ensureAppRole, urlAs } from "../../server/db/app-role";
import { applyMigrations, connect } from "../../server/db/client";
import { seedDemo } from "../../server/seed/demo";

const template = "equipot_bench_template";
const appRole = "equipot_bench_app";
const appPassword = randomBytes(18).toString("base64url");

export interface BenchDatabase {
  /** As the application's role, under row-level security: what a server connects with. */
  url: string;
  /** As the owner (a superuser here): for seeding and checks. */
  ownerUrl: string;
  drop: () => Promise<void>;
}

export interface BenchPostgres {
  /** A new database cloned from the migrated, demo-seeded template. */
  fresh: () => Promise<BenchDatabase>;
  stop: () => void;
}

export const freePort = () =>
  new Promise<number>((resolve, reject) => {
    const server = createServer()
      .once("error", reject)
      .listen(0, "127.0.0.1", () => {
        const address = server.address();
        const port = typeof address === "object" && address ? address.port : 0;
        server.close(() => resolve(port));
      });
  });

function withDatabase(url: string, database: string): string {
  const parsed = new URL(url);
  parsed.pathname = `/${database}`;
  return parsed.toString();
}

async function admin(cluster: Cluster, sql: string): Promise<void> {
  const client = new pg.Client({ connectionString: cluster.adminUrl("postgres") });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

// Another folder (EQUIPOT_BENCH_PG_DIR) lets two benchmark runs share the machine without one
// stopping the other's cluster.
const dataDir = process.env.EQUIPOT_BENCH_PG_DIR ?? ".equipot/pg-bench";

export async function startBenchPostgres(): Promise<BenchPostgres> {
  // A run that was killed leaves its cluster up on another port: stop it, then start on ours.
  stopCluster(dataDir);
  const cluster = startCluster({
    dataDir,
    port: await freePort(),
    durable: true,
    log: () => undefined,
  });
  try {
    await admin(cluster, `drop database if exists ${template} with (force)`);
    await admin(cluster, `create database ${template}`);
    const url = cluster.adminUrl(template);
    await ensureAppRole(cluster.adminUrl("postgres"), appRole, appPassword);
    await applyMigrations(url, appRole);
    const seeded = connect(url, 1);
    await seedDemo(seeded.db, "test").finally(() => seeded.close());
  } catch (error) {
    cluster.stop();
    throw error;
  }
  return {
    async fresh() {
      const name = `equipot_bench_${randomBytes(6).toString("hex")}`;
      await admin(cluster, `create database ${name} template ${template}`);
      const ownerUrl = withDatabase(cluster.adminUrl("postgres"), name);
      return {
        url: urlAs(ownerUrl, appRole, appPassword),
        ownerUrl,
        drop: () => admin(cluster, `drop database if exists ${name} with (force)`),
      };
    },
    stop: () => cluster.stop(),
  };
}
