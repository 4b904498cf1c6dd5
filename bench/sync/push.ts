// Push: 10,000 site.create mutations queued by the real store code, pushed by the real engine over
// HTTP to the real server, against the same rows written by plain multi-row INSERTs through pg.
import pg from "pg";
import { createSiteLocally } from "../../src/db/site-store";
import type { EquipotDb, OutboxEntry } from "../../src/db/database";
import { createSyncEngine } from "../../src/sync/engine";
import type { SyncTransport } from "../../src/sync/transport";
import {
  httpTransport,
  openClient,
  restore,
  signIn,
  snapshot,
  type ClientSnapshot,
} from "./client";
import { benchSite } from "./data";
import type { BenchPostgres } from "./postgres";
import { startBenchServer } from "./server-process";

export const fieldEmail = "field@demo.equipot.test";

export interface Queued {
  campaignId: string;
  snapshot: ClientSnapshot;
  queueMs: number;
}

/** Queues n creates once; every round restores this outbox into a new tablet database. */
export async function queueSites(campaignId: string, n: number): Promise<Queued> {
  const db = openClient();
  const t0 = performance.now();
  for (let i = 1; i <= n; i++) await createSiteLocally(db, campaignId, benchSite(i));
  const queueMs = performance.now() - t0;
  const queued = { campaignId, snapshot: await snapshot(db), queueMs };
  db.close();
  return queued;
}

/** The demo campaign the field account belongs to (the same in every clone of the template). */
export async function demoCampaignId(postgres: BenchPostgres): Promise<string> {
  const database = await postgres.fresh();
  const server = await startBenchServer(database.url);
  try {
    const session = await signIn(server.url, fieldEmail);
    const id = session.campaignIds[0];
    if (id === undefined) throw new Error("the demo field account has no campaign");
    return id;
  } finally {
    await server.close();
    await database.drop();
  }
}

async function countSites(url: string, campaignId: string): Promise<number> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const res = await client.query<{ n: number }>(
      "select count(*)::int as n from sites where campaign_id = $1",
      [campaignId],
    );
    return res.rows[0]?.n ?? 0;
  } finally {
    await client.end();
  }
}

export interface PushTiming {
  /** The engine's whole push phase: outbox read, HTTP round trips, results written back. */
  ms: number;
  /** Time inside POST /api/sync/push calls alone. */
  httpMs: number;
  requests: number;
}

function timedPush(transport: SyncTransport, timing: { httpMs: number; requests: number }) {
  return {
    ...transport,
    async push(request: Parameters<SyncTransport["push"]>[0]) {
      const t0 = performance.now();
      try {
        return await transport.push(request);
      } finally {
        timing.httpMs += performance.now() - t0;
        timing.requests += 1;
      }
    },
  };
}

async function checkPushed(db: EquipotDb, url: string, queued: Queued, n: number) {
  const entries: OutboxEntry[] = await db.outbox.toArray();
  const applied = entries.filter((e) => e.result?.status === "applied").length;
  const onServer = await countSites(url, queued.campaignId);
  // The template's three demo sites are in the same campaign.
  if (applied !== n || onServer !== n + 3)
    throw new Error(`push incomplete: ${applied} applied, ${onServer - 3} sites on the server`);
}

export async function pushRound(
  postgres: BenchPostgres,
  queued: Queued,
  n: number,
  batch: number,
): Promise<PushTiming> {
  const database = await postgres.fresh();
  const server = await startBenchServer(database.url);
  const db = openClient();
  try {
    const session = await signIn(server.url, fieldEmail);
    await restore(db, queued.snapshot);
    const timing = { httpMs: 0, requests: 0 };
    // No campaign to pull: sync() is then the push phase alone.
    const engine = createSyncEngine({
      db,
      transport: timedPush(httpTransport(server.url, session.token), timing),
      campaignIds: () => [],
      pushBatch: batch,
    });
    const t0 = performance.now();
    await engine.sync();
    const ms = performance.now() - t0;
    await checkPushed(db, database.ownerUrl, queued, n);
    return { ms, ...timing };
  } finally {
    db.close();
    await server.close();
    await database.drop();
  }
}

const columns =
  "id, campaign_id, name, kind, latitude_deg, longitude_deg, approx_height_m, notes, updated_by, change_seq";

/**
 * The baseline: the same site rows by multi-row INSERT, one transaction per batch. Each batch takes
 * its change positions from the campaign's counter row in one UPDATE (the row lock the server's
 * writers serialise on), not one UPDATE per row.
 */
/**
 * The same rows by plain multi-row INSERTs, one transaction per batch: the sites with their change
 * positions and, with `audit`, the audit row the server writes beside each (who, what, the record).
 */
export async function baselineRound(
  postgres: BenchPostgres,
  queued: Queued,
  batch: number,
  audit: boolean,
): Promise<number> {
  const database = await postgres.fresh();
  const client = new pg.Client({ connectionString: database.ownerUrl });
  await client.connect();
  try {
    const user = await client.query<{ id: string }>("select id from users where email = $1", [
      fieldEmail,
    ]);
    const userId = user.rows[0]?.id ?? null;
    const rows = (queued.snapshot.tables.outbox as OutboxEntry[]).map(
      (e) => e.args as ReturnType<typeof benchSite> & { id: string },
    );
    const t0 = performance.now();
    for (let start = 0; start < rows.length; start += batch) {
      const chunk = rows.slice(start, start + batch);
      await client.query("begin");
      const seq = await client.query<{ last: string }>(
        "update campaigns set change_seq = change_seq + $2 where id = $1 returning change_seq as last",
        [queued.campaignId, chunk.length],
      );
      const first = Number(seq.rows[0]?.last) - chunk.length + 1;
      const values: unknown[] = [];
      const tuples = chunk.map((r, i) => {
        values.push(r.id, queued.campaignId, r.name, r.kind, r.latitudeDeg, r.longitudeDeg);
        values.push(r.approxHeightM, r.notes, userId, first + i);
        const p = i * 10;
        return `(${Array.from({ length: 10 }, (_, k) => `$${p + k + 1}`).join(", ")})`;
      });
      await client.query(`insert into sites (${columns}) values ${tuples.join(", ")}`, values);
      if (audit) {
        const auditValues: unknown[] = [];
        const auditTuples = chunk.map((r, i) => {
          auditValues.push(queued.campaignId, userId, r.id, JSON.stringify(r));
          const p = i * 4;
          return `($${p + 1}, $${p + 2}, 'create', 'site', $${p + 3}, $${p + 4}::jsonb)`;
        });
        await client.query(
          `insert into audit_events (campaign_id, user_id, action, entity, entity_id, after) values ${auditTuples.join(", ")}`,
          auditValues,
        );
      }
      await client.query("commit");
    }
    const ms = performance.now() - t0;
    const onServer = await countSites(database.ownerUrl, queued.campaignId);
    if (onServer !== rows.length + 3) throw new Error(`baseline wrote ${onServer - 3} sites`);
    return ms;
  } finally {
    await client.end();
    await database.drop();
  }
}
