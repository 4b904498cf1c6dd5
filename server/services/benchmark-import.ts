// A benchmark file in one transaction: every row checked first (shared/benchmark-import.ts), codes
// already in the campaign refused unless the file is meant to update them; one bad row and nothing
// is stored. The change positions are taken first: their lock keeps other benchmark writers out.
import { randomUUID } from "node:crypto";
import type { z } from "zod";
import { readBenchmarkFile, type ImportedBenchmark } from "../../shared/benchmark-import";
import type {
  benchmarkImportInput,
  benchmarkImportResult,
  ImportRowError,
} from "../../shared/schemas/benchmarks";
import { takeChangeSeqs } from "../db/change-seq";
import type { Db, Tx } from "../db/client";
import { recordAudits, type AuditEntry } from "../db/repositories/audit";
import {
  insertBenchmarks,
  listBenchmarksForUpdate,
  updateBenchmark,
  type BenchmarkRow,
} from "../db/repositories/benchmarks";
import { benchmarkEntity, presentBenchmark } from "./benchmarks.service";
import type { Scope } from "./revision";

type ImportInput = z.output<typeof benchmarkImportInput>;
type ImportResult = z.infer<typeof benchmarkImportResult>;

export type ImportOutcome =
  { ok: true; result: ImportResult } | { ok: false; message: string; rows: ImportRowError[] };

const refused = (rows: ImportRowError[], count: number, what: string): ImportOutcome => ({
  ok: false,
  message: `${count} ${count === 1 ? "problem" : "problems"} in ${what}; nothing was imported`,
  rows,
});

/** Rolled back by throwing: the transaction must not commit when a code is already taken. */
class Refused extends Error {
  constructor(readonly outcome: ImportOutcome) {
    super("import refused");
  }
}

function existingCodeErrors(
  file: ImportedBenchmark[],
  byCode: Map<string, BenchmarkRow>,
): ImportRowError[] {
  return file
    .filter((b) => byCode.has(b.code.toLowerCase()))
    .map((b) => ({
      row: b.row,
      field: "code",
      message: `Code "${b.code}" is already in the campaign (choose "update existing codes" to change it)`,
    }));
}

async function store(tx: Tx, scope: Scope, input: ImportInput, file: ImportedBenchmark[]) {
  const firstSeq = await takeChangeSeqs(tx, scope.campaignId, file.length);
  const live = await listBenchmarksForUpdate(tx, scope.campaignId);
  const byCode = new Map(live.map((row) => [row.code.toLowerCase(), row]));
  if (input.onExisting === "refuse") {
    const taken = existingCodeErrors(file, byCode);
    if (taken.length > 0)
      throw new Refused(refused(taken, taken.length, input.fileName || "the file"));
  }
  const now = new Date();
  const fresh = file.filter((b) => !byCode.has(b.code.toLowerCase()));
  const audits: AuditEntry[] = [];
  const inserted = await insertBenchmarks(
    tx,
    fresh.map(({ row: _row, ...fields }, i) => ({
      ...fields,
      id: randomUUID(),
      campaignId: scope.campaignId,
      version: 1,
      updatedAt: now,
      updatedBy: scope.userId,
      changeSeq: firstSeq + i,
    })),
  );
  for (const row of inserted)
    audits.push({
      ...scope,
      action: "create",
      entity: benchmarkEntity,
      entityId: row.id,
      after: presentBenchmark(row),
    });
  const changed = file.filter((b) => byCode.has(b.code.toLowerCase()));
  const updated: BenchmarkRow[] = [];
  for (const [i, { row: _row, ...fields }] of changed.entries()) {
    const current = byCode.get(fields.code.toLowerCase());
    if (!current) continue;
    const row = await updateBenchmark(tx, scope.campaignId, current.id, {
      ...fields,
      version: current.version + 1,
      updatedAt: now,
      updatedBy: scope.userId,
      changeSeq: firstSeq + fresh.length + i,
    });
    updated.push(row);
    audits.push({
      ...scope,
      action: "update",
      entity: benchmarkEntity,
      entityId: row.id,
      before: presentBenchmark(current),
      after: presentBenchmark(row),
    });
  }
  await recordAudits(tx, audits);
  return { inserted, updated };
}

export async function importBenchmarks(
  db: Db,
  scope: Scope,
  input: ImportInput,
): Promise<ImportOutcome> {
  const read = readBenchmarkFile(input.format, input.content);
  if (!read.ok) return refused(read.errors, read.errorCount, input.fileName || "the file");
  try {
    const { inserted, updated } = await db.transaction((tx) =>
      store(tx, scope, input, read.benchmarks),
    );
    const benchmarks = [...inserted, ...updated]
      .map(presentBenchmark)
      .sort((a, b) => a.code.localeCompare(b.code));
    return { ok: true, result: { created: inserted.length, updated: updated.length, benchmarks } };
  } catch (error) {
    if (error instanceof Refused) return error.outcome;
    throw error;
  }
}
