// Comparison runs, their files and chunked samples, and the stored analysis: queries only, always
// scoped by campaign.
import { and, asc, desc, eq, getTableColumns, isNull, sql } from "drizzle-orm";
import type { Queryable } from "../client";
import { idTaken } from "./taken-ids";
import {
  comparisonAnalyses,
  comparisonChunks,
  comparisonFiles,
  comparisonRuns,
  instruments,
  levellingAdjustments,
  sites,
  users,
} from "../schema";

export type ComparisonRunRow = typeof comparisonRuns.$inferSelect;
export type ComparisonFileRow = typeof comparisonFiles.$inferSelect & {
  uploadedByName: string | null;
};
export type ComparisonAnalysisRow = typeof comparisonAnalyses.$inferSelect;
export type InstrumentRow = typeof instruments.$inferSelect;

export const listRuns = (q: Queryable, campaignId: string) =>
  q
    .select()
    .from(comparisonRuns)
    .where(and(eq(comparisonRuns.campaignId, campaignId), isNull(comparisonRuns.deletedAt)))
    .orderBy(asc(comparisonRuns.createdAt));

export async function findRun(q: Queryable, campaignId: string, id: string, forUpdate = false) {
  const query = q
    .select()
    .from(comparisonRuns)
    .where(and(eq(comparisonRuns.campaignId, campaignId), eq(comparisonRuns.id, id)));
  const [row] = forUpdate ? await query.for("update") : await query;
  return row;
}

export const runIdTaken = (q: Queryable, id: string) => idTaken(q, comparisonRuns, id);

export async function insertRun(q: Queryable, values: typeof comparisonRuns.$inferInsert) {
  const [row] = await q.insert(comparisonRuns).values(values).returning();
  if (!row) throw new Error("insert returned no row");
  return row;
}

export async function updateRun(
  q: Queryable,
  campaignId: string,
  id: string,
  values: Partial<typeof comparisonRuns.$inferInsert>,
) {
  const [row] = await q
    .update(comparisonRuns)
    .set(values)
    .where(and(eq(comparisonRuns.campaignId, campaignId), eq(comparisonRuns.id, id)))
    .returning();
  if (!row) throw new Error("update returned no row");
  return row;
}

export const findSite = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(sites)
      .where(and(eq(sites.campaignId, campaignId), eq(sites.id, id)))
  )[0];

export const findInstrument = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(instruments)
      .where(and(eq(instruments.campaignId, campaignId), eq(instruments.id, id)))
  )[0];

const fileColumns = getTableColumns(comparisonFiles);

export const listFiles = (
  q: Queryable,
  campaignId: string,
  runId: string,
): Promise<ComparisonFileRow[]> =>
  q
    .select({ ...fileColumns, uploadedByName: users.name })
    .from(comparisonFiles)
    .leftJoin(users, eq(users.id, comparisonFiles.uploadedBy))
    .where(and(eq(comparisonFiles.campaignId, campaignId), eq(comparisonFiles.runId, runId)))
    .orderBy(asc(comparisonFiles.firstAt));

export const findFileWithName = async (
  q: Queryable,
  campaignId: string,
  id: string,
): Promise<ComparisonFileRow | undefined> =>
  (
    await q
      .select({ ...fileColumns, uploadedByName: users.name })
      .from(comparisonFiles)
      .leftJoin(users, eq(users.id, comparisonFiles.uploadedBy))
      .where(and(eq(comparisonFiles.campaignId, campaignId), eq(comparisonFiles.id, id)))
  )[0];

export const updateFile = (
  q: Queryable,
  id: string,
  values: Partial<typeof comparisonFiles.$inferInsert>,
) => q.update(comparisonFiles).set(values).where(eq(comparisonFiles.id, id));

/** Removes the run's analysis (when no data is left). */
export const deleteAnalysis = (q: Queryable, runId: string) =>
  q.delete(comparisonAnalyses).where(eq(comparisonAnalyses.runId, runId));

export async function insertFile(q: Queryable, values: typeof comparisonFiles.$inferInsert) {
  const [row] = await q.insert(comparisonFiles).values(values).returning();
  if (!row) throw new Error("insert returned no row");
  return row;
}

export const deleteFile = async (q: Queryable, campaignId: string, runId: string, id: string) =>
  (
    await q
      .delete(comparisonFiles)
      .where(
        and(
          eq(comparisonFiles.campaignId, campaignId),
          eq(comparisonFiles.runId, runId),
          eq(comparisonFiles.id, id),
        ),
      )
      .returning({ id: comparisonFiles.id })
  ).length > 0;

/** The run's chunks in time order (files by first time, chunks by number). */
export const runChunks = (q: Queryable, runId: string) =>
  q
    .select({ times: comparisonChunks.times, values: comparisonChunks.values })
    .from(comparisonChunks)
    .innerJoin(comparisonFiles, eq(comparisonFiles.id, comparisonChunks.fileId))
    .where(eq(comparisonFiles.runId, runId))
    .orderBy(asc(comparisonFiles.firstAt), asc(comparisonChunks.chunkNo));

export const findAnalysis = async (q: Queryable, runId: string) =>
  (await q.select().from(comparisonAnalyses).where(eq(comparisonAnalyses.runId, runId)))[0];

/** Claims the analysis of a data revision: true when this caller should run it. */
export async function claimAnalysis(
  q: Queryable,
  campaignId: string,
  runId: string,
  dataRevision: number,
) {
  const rows = await q
    .insert(comparisonAnalyses)
    .values({ runId, campaignId, dataRevision, state: "running", startedAt: new Date() })
    .onConflictDoUpdate({
      target: comparisonAnalyses.runId,
      set: { dataRevision, state: "running", error: null, startedAt: new Date(), finishedAt: null },
      // Not when this revision is done or being run by someone alive (10 min: a lost worker).
      setWhere: sql`not (${comparisonAnalyses.dataRevision} = ${dataRevision} and (${comparisonAnalyses.state} = 'done' or (${comparisonAnalyses.state} = 'running' and ${comparisonAnalyses.startedAt} > now() - interval '10 minutes')))`,
    })
    .returning({ runId: comparisonAnalyses.runId });
  return rows.length > 0;
}

/** Stores the outcome only while the revision is still the one asked for. */
export const finishAnalysis = (
  q: Queryable,
  runId: string,
  dataRevision: number,
  outcome: { state: "done"; result: unknown } | { state: "failed"; error: string },
) =>
  q
    .update(comparisonAnalyses)
    .set({
      state: outcome.state,
      result: outcome.state === "done" ? outcome.result : null,
      error: outcome.state === "failed" ? outcome.error : null,
      finishedAt: new Date(),
    })
    .where(
      and(eq(comparisonAnalyses.runId, runId), eq(comparisonAnalyses.dataRevision, dataRevision)),
    );

/** The campaign's most recent levelling adjustment (its stored AdjustmentView). */
export const latestAdjustmentResult = async (q: Queryable, campaignId: string) =>
  (
    await q
      .select({ result: levellingAdjustments.result })
      .from(levellingAdjustments)
      .where(eq(levellingAdjustments.campaignId, campaignId))
      .orderBy(desc(levellingAdjustments.computedAt))
      .limit(1)
  )[0]?.result;
