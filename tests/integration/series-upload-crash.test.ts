// The server process is killed (SIGKILL) while a comparison series streams in, after several of
// its chunks were written inside the upload's transaction: nothing of the file is stored, and
// after a restart the same upload, sent again, stores every sample once.
import type { ChildProcess } from "node:child_process";
import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { comparisonChunks, comparisonFiles } from "../../server/db/schema";
import { demoPassword, seedDemo } from "../../server/seed/demo";
import { createTestDatabase, type TestDatabase } from "../helpers/db";
import { freePort, startServerProcess } from "../helpers/server-process";
import { seriesCsv, whiteFmSeries } from "../helpers/series";

const ROWS = 400_000;

let database: TestDatabase;
let server: ChildProcess | undefined;

beforeAll(async () => {
  database = await createTestDatabase();
  await seedDemo(database.db, "test");
});
afterAll(async () => {
  server?.kill("SIGKILL");
  await database.drop();
});

const stored = async (runId: string) => {
  const [files] = await database.db
    .select({ n: count() })
    .from(comparisonFiles)
    .where(eq(comparisonFiles.runId, runId));
  const [chunks] = await database.db
    .select({ n: count() })
    .from(comparisonChunks)
    .innerJoin(comparisonFiles, eq(comparisonFiles.id, comparisonChunks.fileId))
    .where(eq(comparisonFiles.runId, runId));
  return { files: files?.n ?? -1, chunks: chunks?.n ?? -1 };
};

describe("server killed mid-upload", () => {
  it("keeps nothing of the file, and the upload sent again stores it whole", async () => {
    const port = await freePort();
    const base = `http://127.0.0.1:${port}`;
    server = await startServerProcess(database.url, port);
    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: "POST",
      headers: { "content-type": "application/json", "x-equipot-request": "1" },
      body: JSON.stringify({ email: "geodesist@demo.equipot.test", password: demoPassword }),
    });
    const session = (await signIn.json()) as {
      accessToken: string;
      memberships: { campaignId: string }[];
    };
    const campaignId = session.memberships[0]?.campaignId ?? "";
    const auth = { authorization: `Bearer ${session.accessToken}` };
    const api = `${base}/api/campaigns/${campaignId}`;
    const post = async (path: string, body: unknown) => {
      const res = await fetch(`${api}${path}`, {
        method: "POST",
        headers: { ...auth, "content-type": "application/json" },
        body: JSON.stringify(body),
      });
      expect(res.status, await res.clone().text()).toBe(201);
      return res;
    };
    const sites = (await (await fetch(`${api}/sites`, { headers: auth })).json()) as {
      sites: { id: string }[];
    };
    const clock = async (name: string) => {
      const id = crypto.randomUUID();
      await post("/instruments", {
        id,
        instrument: { kind: "clock", name, instabilityAt1s: 1e-15, systematic: [] },
      });
      return id;
    };
    const runId = crypto.randomUUID();
    await post("/comparison-runs", {
      id: runId,
      run: {
        name: "Crash run",
        remoteSiteId: sites.sites[0]?.id,
        remoteClockId: await clock("Crash remote"),
        referenceClockId: await clock("Crash reference"),
        linkName: "fibre link",
        targetHeightUncertaintyM: 0.01,
      },
    });

    const csv = Buffer.from(
      seriesCsv(whiteFmSeries({ startUnixS: Date.UTC(2027, 6, 1) / 1000, count: ROWS, seed: 9 })),
    );
    const url = `${api}/comparison-runs/${runId}/files?fileName=crash.csv`;
    const headers = { ...auth, "content-type": "text/csv" };
    // The body trickles in: three quarters of it (several 65,536-sample chunks), then it stalls.
    let sent = 0;
    const stall = Math.floor(csv.length * 0.75);
    let stalled: () => void = () => undefined;
    const reachedStall = new Promise<void>((resolve) => (stalled = resolve));
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (sent >= stall) {
          stalled();
          return new Promise(() => undefined);
        }
        const piece = csv.subarray(sent, Math.min(sent + 256 * 1024, stall));
        sent += piece.length;
        controller.enqueue(piece);
        return new Promise((r) => setTimeout(r, 5));
      },
    });
    const inFlight = fetch(url, {
      method: "POST",
      headers,
      body,
      duplex: "half",
    } as RequestInit).then(
      (r) => r.status,
      () => "connection lost" as const,
    );
    await reachedStall;
    // Killed only once the upload's transaction has written chunks (its last statement was one).
    const deadline = Date.now() + 20_000;
    let writing = 0;
    while (writing === 0 && Date.now() < deadline) {
      const r = await database.pool.query<{ n: number }>(
        `select count(*)::int as n from pg_stat_activity
         where datname = current_database() and xact_start is not null
           and query like '%insert into comparison_chunks%'`,
      );
      writing = r.rows[0]?.n ?? 0;
      if (writing === 0) await new Promise((r) => setTimeout(r, 50));
    }
    expect(writing).toBeGreaterThan(0);
    server.kill("SIGKILL");
    expect(await inFlight).toBe("connection lost");
    expect(await stored(runId)).toEqual({ files: 0, chunks: 0 });

    server = await startServerProcess(database.url, port);
    const retry = await fetch(url, { method: "POST", headers, body: csv });
    expect(retry.status, await retry.clone().text()).toBe(201);
    const file = ((await retry.json()) as { file: { id: string; rowCount: number } }).file;
    expect(file.rowCount).toBe(ROWS);
    expect(await stored(runId)).toEqual({ files: 1, chunks: Math.ceil(ROWS / 65_536) });
  }, 120_000);
});
