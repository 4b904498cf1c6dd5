// A series file streamed into PostgreSQL: the body is read line by line (never held whole), each
// good sample goes into the current chunk, and full chunks are written as float8[] rows as the file
// arrives — all in one transaction, so a bad row, an overlap or a dropped connection leaves nothing.
import { createInterface } from "node:readline";
import { Transform, type Readable } from "node:stream";
import { sql } from "drizzle-orm";
import type { z } from "zod";
import {
  createSeriesReader,
  sameInterval,
  type SeriesFileSummary,
} from "../../../shared/comparison";
import {
  comparisonLimits,
  type ComparisonFileView,
  type SeriesRowError,
  type seriesUploadQuery,
} from "../../../shared/schemas/comparison";
import type { Db, Tx } from "../../db/client";
import { recordAudit } from "../../db/repositories/audit";
import {
  findFileWithName,
  insertFile,
  listFiles,
  updateFile,
} from "../../db/repositories/comparison";
import { comparisonRuns } from "../../db/schema";
import { conflict, HttpError } from "../../http-errors";
import type { Scope } from "../revision";
import { presentFile } from "./present";
import { liveRun } from "./runs";

type UploadQuery = z.output<typeof seriesUploadQuery>;

/** Samples per stored chunk: big enough that per-row overhead vanishes, small enough to stream. */
export const CHUNK_SAMPLES = 65_536;

export const fileEntity = "comparison-file";

export type UploadOutcome =
  | { ok: true; file: ComparisonFileView; dataRevision: number }
  | { ok: false; message: string; rows: SeriesRowError[]; badRows: number };

/** Thrown inside the transaction to roll it back with the refusal as the answer. */
class Refused extends Error {
  constructor(readonly outcome: Extract<UploadOutcome, { ok: false }>) {
    super(outcome.message);
  }
}

const tooLarge = () =>
  new HttpError(
    413,
    "payload_too_large",
    `A series file may hold at most ${comparisonLimits.fileBytesMax / 1e6} MB`,
  );

/** Counts the bytes as they pass and stops the stream past the limit. */
function byteCounter(limit: number) {
  let bytes = 0;
  const counter = new Transform({
    transform(chunk: Buffer, _encoding, done) {
      bytes += chunk.length;
      if (bytes > limit) done(tooLarge());
      else done(null, chunk);
    },
  });
  return { counter, bytes: () => bytes };
}

const pgArray = (values: ArrayLike<number>, length: number) => {
  // JavaScript prints the shortest text that reads back as the same double: lossless.
  const parts = new Array<string>(length);
  for (let i = 0; i < length; i++) {
    const v = values[i] ?? NaN;
    parts[i] = Number.isNaN(v) ? "NaN" : String(v);
  }
  return `{${parts.join(",")}}`;
};

function chunkWriter(tx: Tx, fileId: string) {
  const times = new Float64Array(CHUNK_SAMPLES);
  const values = new Float64Array(CHUNK_SAMPLES);
  let fill = 0;
  let chunkNo = 0;
  return {
    add(t: number, y: number) {
      times[fill] = t;
      values[fill] = y;
      fill++;
    },
    get full() {
      return fill === CHUNK_SAMPLES;
    },
    async flush() {
      if (fill === 0) return;
      await tx.execute(sql`
        insert into comparison_chunks (file_id, chunk_no, times, values)
        values (${fileId}, ${chunkNo}, ${pgArray(times, fill)}::float8[], ${pgArray(values, fill)}::float8[])`);
      chunkNo++;
      fill = 0;
    },
  };
}

function refusal(summary: SeriesFileSummary, rowsTooMany: boolean): Refused | null {
  if (rowsTooMany) {
    return new Refused({
      ok: false,
      message: `The file holds more than ${comparisonLimits.rowsMax.toLocaleString("en")} rows: split it into several files`,
      rows: [],
      badRows: 0,
    });
  }
  if (summary.badRows > 0) {
    const n = summary.badRows;
    return new Refused({
      ok: false,
      message: `${n} ${n === 1 ? "row is" : "rows are"} not readable; nothing was stored`,
      rows: summary.errors,
      badRows: n,
    });
  }
  if (summary.problem !== null)
    return new Refused({
      ok: false,
      message: `File refused: ${summary.problem}`,
      rows: [],
      badRows: 0,
    });
  return null;
}

const iso = (unixS: number) => new Date(Math.round(unixS * 1e3)).toISOString();

/** The run's other files must share τ0 and not overlap this one (half an interval of margin). */
async function refuseClash(
  tx: Tx,
  scope: Scope,
  runId: string,
  fileId: string,
  s: SeriesFileSummary,
) {
  const tau0 = s.tau0S ?? 0;
  const first = s.firstT ?? 0;
  const last = s.lastT ?? 0;
  for (const other of await listFiles(tx, scope.campaignId, runId)) {
    if (other.id === fileId) continue;
    if (!sameInterval(other.tau0S, tau0)) {
      throw new Refused({
        ok: false,
        message: `File refused: its sample interval ${tau0} s differs from ${other.tau0S} s of ${other.fileName}`,
        rows: [],
        badRows: 0,
      });
    }
    const otherFirst = other.firstAt.getTime() / 1e3;
    const otherLast = other.lastAt.getTime() / 1e3;
    if (first <= otherLast + tau0 / 2 && last >= otherFirst - tau0 / 2) {
      throw conflict(
        `The file's samples (${iso(first)} … ${iso(last)}) overlap ${other.fileName} (${other.firstAt.toISOString()} … ${other.lastAt.toISOString()}): remove that file first or upload only the new samples`,
      );
    }
  }
}

export async function uploadSeries(
  db: Db,
  scope: Scope,
  runId: string,
  query: UploadQuery,
  body: Readable,
): Promise<UploadOutcome> {
  try {
    return await db.transaction(async (tx) => {
      // Locked for the whole upload: two uploads to one run are ordered, and so is the revision.
      await liveRun(tx, scope.campaignId, runId, true);
      const placeholder = new Date(0);
      const fileId = (
        await insertFile(tx, {
          campaignId: scope.campaignId,
          runId,
          fileName: query.fileName,
          byteSize: 0,
          valueKind: query.valueKind,
          nominalRatio: query.nominalRatio ?? null,
          tau0S: 0,
          rowCount: 0,
          validCount: 0,
          firstAt: placeholder,
          lastAt: placeholder,
          gaps: {},
          uploadedBy: scope.userId,
        })
      ).id;
      const writer = chunkWriter(tx, fileId);
      const reader = createSeriesReader({
        valueKind: query.valueKind,
        ...(query.nominalRatio !== undefined ? { nominalRatio: query.nominalRatio } : {}),
        onSample: (t, y) => writer.add(t, y),
      });
      const { counter, bytes } = byteCounter(comparisonLimits.fileBytesMax);
      body.on("error", (e) => counter.destroy(e));
      const lines = createInterface({ input: body.pipe(counter), crlfDelay: Infinity });
      let lineNo = 0;
      let tooMany = false;
      for await (const raw of lines) {
        lineNo++;
        const text = lineNo === 1 ? raw.replace(/^\uFEFF/, "") : raw;
        reader.line(text, lineNo);
        if (writer.full) {
          if (reader.failed) throw new Error("unreachable: a failed reader hands on no sample");
          await writer.flush();
        }
        if (lineNo > comparisonLimits.rowsMax + 1) {
          tooMany = true;
          lines.close();
          body.resume(); // let the rest drain so the answer reaches the client
          break;
        }
      }
      const summary = reader.finish();
      const refused = refusal(summary, tooMany);
      if (refused !== null) throw refused;
      await writer.flush();
      await refuseClash(tx, scope, runId, fileId, summary);
      await updateFile(tx, fileId, {
        byteSize: bytes(),
        tau0S: summary.tau0S ?? 0,
        rowCount: summary.rows,
        validCount: summary.validRows,
        firstAt: new Date((summary.firstT ?? 0) * 1e3),
        lastAt: new Date((summary.lastT ?? 0) * 1e3),
        gaps: summary.gaps,
      });
      const [bumped] = await tx
        .update(comparisonRuns)
        .set({ dataRevision: sql`${comparisonRuns.dataRevision} + 1` })
        .where(sql`${comparisonRuns.id} = ${runId}`)
        .returning({ dataRevision: comparisonRuns.dataRevision });
      const row = await findFileWithName(tx, scope.campaignId, fileId);
      if (!row || !bumped) throw new Error("the stored file vanished inside its transaction");
      const file = presentFile(row);
      await recordAudit(tx, {
        ...scope,
        action: "create",
        entity: fileEntity,
        entityId: fileId,
        after: file,
      });
      return { ok: true as const, file, dataRevision: bumped.dataRevision };
    });
  } catch (error) {
    if (error instanceof Refused) return error.outcome;
    throw error;
  }
}
