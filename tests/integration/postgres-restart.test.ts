// PostgreSQL stopped (immediate mode, as in a crash) and started again while four tablets push:
// while it is down the server answers 503 with Retry-After (never a 500), the tablets keep their
// mutations and retry, and afterwards every mutation is applied exactly once and pulled by all.
// The test's own cluster, so that stopping it touches no other test.
import { rmSync } from "node:fs";
import { join } from "node:path";
import pg from "pg";
import { pino } from "pino";
import type { Express } from "express";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startCluster, stopCluster, type Cluster } from "../../scripts/lib/postgres";
import { createApp } from "../../server/app";
import { applyMigrations, connect, type Database } from "../../server/db/client";
import { seedDemo } from "../../server/seed/demo";
import { signInAs } from "../helpers/app";
import { testConfig } from "../helpers/config";
import { freePort } from "../helpers/server-process";
import { newSite, pullAll, pushAs, syncClient, type TestSyncClient } from "../helpers/sync";

const TABLETS = 4;
const SITES_EACH = 15;

let cluster: Cluster;
let port: number;
let database: Database;
let app: Express;
const dataDir = join(".equipot", `pg-restart-${process.pid}`);

// Durable, as in production: an immediate stop is a crash, and a commit the server acknowledged
// must survive it (with synchronous_commit off it would not, and the tablet would be told to
// send mutations the server had forgotten).
const start = () => startCluster({ dataDir, port, durable: true, log: () => undefined });

beforeAll(async () => {
  port = await freePort();
  cluster = start();
  const admin = new pg.Client({ connectionString: cluster.adminUrl("postgres") });
  await admin.connect();
  await admin.query("drop database if exists equipot_restart");
  await admin.query("create database equipot_restart");
  await admin.end();
  const url = cluster.adminUrl("equipot_restart");
  await applyMigrations(url);
  database = connect(url);
  await seedDemo(database.db, "test");
  app = createApp({
    config: testConfig({ DATABASE_URL: url }),
    db: database.db,
    log: pino({ level: "silent" }),
  });
}, 120_000);
afterAll(async () => {
  // Bounded: a pool whose connections died with the server must not hold the run up.
  const closed = database?.close().then(
    () => true,
    () => true,
  );
  const inTime = await Promise.race([closed, new Promise((r) => setTimeout(() => r(false), 5000))]);
  if (inTime === false) console.error("postgres-restart: the pool did not close within 5 s");
  stopCluster(cluster.dataDir);
  rmSync(cluster.dataDir, { recursive: true, force: true });
  rmSync(`${cluster.dataDir}.password`, { force: true });
}, 120_000);

interface Tablet {
  client: TestSyncClient;
  pending: ReturnType<TestSyncClient["mutation"]>[];
  siteIds: string[];
}

describe("PostgreSQL restarted while tablets sync", () => {
  it("answers 503 while it is down, and every retried mutation lands exactly once", async () => {
    const field = await signInAs(app, "field");
    const campaignId = field.memberships[0]?.campaignId ?? "";
    const tablets: Tablet[] = Array.from({ length: TABLETS }, () => {
      const client = syncClient();
      const sites = Array.from({ length: SITES_EACH }, (_, i) =>
        newSite({ name: `Restart hut ${client.clientId.slice(0, 4)}-${i}` }),
      );
      return {
        client,
        siteIds: sites.map((s) => s.id),
        pending: sites.map((s) => client.mutation("site.create", s)),
      };
    });
    const failures: number[] = [];
    let acked = 0;
    let restarted = false;

    // Each tablet sends up to 3 of its pending mutations at a time, as the engine batches.
    const run = async (t: Tablet) => {
      const deadline = Date.now() + 60_000;
      while (t.pending.length > 0 && Date.now() < deadline) {
        const batch = t.pending.slice(0, 3);
        const res = await pushAs(app, field.token, {
          clientId: t.client.clientId,
          campaignId,
          mutations: batch,
        });
        if (res.status === 200) {
          const done = res.body.results.filter(
            (r) => r.status === "applied" || r.status === "duplicate",
          );
          t.pending = t.pending.slice(done.length);
          acked += done.length;
        } else {
          failures.push(res.status);
          await new Promise((r) => setTimeout(r, 50));
        }
      }
    };
    const restart = async () => {
      while (acked < 10) await new Promise((r) => setTimeout(r, 5));
      stopCluster(cluster.dataDir);
      // Down for a while: every push in this time must fail cleanly.
      await new Promise((r) => setTimeout(r, 500));
      cluster = start();
      restarted = true;
    };
    await Promise.all([...tablets.map(run), restart()]);

    expect(restarted).toBe(true);
    expect(tablets.map((t) => t.pending.length)).toEqual(tablets.map(() => 0));
    // Some pushes met the outage, and each of them was told to retry, not that it failed.
    expect(failures.length).toBeGreaterThan(0);
    expect([...new Set(failures)]).toEqual([503]);

    const ids = tablets.flatMap((t) => t.siteIds);
    const stored = await database.pool.query<{ id: string; n: string }>(
      "select id, count(*) over (partition by id) as n from sites where id = any($1::uuid[])",
      [ids],
    );
    expect(stored.rows.length).toBe(ids.length);
    expect(stored.rows.every((r) => r.n === "1")).toBe(true);
    const positions = await database.pool.query<{ last: string }>(
      "select last_mutation_id as last from sync_clients where id = any($1::uuid[])",
      [tablets.map((t) => t.client.clientId)],
    );
    expect(positions.rows.map((r) => Number(r.last))).toEqual(tablets.map(() => SITES_EACH));
    // Each tablet pulls every other tablet's sites.
    const { changes } = await pullAll(app, field.token, campaignId);
    const pulled = new Set(changes.filter((c) => c.entity === "site").map((c) => c.id));
    expect(ids.every((id) => pulled.has(id))).toBe(true);
  }, 120_000);
});
