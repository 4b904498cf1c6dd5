// API under load (not a test): `node --import tsx bench/api-load.ts`.
// The site list and a sync pull, each at 500 requests a second over 50 connections (the goal's
// figures: latency from the moment each request was due), and each with autocannon's 50
// connections sending as fast as answers come (the capacity), both after a warm-up, with
// GET /api/health (one `select 1`, no auth) under the same loads as the floor this machine sets.
// Then a burst of concurrent sign-ins while the server samples its memory. Loopback only, against
// the benchmark's own PostgreSQL cluster and server process.
// Prints a table and writes bench/.build/api-load.json; runApiLoadBench() returns the rows.
import { mkdirSync, writeFileSync } from "node:fs";
import { loadavg } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { protocolVersion, pullResponse } from "../shared/sync/protocol";
import { CONNECTIONS, MEASURE_S, WARM_UP_S, loadEndpoint, type LoadResult } from "./api/load";
import { steadyLoad, type SteadyResult } from "./api/steady-rate";
import { signInBurst, type BurstResult } from "./api/sign-in-burst";
import { BUILD_DIR } from "./science/timing";
import type { SyncRow } from "./sync";
import { signIn, type Session } from "./sync/client";
import { MiB } from "./sync/memory";
import { startBenchPostgres } from "./sync/postgres";
import { fieldEmail } from "./sync/push";
import { startBenchServer, type BenchServer } from "./sync/server-process";

/**
 * A sync row; for a load row medianMs is the p50 latency and baselineMs that of GET /api/health
 * under the same load. The two figures the goal names are also kept apart.
 */
export interface ApiLoadRow extends SyncRow {
  /** Requests (or sign-ins) per second over the measured run. */
  readonly requestsPerS: number | null;
  readonly p99Ms: number | null;
}

const GOAL_P99_MS = 50;
const GOAL_RATE = 500;
const BURST = 200;
const PULL_PAGE = 500;
// argon2id's memory cost in passwords.ts (m = 19,456 KiB) and how many hashes it lets run at once.
const ARGON2_MIB = 19;
const ARGON2_AT_ONCE = 4;
// Twice the bound: far below what an unbounded burst would take (BURST × 19 MiB).
const RSS_LIMIT_MIB = 2 * ARGON2_AT_ONCE * ARGON2_MIB;

const mib = (bytes: number) => `${(bytes / MiB).toFixed(0)} MiB`;
const ms = (v: number) => `${v.toFixed(v < 10 ? 1 : 0)} ms`;
const rate = (r: LoadResult) => `${r.requestsPerS.toFixed(0)} req/s`;

async function fetchJson(server: BenchServer, session: Session, path: string): Promise<unknown> {
  const res = await fetch(`${server.url}${path}`, {
    headers: { authorization: `Bearer ${session.token}` },
  });
  if (!res.ok) throw new Error(`GET ${path}: ${res.status} ${await res.text()}`);
  return res.json();
}

/** What one answer holds, checked once before the load so the figures are for real answers. */
async function describeAnswers(server: BenchServer, session: Session, campaignId: string) {
  const sitesPath = `/api/campaigns/${campaignId}/sites`;
  const sites = (await fetchJson(server, session, sitesPath)) as { sites?: unknown };
  if (!Array.isArray(sites.sites) || sites.sites.length === 0)
    throw new Error(`GET ${sitesPath} returned no sites: the demo seed is missing`);
  const pullPath =
    `/api/sync/pull?protocolVersion=${protocolVersion}&campaign=${campaignId}` +
    `&cursor=0&limit=${PULL_PAGE}`;
  const pull = pullResponse.parse(await fetchJson(server, session, pullPath));
  if (pull.changes.length === 0) throw new Error(`GET ${pullPath} returned no changes`);
  return { sitesPath, sites: sites.sites.length, pullPath, changes: pull.changes.length };
}

interface Measured {
  steady: SteadyResult;
  capacity: LoadResult;
}

async function measure(server: BenchServer, path: string, token?: string): Promise<Measured> {
  const steady = await steadyLoad(server.url, path, token, {
    ratePerS: GOAL_RATE,
    connections: CONNECTIONS,
    warmUpS: WARM_UP_S,
    measureS: MEASURE_S,
  });
  return { steady, capacity: await loadEndpoint(server.url, path, token) };
}

// The server kept up when it answered the arrival rate within 2 % (the last answers' wait).
const keptUp = (r: SteadyResult) => r.answeredPerS >= 0.98 * r.ratePerS;

function loadRow(name: string, r: Measured, floor: Measured, busy: string): ApiLoadRow {
  const { steady, capacity } = r;
  const met = keptUp(steady) && steady.p99Ms <= GOAL_P99_MS;
  const shortfall = [
    keptUp(steady) ? "" : `answered ${steady.answeredPerS.toFixed(0)} req/s`,
    steady.p99Ms > GOAL_P99_MS ? `p99 ${ms(steady.p99Ms)}` : "",
  ].filter(Boolean);
  return {
    name: `${name}, ${GOAL_RATE} req/s over ${CONNECTIONS} connections, ${MEASURE_S} s`,
    n: steady.sent,
    medianMs: steady.p50Ms,
    baselineMs: floor.steady.p50Ms,
    ratio: steady.p99Ms / floor.steady.p99Ms,
    limit: `p99 ≤ ${GOAL_P99_MS} ms at ≥ ${GOAL_RATE} req/s`,
    pass: met,
    requestsPerS: steady.answeredPerS,
    p99Ms: steady.p99Ms,
    note:
      (met ? "" : `goal NOT met (${shortfall.join(", ")}); `) +
      `at ${GOAL_RATE} req/s: p50 ${ms(steady.p50Ms)}, p99 ${ms(steady.p99Ms)}, max ` +
      `${ms(steady.maxMs)}, all 2xx, latency from each request's due time; GET /api/health at ` +
      `the same rate: p50 ${ms(floor.steady.p50Ms)}, p99 ${ms(floor.steady.p99Ms)}. Capacity ` +
      `(autocannon, ${CONNECTIONS} connections, no pause): ${rate(capacity)}, p99 ` +
      `${ms(capacity.p99Ms)} (health ${rate(floor.capacity)}). ${WARM_UP_S} s warm-up dropped ` +
      `before each run; the load, the server and PostgreSQL share the machine (${busy})`,
  };
}

function burstRow(b: BurstResult, load: string): ApiLoadRow {
  const heapPeak = b.memory.peak.heapUsed;
  const rssPeak = b.memory.peak.rss;
  const rssGrowth = rssPeak - b.memory.rssBefore;
  return {
    name: `sign-in burst: ${b.n} concurrent POST /api/auth/sign-in, server memory`,
    n: b.n,
    medianMs: b.medianMs,
    baselineMs: null,
    ratio: rssPeak / b.memory.rssBefore,
    limit: `peak RSS − start < ${RSS_LIMIT_MIB} MiB`,
    pass: rssGrowth < RSS_LIMIT_MIB * MiB,
    requestsPerS: (b.n / b.wallMs) * 1000,
    p99Ms: null,
    note:
      `${b.ok} × 200, ${b.throttled} × 429 in ${ms(b.wallMs)} (median answer ${ms(b.medianMs)}, ` +
      `slowest ${ms(b.maxMs)}); heap ${mib(b.memory.before)} live before, ${mib(heapPeak)} peak ` +
      `during; RSS ${mib(b.memory.rssBefore)} before, ${mib(rssPeak)} peak during ` +
      `(+${mib(rssGrowth)}). argon2id takes ${ARGON2_MIB} MiB per hash; passwords.ts runs at most ` +
      `${ARGON2_AT_ONCE} hashes or verifies at once and queues the rest as plain promises, so the ` +
      `burst needs ${ARGON2_AT_ONCE} × ${ARGON2_MIB} MiB, not ${b.n} × ${ARGON2_MIB} MiB (${load})`,
  };
}

async function measureRows(server: BenchServer, busy: string): Promise<ApiLoadRow[]> {
  const session = await signIn(server.url, fieldEmail);
  const campaignId = session.campaignIds[0];
  if (campaignId === undefined) throw new Error("the demo field account has no campaign");
  const seen = await describeAnswers(server, session, campaignId);
  const floor = await measure(server, "/api/health");
  const sites = await measure(server, seen.sitesPath, session.token);
  const pull = await measure(server, seen.pullPath, session.token);
  const burst = await signInBurst(server, BURST);
  const pullName = `GET /api/sync/pull, cursor 0, limit ${PULL_PAGE} (${seen.changes} changes)`;
  return [
    loadRow(`GET /api/campaigns/:id/sites (${seen.sites} sites)`, sites, floor, busy),
    loadRow(pullName, pull, floor, busy),
    burstRow(burst, busy),
  ];
}

export async function runApiLoadBench(): Promise<ApiLoadRow[]> {
  // These figures move with other work on the machine far more than the sync ones do.
  const busy = `1-min load average ${loadavg()[0]?.toFixed(1) ?? "?"} at the start`;
  const postgres = await startBenchPostgres();
  try {
    const database = await postgres.fresh();
    try {
      const server = await startBenchServer(database.url);
      const rows = await measureRows(server, busy).finally(() => server.close());
      mkdirSync(BUILD_DIR, { recursive: true });
      writeFileSync(join(BUILD_DIR, "api-load.json"), JSON.stringify(rows, null, 2) + "\n");
      return rows;
    } finally {
      await database.drop();
    }
  } finally {
    postgres.stop();
  }
}

export function printApiLoadRows(rows: readonly ApiLoadRow[]): void {
  const fmt = (v: number | null, digits = 0) => (v === null ? "—" : v.toFixed(digits));
  console.table(
    rows.map((r) => ({
      benchmark: r.name,
      n: r.n,
      "p50 ms": fmt(r.medianMs, 1),
      "p99 ms": fmt(r.p99Ms, 1),
      "req/s": fmt(r.requestsPerS),
      "baseline p50 ms": fmt(r.baselineMs, 1),
      ratio: fmt(r.ratio, 2),
      target: r.limit,
      pass: r.pass === null ? "—" : r.pass ? "yes" : "NO",
      note: r.note,
    })),
  );
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const [one, five] = loadavg();
  console.log(`load average at the start: ${one?.toFixed(2)} (1 min), ${five?.toFixed(2)} (5 min)`);
  const t0 = performance.now();
  printApiLoadRows(await runApiLoadBench());
  console.log(`api-load took ${((performance.now() - t0) / 1000).toFixed(0)} s`);
}
