import { and, asc, eq, isNull, ne, sql } from "drizzle-orm";
import type { Queryable } from "../client";
import { idTaken } from "./taken-ids";
import { benchmarks } from "../schema";

export type BenchmarkRow = typeof benchmarks.$inferSelect;
export type BenchmarkInsert = typeof benchmarks.$inferInsert;

export const listBenchmarks = (q: Queryable, campaignId: string) =>
  q
    .select()
    .from(benchmarks)
    .where(and(eq(benchmarks.campaignId, campaignId), isNull(benchmarks.deletedAt)))
    .orderBy(asc(benchmarks.code));

/** This campaign's benchmark, deleted or not, its row locked so writes to it are ordered. */
export const findBenchmarkForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(benchmarks)
      .where(and(eq(benchmarks.campaignId, campaignId), eq(benchmarks.id, id)))
      .for("update")
      .limit(1)
  )[0];

/** Any campaign: a client-made id that already exists anywhere is refused. */
export const benchmarkIdTaken = (q: Queryable, id: string) => idTaken(q, benchmarks, id);

/** A live benchmark of the campaign with this code (case ignored), other than `exceptId`. */
export const findLiveBenchmarkByCode = async (
  q: Queryable,
  campaignId: string,
  code: string,
  exceptId?: string,
) =>
  (
    await q
      .select()
      .from(benchmarks)
      .where(
        and(
          eq(benchmarks.campaignId, campaignId),
          isNull(benchmarks.deletedAt),
          sql`lower(${benchmarks.code}) = lower(${code})`,
          exceptId === undefined ? undefined : ne(benchmarks.id, exceptId),
        ),
      )
      .limit(1)
  )[0];

/** The live benchmarks, locked: an import updates some of them. */
export const listBenchmarksForUpdate = (q: Queryable, campaignId: string) =>
  q
    .select()
    .from(benchmarks)
    .where(and(eq(benchmarks.campaignId, campaignId), isNull(benchmarks.deletedAt)))
    .for("update");

export async function insertBenchmarks(
  q: Queryable,
  rows: BenchmarkInsert[],
): Promise<BenchmarkRow[]> {
  if (rows.length === 0) return [];
  return q.insert(benchmarks).values(rows).returning();
}

export async function updateBenchmark(
  q: Queryable,
  campaignId: string,
  id: string,
  patch: Partial<BenchmarkInsert>,
): Promise<BenchmarkRow> {
  const [updated] = await q
    .update(benchmarks)
    .set(patch)
    .where(and(eq(benchmarks.campaignId, campaignId), eq(benchmarks.id, id)))
    .returning();
  if (!updated) throw new Error("update of benchmarks returned no row");
  return updated;
}
