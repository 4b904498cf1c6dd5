// Pull: site changes seeded straight into PostgreSQL, pulled by a fresh tablet through the real
// engine over HTTP, page by page, with the memory of both sides measured while it runs.
import pg from "pg";
import type { SiteView } from "../../shared/schemas/sites";
import { createSyncEngine } from "../../src/sync/engine";
import type { SyncTransport } from "../../src/sync/transport";
import { httpTransport, openClient, type Session } from "./client";
import { benchSite, benchSiteSql } from "./data";
import { liveHeap, samplePeak, settledHeap, type Peak } from "./memory";
import { fieldEmail } from "./push";
import type { BenchServer } from "./server-process";
import type { ServerMemory } from "./server";

/** One campaign per size, each with n site changes at positions 1..n; the field account joins it. */
export async function seedPullCampaigns(url: string, sizes: readonly number[]) {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  const ids = new Map<number, string>();
  try {
    for (const n of sizes) {
      await client.query("begin");
      const campaign = await client.query<{ id: string }>(
        "insert into campaigns (name, change_seq) values ($1, $2) returning id",
        [`Pull benchmark traverse (${n} sites)`, n],
      );
      const id = campaign.rows[0]?.id ?? "";
      await client.query(
        "insert into memberships (campaign_id, user_id, role) select $1, id, 'field' from users where email = $2",
        [id, fieldEmail],
      );
      const s = benchSiteSql;
      await client.query(
        `insert into sites (id, campaign_id, name, kind, latitude_deg, longitude_deg,
           approx_height_m, notes, change_seq)
         select gen_random_uuid(), $1, ${s.name}, ${s.kind}, ${s.latitudeDeg}, ${s.longitudeDeg},
           ${s.approxHeightM}, ${s.notes}, g
         from generate_series(1, $2::int) g`,
        [id, n],
      );
      await client.query("commit");
      ids.set(n, id);
    }
    await client.query("analyze sites");
  } finally {
    await client.end();
  }
  return ids;
}

export interface PullResult {
  n: number;
  page: number;
  ms: number;
  pages: number;
  /**
   * Client live heap added per stored site between the middle and the last page. A slope inside
   * one pull, because a database closed earlier is let go at some later moment, not at close.
   */
  clientPerSite: number;
  /** Highest client heap seen while pulling, above the live heap after it. */
  clientTransient: number;
  /** Live heap held by one received page, at the first, middle and last page. */
  pageLive: number[];
  server: ServerMemory;
}

interface Probe {
  at: number[];
  /** Live heap just before each probed page was asked for. */
  heapAt: number[];
  pageLive: number[];
  probeMs: number;
  pages: number;
}

/** Counts pages; at a few of them measures the live heap a parsed page holds (untimed). */
function probedPull(transport: SyncTransport, probe: Probe): SyncTransport {
  return {
    ...transport,
    async pull(params) {
      const index = probe.pages++;
      if (!probe.at.includes(index)) return transport.pull(params);
      const t0 = performance.now();
      const before = liveHeap();
      probe.heapAt.push(before);
      probe.probeMs += performance.now() - t0;
      const page = await transport.pull(params);
      const t1 = performance.now();
      probe.pageLive.push(liveHeap() - before);
      probe.probeMs += performance.now() - t1;
      return page;
    },
  };
}

export async function pullRun(
  server: BenchServer,
  session: Session,
  campaignId: string,
  n: number,
  page: number,
): Promise<PullResult> {
  const pages = Math.ceil(n / page);
  const probe: Probe = {
    at: [0, Math.floor(pages / 2), pages - 1],
    heapAt: [],
    pageLive: [],
    probeMs: 0,
    pages: 0,
  };
  const db = openClient();
  const engine = createSyncEngine({
    db,
    transport: probedPull(httpTransport(server.url, session.token), probe),
    campaignIds: () => [campaignId],
    pullPage: page,
  });
  await settledHeap();
  await server.memoryStart();
  const stopSampling = samplePeak(10);
  const t0 = performance.now();
  await engine.sync();
  const ms = performance.now() - t0 - probe.probeMs;
  const peak: Peak = stopSampling();
  const serverMemory = await server.memoryStop();
  const stored = await db.sites.count();
  if (stored !== n) throw new Error(`pull incomplete: ${stored} of ${n} sites on the tablet`);
  const after = await settledHeap();
  db.close();
  const [, mid = 0, last = 0] = probe.at;
  const [, heapMid = 0, heapLast = 0] = probe.heapAt;
  return {
    n,
    page,
    ms,
    pages: probe.pages,
    clientPerSite: (heapLast - heapMid) / ((last - mid) * page),
    clientTransient: Math.max(0, peak.heapUsed - after),
    pageLive: probe.pageLive,
    server: serverMemory,
  };
}

function benchView(campaignId: string, i: number): SiteView {
  const values = benchSite(i);
  return {
    ...values,
    notes: values.notes ?? "",
    id: crypto.randomUUID(),
    campaignId,
    version: 1,
    updatedAt: new Date().toISOString(),
    updatedBy: null,
    deletedAt: null,
  };
}

/**
 * What fake-indexeddb itself keeps per stored site, without the sync: the same records written
 * straight into serverSites and sites, 500 per transaction; the slope over the second half.
 */
export async function storeBytesPerSite(campaignId: string, n: number): Promise<number> {
  const db = openClient();
  let half = 0;
  let halfRows = 0;
  for (let start = 1; start <= n; start += 500) {
    if (halfRows === 0 && start > n / 2) [half, halfRows] = [liveHeap(), start - 1];
    const views: SiteView[] = [];
    for (let i = start; i < Math.min(start + 500, n + 1); i++) views.push(benchView(campaignId, i));
    await db.transaction("rw", db.serverSites, db.sites, async () => {
      await db.serverSites.bulkPut(views);
      await db.sites.bulkPut(views.map((v) => ({ ...v, pendingChanges: 0 })));
    });
  }
  const bytes = (liveHeap() - half) / (n - halfRows);
  db.close();
  return bytes;
}
