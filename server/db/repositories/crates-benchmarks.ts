import { and, asc, eq, isNull } from "drizzle-orm";
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

export const listBenchmarks = (q: Queryable, campaignId: string) =>
  q
    .select()
    .from(benchmarks)
    .where(and(eq(benchmarks.campaignId, campaignId), isNull(benchmarks.deletedAt)))
    .orderBy(asc(benchmarks.code));
