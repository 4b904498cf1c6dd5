import { and, asc, eq, gt, isNull } from "drizzle-orm";
import type { Queryable } from "../client";
import { benchmarks, crates } from "../schema";

export type CrateRow = typeof crates.$inferSelect;
export type BenchmarkRow = typeof benchmarks.$inferSelect;

export const listCrates = (q: Queryable, campaignId: string) =>
  q
    .select()
    .from(crates)
    .where(and(eq(crates.campaignId, campaignId), isNull(crates.deletedAt)))
    .orderBy(asc(crates.label));

/** A crate of this campaign that has not been deleted. */
export const findCrate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(crates)
      .where(and(eq(crates.campaignId, campaignId), eq(crates.id, id), isNull(crates.deletedAt)))
      .limit(1)
  )[0];

// Deleted crates are left out: the crate view has no tombstone yet (editing comes with logistics).
export const cratesAfter = (q: Queryable, campaignId: string, cursor: number, limit: number) =>
  q
    .select()
    .from(crates)
    .where(
      and(
        eq(crates.campaignId, campaignId),
        gt(crates.changeSeq, cursor),
        isNull(crates.deletedAt),
      ),
    )
    .orderBy(asc(crates.changeSeq))
    .limit(limit);

export const listBenchmarks = (q: Queryable, campaignId: string) =>
  q
    .select()
    .from(benchmarks)
    .where(and(eq(benchmarks.campaignId, campaignId), isNull(benchmarks.deletedAt)))
    .orderBy(asc(benchmarks.code));
