// Sync benchmark (not a test): `node --import tsx bench/sync.ts`.
// Push: 10,000 queued site.create mutations through the real engine, HTTP and server, against the
// same rows by plain multi-row INSERTs. Pull: 100,000 changes into a fresh tablet (fake-indexeddb).
// Memory: the server's heap while pulling 10,000 vs 100,000 changes, and the client's heap per page.
// Everything runs on loopback against the benchmark's own durable PostgreSQL cluster (fsync on).
// Prints a table and writes bench/.build/sync.json; runSyncBench() returns the rows.
import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { median, BUILD_DIR } from "./science/timing";
import { signIn } from "./sync/client";
import { MiB } from "./sync/memory";
import { startBenchPostgres, type BenchPostgres } from "./sync/postgres";
import { pullRun, seedPullCampaigns, storeBytesPerSite, type PullResult } from "./sync/pull";
import {
  baselineRound,
  demoCampaignId,
  fieldEmail,
  pushRound,
  queueSites,
  type PushTiming,
} from "./sync/push";
import { startBenchServer } from "./sync/server-process";

export interface SyncRow {
  readonly name: string;
  readonly n: number;
  /** Median wall time, ms (null for memory rows). */
  readonly medianMs: number | null;
  /** The plain-SQL baseline doing the same writes, same run. */
  readonly baselineMs: number | null;
  readonly ratio: number | null;
  readonly limit: string;
  readonly pass: boolean | null;
  readonly note: string;
}

const PUSHED = 10_000;
const PULLED = 100_000;
const SMALL_PULL = 10_000;
const PAGE = 500;
// A few pages of the protocol's largest size, to see what a page costs against its size.
const WIDE_PULL = 5_000;
const WIDE_PAGE = 1000;
// A push of 10,000 takes tens of seconds here: three rounds at the engine's default batch, one at
// the protocol's maximum, to keep the whole benchmark within a few minutes.
const ROUNDS = { 200: 3, 500: 1 } as const;

const mib = (bytes: number) => `${(bytes / MiB).toFixed(1)} MiB`;
const kib = (bytes: number) => `${(bytes / 1024).toFixed(0)} KiB`;

async function pushRows(postgres: BenchPostgres): Promise<SyncRow[]> {
  const campaignId = await demoCampaignId(postgres);
  const queued = await queueSites(campaignId, PUSHED);
  const rows: SyncRow[] = [];
  for (const batch of [200, 500] as const) {
    const pushes: PushTiming[] = [];
    const baselines: number[] = [];
    const sitesOnly: number[] = [];
    // Push and baselines alternate, each on a fresh database, so a busy machine slows all alike.
    for (let r = 0; r < ROUNDS[batch]; r++) {
      pushes.push(await pushRound(postgres, queued, PUSHED, batch));
      baselines.push(await baselineRound(postgres, queued, batch, true));
      sitesOnly.push(await baselineRound(postgres, queued, batch, false));
    }
    const ms = median(pushes.map((p) => p.ms));
    const http = median(pushes.map((p) => p.httpMs));
    const baselineMs = median(baselines);
    const ratio = ms / baselineMs;
    const sitesOnlyMs = median(sitesOnly);
    rows.push({
      name: `push ${PUSHED} site.create, batch ${batch}${batch === 200 ? " (engine default)" : " (protocol max)"}`,
      n: PUSHED,
      medianMs: ms,
      baselineMs,
      ratio,
      limit: "≤ 3 × baseline",
      pass: ratio <= 3,
      note:
        `${ROUNDS[batch]} round(s), ${pushes[0]?.requests ?? 0} POST /api/sync/push, ${http.toFixed(0)} ms of it in HTTP calls; ` +
        `baseline: multi-row INSERTs of ${batch} sites and their ${batch} audit rows per transaction, one counter UPDATE per batch ` +
        `(sites alone: ${sitesOnlyMs.toFixed(0)} ms, ratio ${(ms / sitesOnlyMs).toFixed(1)}); ` +
        `queuing took ${(queued.queueMs / 1000).toFixed(1)} s (not timed)`,
    });
  }
  return rows;
}

function pullRow(r: PullResult, limitMs: number | null): SyncRow {
  return {
    name: `pull ${r.n} site changes into fake-indexeddb, page ${r.page}`,
    n: r.n,
    medianMs: r.ms,
    baselineMs: null,
    ratio: null,
    limit: limitMs === null ? "—" : `< ${limitMs} ms`,
    pass: limitMs === null ? null : r.ms < limitMs,
    note: `${r.pages} GET /api/sync/pull, ${((r.n / r.ms) * 1000).toFixed(0)} changes/s; one round`,
  };
}

// fake-indexeddb keeps the stored rows in the JS heap, so the client's heap must grow with the
// total. What must not grow is what the sync itself holds: the live heap of one received page,
// and any heap per pulled site beyond what fake-indexeddb needs for the same rows written directly.
function memoryRows(
  small: PullResult,
  large: PullResult,
  wide: PullResult,
  storePerSite: number,
): SyncRow[] {
  const growth = (r: PullResult) => r.server.peak.heapUsed - r.server.before;
  const rssGrowth = (r: PullResult) => r.server.peak.rss - r.server.rssBefore;
  const pageLive = (r: PullResult) => Math.max(...r.pageLive.slice(1));
  const perSite = (r: PullResult) => r.clientPerSite;
  return [
    {
      name: `memory: server heap while pulling ${small.n} vs ${large.n} changes, page ${PAGE}`,
      n: large.n,
      medianMs: null,
      baselineMs: null,
      ratio: growth(large) / growth(small),
      limit: "flat in the total",
      pass: growth(large) < 2 * growth(small),
      note:
        `peak heap above the start: ${mib(growth(small))} vs ${mib(growth(large))}; ` +
        `peak RSS above the start: ${mib(rssGrowth(small))} vs ${mib(rssGrowth(large))}; ` +
        `live heap after: ${mib(small.server.after - small.server.before)} vs ${mib(large.server.after - large.server.before)} ` +
        "(the peak is mostly young-generation garbage between scavenges)",
    },
    {
      name: `memory: client live heap held by one received page (${PAGE} changes)`,
      n: large.n,
      medianMs: null,
      baselineMs: null,
      ratio: pageLive(large) / pageLive(small),
      limit: "flat in the total",
      pass: pageLive(large) < 2 * pageLive(small),
      note:
        `probed at the first, middle and last page: ${small.pageLive.map(kib).join(", ")} of ${small.n}; ` +
        `${large.pageLive.map(kib).join(", ")} of ${large.n} (the first includes warm-up)`,
    },
    {
      name: `memory: one page's live heap, page ${WIDE_PAGE} vs ${PAGE}`,
      n: wide.n,
      medianMs: null,
      baselineMs: null,
      ratio: pageLive(wide) / pageLive(small),
      limit: "∝ page size",
      pass: null,
      note:
        `client, one received page: ${kib(pageLive(wide))} vs ${kib(pageLive(small))}; ` +
        `server peak heap above the start: ${mib(growth(wide))} vs ${mib(growth(small))}`,
    },
    {
      name: "memory: client heap retained per stored site vs fake-indexeddb's own cost",
      n: large.n,
      medianMs: null,
      baselineMs: null,
      ratio: perSite(large) / storePerSite,
      limit: "≈ the store's own cost",
      pass: perSite(large) < 1.25 * storePerSite,
      note:
        `heap added per site from the middle to the last page: ${perSite(small).toFixed(0)} B pulling ${small.n}, ` +
        `${perSite(large).toFixed(0)} B pulling ${large.n}; the same rows written straight into serverSites and sites: ${storePerSite.toFixed(0)} B`,
    },
    {
      name: "memory: client peak heap above the stored data while pulling",
      n: large.n,
      medianMs: null,
      baselineMs: null,
      ratio: null,
      limit: "—",
      pass: null,
      note:
        `${mib(small.clientTransient)} pulling ${small.n}, ${mib(large.clientTransient)} pulling ${large.n}: ` +
        "garbage awaiting collection; V8 lets more of it build up as the heap (here, the store) grows",
    },
  ];
}

async function pullRows(postgres: BenchPostgres): Promise<SyncRow[]> {
  const database = await postgres.fresh();
  try {
    const ids = await seedPullCampaigns(database.ownerUrl, [WIDE_PULL, SMALL_PULL, PULLED]);
    const server = await startBenchServer(database.url);
    try {
      const session = await signIn(server.url, fieldEmail);
      const campaign = (n: number) => ids.get(n) ?? "";
      // The 10,000 first, on a clean heap: it also warms up the code for the wide pages. A
      // closed client database is let go only later, during another one's work; the heap figures
      // are slopes and differences taken where that cannot fall in between.
      const small = await pullRun(server, session, campaign(SMALL_PULL), SMALL_PULL, PAGE);
      const wide = await pullRun(server, session, campaign(WIDE_PULL), WIDE_PULL, WIDE_PAGE);
      const storePerSite = await storeBytesPerSite(campaign(SMALL_PULL), SMALL_PULL);
      const large = await pullRun(server, session, campaign(PULLED), PULLED, PAGE);
      return [
        pullRow(large, 20_000),
        pullRow(small, null),
        ...memoryRows(small, large, wide, storePerSite),
      ];
    } finally {
      await server.close();
    }
  } finally {
    await database.drop();
  }
}

export async function runSyncBench(): Promise<SyncRow[]> {
  const postgres = await startBenchPostgres();
  try {
    // Pull first: a large closed client database from the push rounds would otherwise be let go
    // by Dexie in the middle of a measured pull.
    // EQUIPOT_BENCH_ONLY=pull or =push runs one half, for quicker work on one side.
    const only = process.env.EQUIPOT_BENCH_ONLY;
    const pull = only === "push" ? [] : await pullRows(postgres);
    const rows = [...(only === "pull" ? [] : await pushRows(postgres)), ...pull];
    mkdirSync(BUILD_DIR, { recursive: true });
    writeFileSync(join(BUILD_DIR, "sync.json"), JSON.stringify(rows, null, 2) + "\n");
    return rows;
  } finally {
    postgres.stop();
  }
}

export function printSyncRows(rows: readonly SyncRow[]): void {
  const fmt = (v: number | null, digits = 0) => (v === null ? "—" : v.toFixed(digits));
  console.table(
    rows.map((r) => ({
      benchmark: r.name,
      n: r.n,
      ms: fmt(r.medianMs),
      "baseline ms": fmt(r.baselineMs),
      ratio: fmt(r.ratio, 2),
      target: r.limit,
      pass: r.pass === null ? "—" : r.pass ? "yes" : "NO",
      note: r.note,
    })),
  );
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  printSyncRows(await runSyncBench());
}
