// `npm start`: PostgreSQL on loopback (unless DATABASE_URL is set), build the PWA, migrate, seed the
// demo when the database is empty, start the SMTP catcher, and serve API + PWA on one port.
// Ctrl-C or SIGTERM stops the server, the catcher and PostgreSQL.
import pg from "pg";
import { join } from "node:path";
import { startCluster, type Cluster } from "./lib/postgres";
import { startMailCatcher, type MailCatcher } from "./lib/mail-catcher";
import { ensureStateDir, persistentSecret } from "./lib/local-state";
import { nodeBin, run } from "./lib/run";
import { parseConfig } from "../server/config";
import { ensureAppRole, urlAs } from "../server/db/app-role";
import { applyMigrations, connect } from "../server/db/client";
import { startServer, type RunningServer } from "../server/index";
import { demoAccounts, demoPassword, seedDemo } from "../server/seed/demo";

const stops: (() => Promise<void> | void)[] = [];
const localAppRole = "equipot_app";

async function ensureDatabase(cluster: Cluster, name: string): Promise<string> {
  const client = new pg.Client({ connectionString: cluster.adminUrl("postgres") });
  await client.connect();
  const found = await client.query("select 1 from pg_database where datname = $1", [name]);
  if (found.rowCount === 0) await client.query(`create database ${name}`);
  await client.end();
  return cluster.adminUrl(name);
}

/** The owner's URL (migrations, seeding) and the application role's (the server's). */
async function databaseUrls(): Promise<{ owner: string; app: string; appRole?: string }> {
  if (process.env.DATABASE_URL) {
    const app = process.env.DATABASE_URL;
    return {
      owner: process.env.DATABASE_OWNER_URL ?? app,
      app,
      appRole: process.env.DATABASE_APP_ROLE,
    };
  }
  const port = Number(process.env.EQUIPOT_PG_PORT ?? 54330);
  const cluster = startCluster({ dataDir: join(ensureStateDir(), "pg"), port, durable: true });
  if (cluster.startedHere) stops.push(() => cluster.stop());
  console.log(`PostgreSQL on 127.0.0.1:${port} (data in ${cluster.dataDir})`);
  const owner = await ensureDatabase(cluster, "equipot");
  const password = persistentSecret("pg-app-password");
  await ensureAppRole(cluster.adminUrl("postgres"), localAppRole, password);
  return { owner, app: urlAs(owner, localAppRole, password), appRole: localAppRole };
}

async function mailUrl(): Promise<string> {
  if (process.env.SMTP_URL) return process.env.SMTP_URL;
  const port = Number(process.env.EQUIPOT_SMTP_PORT ?? 2525);
  const catcher: MailCatcher = await startMailCatcher({
    port,
    folder: join(ensureStateDir(), "mail"),
  });
  stops.push(() => catcher.close());
  console.log(`Local SMTP catcher on 127.0.0.1:${port}: messages are saved in .equipot/mail/`);
  return catcher.url;
}

async function stopAll(): Promise<void> {
  for (const stop of stops.reverse()) await stop();
}

async function main(): Promise<RunningServer> {
  const urls = await databaseUrls();
  if (process.env.EQUIPOT_SKIP_BUILD !== "1")
    run("Building the app", nodeBin, [
      "node_modules/vite/bin/vite.js",
      "build",
      "--logLevel",
      "warn",
    ]);
  await applyMigrations(urls.owner, urls.appRole);
  const production = process.env.NODE_ENV === "production";
  if (!production) {
    const database = connect(urls.owner, 2);
    const seeded = await seedDemo(database.db, process.env.NODE_ENV ?? "development");
    await database.close();
    console.log(seeded ? "Demo campaign seeded." : "Existing data kept.");
  }
  const config = parseConfig({
    ...process.env,
    DATABASE_URL: urls.app,
    JWT_SECRET: process.env.JWT_SECRET ?? persistentSecret("jwt-secret"),
    SMTP_URL: await mailUrl(),
    STATIC_DIR: process.env.STATIC_DIR ?? "dist",
    DEMO: production ? "false" : "true",
  });
  const server = await startServer(config);
  stops.push(() => server.close());
  console.log(`\nEquipot is running at ${server.url}`);
  if (!production) {
    console.log(`Demo accounts (password "${demoPassword}"):`);
    for (const account of demoAccounts)
      console.log(`  ${account.role.padEnd(10)} ${account.email}`);
  }
  console.log("Press Ctrl-C to stop.");
  return server;
}

let stopping = false;
const shutdown = (code: number) => () => {
  if (stopping) return;
  stopping = true;
  console.log("\nStopping Equipot…");
  stopAll().finally(() => process.exit(code));
};
process.on("SIGINT", shutdown(0));
process.on("SIGTERM", shutdown(0));

main().catch(async (error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  await stopAll();
  process.exit(1);
});
