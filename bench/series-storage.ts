// Series storage benchmark (not a test): `node --import tsx bench/series-storage.ts`.
// Why the samples are stored as float8[] chunks: the same 10⁶ samples (1) uploaded as CSV through
// the real upload path (stream → parse → 65,536-sample chunks, one transaction), against (2) a
// plain COPY of the same rows into a table of one row per sample; then the bytes each layout takes
// on disk (heap, TOAST and index) and the time to read the whole series back in order.
// Durable cluster (fsync on), loopback. Prints a table; runSeriesStorageBench() returns the rows.
import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { pathToFileURL } from "node:url";
import { sql } from "drizzle-orm";
import { from as copyFrom } from "pg-copy-streams";
import { connect, type Database } from "../server/db/client";
import { instruments, sites } from "../server/db/schema";
import { createRun } from "../server/services/comparison/runs";
import { uploadSeries } from "../server/services/comparison/upload";
import { median } from "./science/timing";
import { startBenchPostgres } from "./sync/postgres";
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

const N = Number(process.env.EQUIPOT_BENCH_SERIES ?? 1_000_000);
const ROUNDS = 3;

async function newRun(
  database: Database,
): Promise<{ campaignId: string; runId: string; userId: string }> {
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

export async function runSeriesStorageBench(): Promise<SeriesStorageRow[]> {
  const postgres = await startBenchPostgres();
  try {
    const series = whiteFmSeries({ startUnixS: Date.UTC(2027, 6, 1) / 1000, count: N, seed: 4 });
    const csv = seriesCsv(series);
    const copyText =
      Array.from(series.times, (t, i) => `${t}\t${series.values[i]}`).join("\n") + "\n";
    const uploads: number[] = [];
    const copies: number[] = [];
    const reads = { chunks: [] as number[], rows: [] as number[] };
    let bytes = { chunks: 0, rows: 0 };
    for (let r = 0; r < ROUNDS; r++) {
      const fresh = await postgres.fresh();
      const database = connect(fresh.url, 2);
      try {
        const { campaignId, runId, userId } = await newRun(database);
        let t0 = performance.now();
        const outcome = await uploadSeries(
          database.db,
          { campaignId, userId },
          runId,
          { fileName: "bench.csv", valueKind: "fractional" },
          Readable.from([csv]),
        );
        uploads.push(performance.now() - t0);
        if (!outcome.ok) throw new Error(`bench upload refused: ${outcome.message}`);

        await database.pool.query(
          "create table bench_samples (file_id uuid not null, t float8 not null, y float8 not null, primary key (file_id, t))",
        );
        const client = await database.pool.connect();
        try {
          t0 = performance.now();
          await client.query("begin");
          // The file id is constant: a column default keeps the COPY text to the two numbers.
          await client.query(
            `alter table bench_samples alter column file_id set default '${outcome.file.id}'`,
          );
          await pipeline(
            Readable.from([copyText]),
            client.query(copyFrom("copy bench_samples (t, y) from stdin")),
          );
          await client.query("commit");
          copies.push(performance.now() - t0);
        } finally {
          client.release();
        }
        bytes = {
          chunks: await relationBytes(database, "comparison_chunks"),
          rows: await relationBytes(database, "bench_samples"),
        };
        t0 = performance.now();
        await database.pool.query("select times, values from comparison_chunks order by chunk_no");
        reads.chunks.push(performance.now() - t0);
        t0 = performance.now();
        await database.pool.query("select t, y from bench_samples order by file_id, t");
        reads.rows.push(performance.now() - t0);
      } finally {
        await database.close();
        await fresh.drop();
      }
    }
    const upload = median(uploads);
    const copy = median(copies);
    const readChunks = median(reads.chunks);
    const readRows = median(reads.rows);
    const mb = (b: number) => `${(b / 1e6).toFixed(1)} MB`;
    return [
      {
        name: `series upload, ${N.toLocaleString("en")} CSV rows → float8[] chunks`,
        n: N,
        medianMs: upload,
        baselineMs: copy,
        ratio: upload / copy,
        limit: "≤ 2 × COPY",
        pass: upload / copy <= 2,
        note: `${ROUNDS} rounds; baseline: COPY of the same (t, y) rows into one row per sample (parsed numbers, no CSV checks); the upload also reads ISO times, checks every row, finds τ0 and gaps`,
      },
      {
        name: "series on disk: float8[] chunks vs one row per sample",
        n: N,
        medianMs: null,
        baselineMs: null,
        ratio: bytes.chunks / bytes.rows,
        limit: "—",
        pass: null,
        note: `chunks ${mb(bytes.chunks)} (${(bytes.chunks / N).toFixed(1)} B/sample), rows ${mb(bytes.rows)} (${(bytes.rows / N).toFixed(1)} B/sample) with their primary key`,
      },
      {
        name: "series read back whole, in order",
        n: N,
        medianMs: readChunks,
        baselineMs: readRows,
        ratio: readChunks / readRows,
        limit: "—",
        pass: null,
        note: `chunks ${readChunks.toFixed(0)} ms vs rows ${readRows.toFixed(0)} ms (node-postgres, parsed into numbers)`,
      },
    ];
  } finally {
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
  printSeriesStorageRows(await runSeriesStorageBench());
}
