// Geodesists keep the campaign's benchmarks online. Codes are unique among live benchmarks of a
// campaign (case ignored); the change position is taken before the code check, so the campaign's
// counter row lock orders two writers and neither can slip in the same code.
import type { z } from "zod";
import type {
  benchmarkCreateInput,
  benchmarkUpdateInput,
  BenchmarkView,
} from "../../shared/schemas/benchmarks";
import { lockChangeStream, nextChangeSeq } from "../db/change-seq";
import type { Db, Tx } from "../db/client";
import { recordAudit } from "../db/repositories/audit";
import {
  benchmarkIdTaken,
  findBenchmarkForUpdate,
  findLiveBenchmarkByCode,
  insertBenchmarks,
  listBenchmarks,
  updateBenchmark,
  type BenchmarkRow,
} from "../db/repositories/benchmarks";
import { conflict, notFound } from "../http-errors";
import { nextRevision, tombstoneRevision, type Scope } from "./revision";

type CreateInput = z.output<typeof benchmarkCreateInput>;
type UpdateInput = z.output<typeof benchmarkUpdateInput>;

export const benchmarkEntity = "benchmark";

export const presentBenchmark = (row: BenchmarkRow): BenchmarkView => ({
  id: row.id,
  campaignId: row.campaignId,
  code: row.code,
  description: row.description,
  latitudeDeg: row.latitudeDeg,
  longitudeDeg: row.longitudeDeg,
  heightM: row.heightM,
  heightSigmaM: row.heightSigmaM,
  heightSystem: row.heightSystem,
  datum: row.datum,
  source: row.source,
  version: row.version,
  updatedAt: row.updatedAt.toISOString(),
});

export const listCampaignBenchmarks = async (db: Db, campaignId: string) =>
  (await listBenchmarks(db, campaignId)).map(presentBenchmark);

async function refuseTakenCode(tx: Tx, campaignId: string, code: string, exceptId?: string) {
  const other = await findLiveBenchmarkByCode(tx, campaignId, code, exceptId);
  if (other) throw conflict(`The code "${other.code}" is already used by another benchmark`);
}

export async function createBenchmark(
  db: Db,
  scope: Scope,
  input: CreateInput,
): Promise<BenchmarkView> {
  return db.transaction(async (tx) => {
    const changeSeq = await nextChangeSeq(tx, scope.campaignId);
    if (await benchmarkIdTaken(tx, input.id))
      throw conflict("A benchmark with this id already exists");
    await refuseTakenCode(tx, scope.campaignId, input.benchmark.code);
    const [row] = await insertBenchmarks(tx, [
      {
        ...input.benchmark,
        id: input.id,
        campaignId: scope.campaignId,
        version: 1,
        updatedBy: scope.userId,
        changeSeq,
      },
    ]);
    if (!row) throw new Error("insert into benchmarks returned no row");
    const after = presentBenchmark(row);
    await recordAudit(tx, {
      ...scope,
      action: "create",
      entity: benchmarkEntity,
      entityId: row.id,
      after,
    });
    return after;
  });
}

export async function editBenchmark(
  db: Db,
  scope: Scope,
  id: string,
  input: UpdateInput,
): Promise<BenchmarkView> {
  return db.transaction(async (tx) => {
    await lockChangeStream(tx, scope.campaignId);
    const current = await findBenchmarkForUpdate(tx, scope.campaignId, id);
    if (!current || current.deletedAt) throw notFound("Benchmark not found");
    if (current.version !== input.baseVersion) {
      throw conflict(
        `Benchmark ${current.code} was changed by someone else (now version ${current.version}). Reload it and edit again.`,
      );
    }
    const revision = await nextRevision(tx, scope, current);
    await refuseTakenCode(tx, scope.campaignId, input.benchmark.code, id);
    const row = await updateBenchmark(tx, scope.campaignId, id, {
      ...input.benchmark,
      ...revision,
    });
    const after = presentBenchmark(row);
    await recordAudit(tx, {
      ...scope,
      action: "update",
      entity: benchmarkEntity,
      entityId: id,
      before: presentBenchmark(current),
      after,
    });
    return after;
  });
}

/** A tombstone: runs and ties that named the benchmark keep their record of it. */
export async function deleteBenchmark(db: Db, scope: Scope, id: string): Promise<void> {
  await db.transaction(async (tx) => {
    await lockChangeStream(tx, scope.campaignId);
    const current = await findBenchmarkForUpdate(tx, scope.campaignId, id);
    if (!current || current.deletedAt) throw notFound("Benchmark not found");
    const row = await updateBenchmark(
      tx,
      scope.campaignId,
      id,
      await tombstoneRevision(tx, scope, current),
    );
    await recordAudit(tx, {
      ...scope,
      action: "delete",
      entity: benchmarkEntity,
      entityId: id,
      before: presentBenchmark(current),
      after: presentBenchmark(row),
    });
  });
}
