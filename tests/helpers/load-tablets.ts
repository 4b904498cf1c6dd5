// Simulated tablets for the sync load test: each is the real client sync engine over its own
// fake-indexeddb database, talking to a real server on loopback through the app's HTTP transport,
// with a flaky link in between (requests refused, answers lost after the server committed, the
// tablet offline for a stretch). Every answer the server sent is seen here, lost ones included,
// so the test can count how often each mutation was applied.
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import type { z } from "zod";
import { openDatabase, type EquipotDb } from "../../src/db/database";
import { readMeta } from "../../src/db/meta";
import { createSyncEngine, type SyncEngine } from "../../src/sync/engine";
import { createHttpTransport } from "../../src/sync/http-transport";
import { ApiError } from "../../src/lib/api-error";
import { errorBody, requestHeader } from "../../shared/schemas";
import type { MutationResult, PushResponse } from "../../shared/sync/protocol";
import { prng } from "./series";

/** A small seeded generator (mulberry32), so that a failing run can be repeated. */
export const seededRandom = prng;

export interface LinkFaults {
  /** Chance that a request is refused before it leaves the tablet. */
  refuse: number;
  /** Chance that the server's answer is lost after it committed. */
  loseAnswer: number;
}

/** Disconnects injected and traffic seen, for one tablet. */
export interface LinkStats {
  pushes: number;
  pulls: number;
  mutationsSent: number;
  refused: number;
  answersLost: number;
  refusedOffline: number;
  offlineStretches: number;
  serverErrors: number;
  /** Wall time of each request that reached the server, answer read, in ms. */
  pushMs: number[];
  pullMs: number[];
  /** Every answer per mutation id, from every push answer the server sent. */
  results: Map<number, MutationResult[]>;
}

type Requester = <S extends z.ZodType>(
  path: string,
  options: { method?: "GET" | "POST"; body?: unknown; schema: S },
) => Promise<z.output<S>>;

export interface LoadTablet {
  index: number;
  db: EquipotDb;
  engine: SyncEngine;
  stats: LinkStats;
  /** Faults on or off (off while the run settles). */
  setFaults: (on: boolean) => void;
  goOffline: (ms: number) => void;
  /** The id the last local write took (writes of one tablet are never concurrent here). */
  lastMutationId: () => Promise<number>;
  clientId: () => Promise<string>;
}

const newStats = (): LinkStats => ({
  pushes: 0,
  pulls: 0,
  mutationsSent: 0,
  refused: 0,
  answersLost: 0,
  refusedOffline: 0,
  offlineStretches: 0,
  serverErrors: 0,
  pushMs: [],
  pullMs: [],
  results: new Map(),
});

function recordResults(stats: LinkStats, body: unknown): void {
  for (const result of (body as PushResponse).results ?? []) {
    const seen = stats.results.get(result.mutationId) ?? [];
    seen.push(result);
    stats.results.set(result.mutationId, seen);
  }
}

/** The app's request signature over fetch, with the faults of a field link in front of it. */
function flakyRequester(
  baseUrl: string,
  token: string,
  faults: LinkFaults,
  random: () => number,
  stats: LinkStats,
  link: { on: boolean; offlineUntil: number },
): Requester {
  return async <S extends z.ZodType>(
    path: string,
    options: { method?: "GET" | "POST"; body?: unknown; schema: S },
  ): Promise<z.output<S>> => {
    const isPush = path.startsWith("/sync/push");
    if (link.on && Date.now() < link.offlineUntil) {
      stats.refusedOffline += 1;
      throw ApiError.network(new Error("tablet offline"));
    }
    if (link.on && random() < faults.refuse) {
      stats.refused += 1;
      throw ApiError.network(new Error("connection refused (injected)"));
    }
    const loseAnswer = link.on && random() < faults.loseAnswer;
    if (isPush) {
      stats.pushes += 1;
      stats.mutationsSent += (options.body as { mutations: unknown[] }).mutations.length;
    } else stats.pulls += 1;
    const t0 = performance.now();
    let response: Response;
    try {
      response = await fetch(`${baseUrl}/api${path}`, {
        method: options.method ?? "GET",
        headers: {
          accept: "application/json",
          "content-type": "application/json",
          authorization: `Bearer ${token}`,
          [requestHeader.name]: requestHeader.value,
        },
        body: options.body === undefined ? undefined : JSON.stringify(options.body),
      });
    } catch (cause) {
      throw ApiError.network(cause);
    }
    const text = await response.text();
    (isPush ? stats.pushMs : stats.pullMs).push(performance.now() - t0);
    const body: unknown = text === "" ? undefined : JSON.parse(text);
    if (isPush && response.ok) recordResults(stats, body);
    if (response.status >= 500) stats.serverErrors += 1;
    if (loseAnswer) {
      // The server has done the work; the tablet never hears of it.
      stats.answersLost += 1;
      throw ApiError.network(new Error("answer lost (injected)"));
    }
    if (!response.ok) {
      const parsed = errorBody.safeParse(body);
      if (parsed.success)
        throw new ApiError(response.status, parsed.data.error.code, parsed.data.error.message);
      throw new ApiError(response.status, "internal", `status ${response.status}`);
    }
    return options.schema.parse(body) as z.output<S>;
  };
}

export function loadTablet(options: {
  index: number;
  baseUrl: string;
  token: string;
  campaignId: string;
  faults: LinkFaults;
  random: () => number;
}): LoadTablet {
  const stats = newStats();
  const link = { on: true, offlineUntil: 0 };
  const db = openDatabase(`load-${options.index}-${crypto.randomUUID()}`, {
    indexedDB: new IDBFactory(),
    IDBKeyRange,
  });
  const request = flakyRequester(
    options.baseUrl,
    options.token,
    options.faults,
    options.random,
    stats,
    link,
  );
  const engine = createSyncEngine({
    db,
    transport: createHttpTransport(request),
    campaignIds: () => [options.campaignId],
    // Small batches and pages: more round trips, so more places for a fault to land.
    pushBatch: 8,
    pullPage: 50,
  });
  return {
    index: options.index,
    db,
    engine,
    stats,
    setFaults: (on) => (link.on = on),
    goOffline: (ms) => {
      stats.offlineStretches += 1;
      link.offlineUntil = Date.now() + ms;
    },
    lastMutationId: async () => (await readMeta<number>(db, "nextMutationId", 1)) - 1,
    clientId: () => readMeta<string>(db, "clientId", ""),
  };
}

/** The q-quantile (0..1) of `values`, nearest rank; 0 for none. */
export function quantile(values: number[], q: number): number {
  if (values.length === 0) return 0;
  const sorted = [...values].sort((a, b) => a - b);
  const rank = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[rank] ?? 0;
}

export const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
