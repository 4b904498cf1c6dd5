// A series file streamed into PostgreSQL: the body is read as bytes, line by line (never held
// whole), each good sample goes into the current chunk, and full chunks are written as float8[]
// rows as the file arrives — all in one transaction, so a bad row, an overlap or a dropped
// connection leaves nothing.
import { Transform, type Readable } from "node:stream";
import { sql } from "drizzle-orm";
import type { z } from "zod";
import { sameInterval, type SeriesFileSummary } from "../../../shared/comparison";
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
import { chunkWriter, type ChunkWriter } from "./chunk-writer";
import { createLineSplitter } from "./line-splitter";
import { presentFile } from "./present";
import { liveRun } from "./runs";
import { createUploadReader, type UploadReader } from "./upload-reader";

type UploadQuery = z.output<typeof seriesUploadQuery>;

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

/** Bytes handed to the line splitter at a time, so a huge chunk cannot queue many inserts. */
const SLICE_BYTES = 1 << 20;

/** Reads the whole body into the reader and writer; true when it holds too many rows. */
async function readBody(
  input: Readable,
  reader: UploadReader,
  writer: ChunkWriter,
): Promise<boolean> {
  let tooMany = false;
  const splitter = createLineSplitter((buf, start, end, lineNo) => {
    reader.line(buf, start, end, lineNo);
    if (writer.full) {
      if (reader.failed) throw new Error("unreachable: a failed reader hands on no sample");
      writer.send();
    }
    if (lineNo > comparisonLimits.rowsMax + 1) {
      tooMany = true;
      splitter.stop();
    }
  });
  for await (const chunk of input as AsyncIterable<Buffer>) {
    for (let at = 0; at < chunk.length && !tooMany; at += SLICE_BYTES) {
      splitter.push(chunk.subarray(at, at + SLICE_BYTES));
      // One insert may stay in flight while the next chunk is parsed.
      await writer.settle(1);
    }
    if (tooMany) return true;
  }
  splitter.end();
  return false;
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
      const reader = createUploadReader({
        valueKind: query.valueKind,
        ...(query.nominalRatio !== undefined ? { nominalRatio: query.nominalRatio } : {}),
        onSample: (t, y) => writer.add(t, y),
      });
      const { counter, bytes } = byteCounter(comparisonLimits.fileBytesMax);
      body.on("error", (e) => counter.destroy(e));
      const tooMany = await readBody(body.pipe(counter), reader, writer).catch(async (e) => {
        // A chunk still on its way would otherwise reach the connection after the rollback.
        await writer.idle();
        throw e;
      });
      if (tooMany) {
        body.unpipe(counter);
        body.resume(); // let the rest drain so the answer reaches the client
      }
      const summary = reader.finish();
      const refused = refusal(summary, tooMany);
      if (refused !== null) {
        await writer.idle();
        throw refused;
      }
      writer.send();
      await writer.settle(0);
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
