// Series storage benchmark (not a test): `node --import tsx bench/series-storage.ts`.
// Why the samples are stored as float8[] chunks, and what an upload costs: the same samples
// (1) uploaded as CSV through the real upload path (stream → parse and check every row → 65,536-
// sample chunks, one transaction), against (2) a plain COPY of the same rows into a table of one
// row per sample; at 10⁶ and at 10⁷ rows. The upload runs in a child process that does nothing
// else, reading the file from disk as a stream, so its peak memory is the upload's: it must stay
// about the same at both sizes. Then, at 10⁶, the bytes each layout takes on disk (heap, TOAST
// and index) and the time to read the whole series back in order.
// Durable cluster (fsync on), loopback. Prints a table; runSeriesStorageBench() returns the rows.
// EQUIPOT_BENCH_SERIES sets the small size (default 10⁶), EQUIPOT_BENCH_SERIES_LARGE the large
// one (default 10⁷; 0 leaves it out).
import { execFile } from "node:child_process";
import { once } from "node:events";
import { createReadStream, createWriteStream, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pipeline } from "node:stream/promises";
import { fileURLToPath, pathToFileURL } from "node:url";
import { sql } from "drizzle-orm";
import { from as copyFrom } from "pg-copy-streams";
import { connect, type Database } from "../server/db/client";
import { withScope } from "../server/db/scope";
import { instruments, sites } from "../server/db/schema";
import { createRun } from "../server/services/comparison/runs";
import { uploadSeries } from "../server/services/comparison/upload";
import { median } from "./science/timing";
import { startBenchPostgres, type BenchPostgres } from "./sync/postgres";
import { seriesCsv, whiteFmSeries } from "../tests/helpers/series";

export interface SeriesStorageRow {
  readonly name: string;
  readonly n: number;
  readonly medianMs: number | null;
  readonly baselineMs: number | null;
  readonly ratio: number | null;
  readonly limit: string;
  readonly pass: boolean | null;
  readonly note: string;
}

const SMALL = Number(process.env.EQUIPOT_BENCH_SERIES ?? 1_000_000);
const LARGE = Number(process.env.EQUIPOT_BENCH_SERIES_LARGE ?? 10_000_000);
const ROUNDS = 3;
/** Rounds at the large size: each takes about a minute with its COPY. */
const LARGE_ROUNDS = 2;
/**
 * "Flat": the upload's peak heap at the large size at most 1.2 × the small one's, and its peak
 * RSS at most 1.5 × (RSS also holds freed buffers the allocator keeps, which vary from run to
 * run). Holding the samples would add 16 B each — 160 MB at 10⁷ on about 180 MB — and fail both.
 */
const FLAT = { heap: 1.2, rss: 1.5 };
const CHILD_ENV = "EQUIPOT_BENCH_SERIES_CHILD";

interface RunIds {
  campaignId: string;
  runId: string;
  userId: string;
}

async function newRun(database: Database): Promise<RunIds> {
  const { db } = database;
  const [site] = await db.select().from(sites).limit(1);
  const user = await db.execute<{ id: string }>(sql`select id from users limit 1`);
  const userId = user.rows[0]?.id ?? "";
  if (!site) throw new Error("the bench template has no site");
  const ids = [crypto.randomUUID(), crypto.randomUUID()];
  await db.insert(instruments).values(
    ids.map((id, i) => ({
      id,
      campaignId: site.campaignId,
      kind: "clock" as const,
      name: `Bench clock ${i}`,
      instabilityAt1s: 1e-15,
      systematic: [],
    })),
  );
  const runId = crypto.randomUUID();
  await createRun(
    db,
    { campaignId: site.campaignId, userId },
    {
      id: runId,
      run: {
        name: "bench",
        remoteSiteId: site.id,
        remoteClockId: ids[0] ?? "",
        referenceClockId: ids[1] ?? "",
        linkId: null,
        linkName: "bench link",
        remoteMark: "",
        referenceHeightM: null,
        referenceHeightSigmaM: null,
        targetHeightUncertaintyM: 0.01,
        plannedUptime: 0.7,
        notes: "",
      },
    },
  );
  return { campaignId: site.campaignId, runId, userId };
}

async function relationBytes(database: Database, table: string): Promise<number> {
  const r = await database.pool.query<{ n: string }>(
    `select pg_total_relation_size('${table}')::bigint as n`,
  );
  return Number(r.rows[0]?.n ?? 0);
}

/** The CSV the upload reads and the COPY text of the same (t, y), written to disk in blocks. */
async function writeFiles(dir: string, n: number): Promise<{ csv: string; copy: string }> {
  const series = whiteFmSeries({ startUnixS: Date.UTC(2027, 6, 1) / 1000, count: n, seed: 4 });
  const paths = { csv: join(dir, `series-${n}.csv`), copy: join(dir, `series-${n}.tsv`) };
  const csv = createWriteStream(paths.csv);
  const copy = createWriteStream(paths.copy);
  const block = 100_000;
  for (let i = 0; i < n; i += block) {
    const part = {
      times: series.times.subarray(i, i + block),
      values: series.values.subarray(i, i + block),
    };
    const text = seriesCsv(part);
    // seriesCsv starts every block with the header: keep only the first.
    csv.write(i === 0 ? text : text.slice(text.indexOf("\n") + 1));
    copy.write(Array.from(part.times, (t, k) => `${t}\t${part.values[k]}\n`).join(""));
    // Either may have drained already: wait only for one that still needs to.
    if (csv.writableNeedDrain) await once(csv, "drain");
    if (copy.writableNeedDrain) await once(copy, "drain");
  }
  await Promise.all([
    new Promise<void>((r) => csv.end(() => r())),
    new Promise<void>((r) => copy.end(() => r())),
  ]);
  return paths;
}

interface ChildResult {
  ms: number;
  ok: boolean;
  message: string;
  fileId: string;
  rows: number;
  /** Peak resident set of the whole child process (kernel's figure), MB. */
  peakRssMB: number;
  /** Resident set just before the upload started, MB. */
  startRssMB: number;
  /** Peak JavaScript heap in use, sampled every 10 ms during the upload, MB. */
  peakHeapMB: number;
}

/** The upload side, in its own process: reads the file as a stream into uploadSeries. */
async function uploadChild(args: { url: string; csv: string; ids: RunIds }): Promise<void> {
  const database = connect(args.url, 2);
  try {
    const mb = (b: number) => b / 2 ** 20;
    const startRssMB = mb(process.memoryUsage.rss());
    let peakHeap = process.memoryUsage().heapUsed;
    const sampler = setInterval(() => {
      peakHeap = Math.max(peakHeap, process.memoryUsage().heapUsed);
    }, 10);
    const t0 = performance.now();
    // As a request would: the application's role, scoped to the campaign.
    const scope = { user: args.ids.userId, campaigns: [args.ids.campaignId] };
    const outcome = await withScope(scope, () =>
      uploadSeries(
        database.db,
        { campaignId: args.ids.campaignId, userId: args.ids.userId },
        args.ids.runId,
        { fileName: "bench.csv", valueKind: "fractional" },
        createReadStream(args.csv),
      ),
    );
    const ms = performance.now() - t0;
    clearInterval(sampler);
    peakHeap = Math.max(peakHeap, process.memoryUsage().heapUsed);
    const result: ChildResult = {
      ms,
      ok: outcome.ok,
      message: outcome.ok ? "" : outcome.message,
      fileId: outcome.ok ? outcome.file.id : "",
      rows: outcome.ok ? outcome.file.rowCount : 0,
      peakRssMB: process.resourceUsage().maxRSS / 1024,
      startRssMB,
      peakHeapMB: mb(peakHeap),
    };
    process.stdout.write(JSON.stringify(result));
  } finally {
    await database.close();
  }
}

function runUploadChild(url: string, csv: string, ids: RunIds): Promise<ChildResult> {
  const self = fileURLToPath(import.meta.url);
  return new Promise((resolve, reject) => {
    execFile(
      process.execPath,
      ["--import", "tsx", self],
      { env: { ...process.env, [CHILD_ENV]: JSON.stringify({ url, csv, ids }) } },
      (error, stdout, stderr) => {
        if (error) reject(new Error(`upload child failed: ${stderr.slice(-2000)}`));
        else resolve(JSON.parse(stdout) as ChildResult);
      },
    );
  });
}

async function copyRows(database: Database, copyPath: string, fileId: string): Promise<number> {
  await database.pool.query(
    "create table bench_samples (file_id uuid not null, t float8 not null, y float8 not null, primary key (file_id, t))",
  );
  const client = await database.pool.connect();
  try {
    const t0 = performance.now();
    await client.query("begin");
    // The file id is constant: a column default keeps the COPY text to the two numbers.
    await client.query(`alter table bench_samples alter column file_id set default '${fileId}'`);
    await pipeline(
      createReadStream(copyPath),
      client.query(copyFrom("copy bench_samples (t, y) from stdin")),
    );
    await client.query("commit");
    return performance.now() - t0;
  } finally {
    client.release();
  }
}

interface SizeResult {
  n: number;
  uploads: number[];
  copies: number[];
  peakRssMB: number;
  startRssMB: number;
  peakHeapMB: number;
  bytes: { chunks: number; rows: number };
  reads: { chunks: number[]; rows: number[] };
}

async function measureSize(
  postgres: BenchPostgres,
  dir: string,
  n: number,
  rounds: number,
  readBack: boolean,
): Promise<SizeResult> {
  const files = await writeFiles(dir, n);
  const result: SizeResult = {
    n,
    uploads: [],
    copies: [],
    peakRssMB: 0,
    startRssMB: 0,
    peakHeapMB: 0,
    bytes: { chunks: 0, rows: 0 },
    reads: { chunks: [], rows: [] },
  };
  try {
    for (let r = 0; r < rounds; r++) {
      const fresh = await postgres.fresh();
      const database = connect(fresh.ownerUrl, 2);
      try {
        const ids = await newRun(database);
        const up = await runUploadChild(fresh.url, files.csv, ids);
        if (!up.ok) throw new Error(`bench upload refused: ${up.message}`);
        if (up.rows !== n) throw new Error(`bench upload stored ${up.rows} rows of ${n}`);
        result.uploads.push(up.ms);
        result.peakRssMB = Math.max(result.peakRssMB, up.peakRssMB);
        result.startRssMB = Math.max(result.startRssMB, up.startRssMB);
        result.peakHeapMB = Math.max(result.peakHeapMB, up.peakHeapMB);
        result.copies.push(await copyRows(database, files.copy, up.fileId));
        result.bytes = {
          chunks: await relationBytes(database, "comparison_chunks"),
          rows: await relationBytes(database, "bench_samples"),
        };
        if (readBack) {
          let t0 = performance.now();
          await database.pool.query(
            "select times, values from comparison_chunks order by chunk_no",
          );
          result.reads.chunks.push(performance.now() - t0);
          t0 = performance.now();
          await database.pool.query("select t, y from bench_samples order by file_id, t");
          result.reads.rows.push(performance.now() - t0);
        }
      } finally {
        await database.close();
        await fresh.drop();
      }
    }
  } finally {
    rmSync(files.csv, { force: true });
    rmSync(files.copy, { force: true });
  }
  return result;
}

const count = (n: number) => n.toLocaleString("en");
const mb = (b: number) => `${(b / 1e6).toFixed(1)} MB`;

function uploadRow(s: SizeResult): SeriesStorageRow {
  const upload = median(s.uploads);
  const copy = median(s.copies);
  return {
    name: `series upload, ${count(s.n)} CSV rows → float8[] chunks`,
    n: s.n,
    medianMs: upload,
    baselineMs: copy,
    ratio: upload / copy,
    limit: "≤ 2 × COPY",
    pass: upload / copy <= 2,
    note: `${s.uploads.length} rounds; baseline: COPY of the same (t, y) rows into one row per sample (parsed numbers, no CSV checks); the upload also reads ISO times, checks every row, finds τ0 and gaps; upload process peak RSS ${s.peakRssMB.toFixed(0)} MB (${s.startRssMB.toFixed(0)} MB before it), peak heap ${s.peakHeapMB.toFixed(0)} MB`,
  };
}

export async function runSeriesStorageBench(): Promise<SeriesStorageRow[]> {
  const postgres = await startBenchPostgres();
  const dir = mkdtempSync(join(tmpdir(), "equipot-series-bench-"));
  try {
    const small = await measureSize(postgres, dir, SMALL, ROUNDS, true);
    const large = LARGE > 0 ? await measureSize(postgres, dir, LARGE, LARGE_ROUNDS, false) : null;
    const readChunks = median(small.reads.chunks);
    const readRows = median(small.reads.rows);
    const rows: SeriesStorageRow[] = [uploadRow(small)];
    if (large !== null) {
      const growth = large.peakRssMB / small.peakRssMB;
      const heapGrowth = large.peakHeapMB / small.peakHeapMB;
      rows.push(uploadRow(large), {
        name: `series upload memory, ${count(LARGE)} vs ${count(SMALL)} rows`,
        n: LARGE,
        medianMs: null,
        baselineMs: null,
        ratio: growth,
        limit: `peak heap ≤ ${FLAT.heap} ×, RSS ≤ ${FLAT.rss} ×`,
        pass: heapGrowth <= FLAT.heap && growth <= FLAT.rss,
        note: `ratio is of peak RSS; upload process peak RSS ${large.peakRssMB.toFixed(0)} MB vs ${small.peakRssMB.toFixed(0)} MB, peak heap ${large.peakHeapMB.toFixed(0)} MB vs ${small.peakHeapMB.toFixed(0)} MB (file ${count(LARGE / SMALL)}× larger)`,
      });
    }
    const n = SMALL;
    rows.push(
      {
        name: "series on disk: float8[] chunks vs one row per sample",
        n,
        medianMs: null,
        baselineMs: null,
        ratio: small.bytes.chunks / small.bytes.rows,
        limit: "—",
        pass: null,
        note: `chunks ${mb(small.bytes.chunks)} (${(small.bytes.chunks / n).toFixed(1)} B/sample), rows ${mb(small.bytes.rows)} (${(small.bytes.rows / n).toFixed(1)} B/sample) with their primary key`,
      },
      {
        name: "series read back whole, in order",
        n,
        medianMs: readChunks,
        baselineMs: readRows,
        ratio: readChunks / readRows,
        limit: "—",
        pass: null,
        note: `chunks ${readChunks.toFixed(0)} ms vs rows ${readRows.toFixed(0)} ms (node-postgres, parsed into numbers)`,
      },
    );
    return rows;
  } finally {
    rmSync(dir, { recursive: true, force: true });
    postgres.stop();
  }
}

export function printSeriesStorageRows(rows: readonly SeriesStorageRow[]): void {
  console.log("\nSeries storage");
  console.table(
    rows.map((r) => ({
      benchmark: r.name,
      "median ms": r.medianMs?.toFixed(0) ?? "—",
      "baseline ms": r.baselineMs?.toFixed(0) ?? "—",
      ratio: r.ratio?.toFixed(2) ?? "—",
      goal: r.limit,
      pass: r.pass === null ? "—" : r.pass ? "yes" : "NO",
      note: r.note,
    })),
  );
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const child = process.env[CHILD_ENV];
  if (child !== undefined)
    await uploadChild(JSON.parse(child) as Parameters<typeof uploadChild>[0]);
  else printSeriesStorageRows(await runSeriesStorageBench());
}
