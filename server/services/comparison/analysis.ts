// The run's series analysis: claimed per data revision in PostgreSQL (so one process runs it once),
// computed in a worker thread (the API stays responsive), stored only while the revision it was
// computed for is still the run's. A lost worker or a restart leaves a "running" row that a later
// request takes over after ten minutes, or at once when the data moved on.
import { buildSeriesGrid } from "../../../shared/comparison";
import type { SeriesAnalysis } from "../../../shared/schemas/comparison";
import type { Db } from "../../db/client";
import {
  claimAnalysis,
  deleteAnalysis,
  findAnalysis,
  findRun,
  finishAnalysis,
  listFiles,
  runChunks,
} from "../../db/repositories/comparison";
import type { SciencePool } from "../../workers/science-pool";

export interface AnalysisDeps {
  db: Db;
  science: SciencePool;
  log?: { error: (object: unknown, message?: string) => void };
}

/** A running analysis older than this was lost with its worker (claimAnalysis agrees). */
const STALE_MS = 10 * 60_000;

/** Runs in the background; every outcome ends in the analysis row. */
export async function analyseRun(deps: AnalysisDeps, campaignId: string, runId: string) {
  const { db, science } = deps;
  const run = await findRun(db, campaignId, runId);
  if (!run || run.deletedAt) return;
  const revision = run.dataRevision;
  const files = await listFiles(db, campaignId, runId);
  if (files.length === 0) {
    await deleteAnalysis(db, runId);
    return;
  }
  if (!(await claimAnalysis(db, campaignId, runId, revision))) return;
  try {
    const tau0S = files[0]?.tau0S ?? 1;
    const grid = buildSeriesGrid(await runChunks(db, runId), tau0S);
    // The grid's buffer moves to the worker: no copy of up to 10⁷ doubles.
    const result = await science.run("analyseSeries", { t0: grid.t0, tau0S, values: grid.values }, [
      grid.values.buffer as ArrayBuffer,
    ]);
    const stored: SeriesAnalysis = { ...result, dataRevision: revision };
    await finishAnalysis(db, runId, revision, { state: "done", result: stored });
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    deps.log?.error({ err: error, runId }, "comparison analysis failed");
    await finishAnalysis(db, runId, revision, { state: "failed", error: message });
  }
}

/** Starts the analysis without waiting; a failure to even start is logged, never thrown. */
export function scheduleAnalysis(deps: AnalysisDeps, campaignId: string, runId: string): void {
  analyseRun(deps, campaignId, runId).catch((error: unknown) =>
    deps.log?.error({ err: error, runId }, "comparison analysis could not start"),
  );
}

export type AnalysisAnswer = {
  state: "none" | "running" | "done" | "failed";
  dataRevision: number | null;
  error: string | null;
  analysis: SeriesAnalysis | null;
};

/** The stored analysis as it stands; starts one when the data moved on and none is running. */
export async function currentAnalysis(
  deps: AnalysisDeps,
  run: { campaignId: string; id: string; dataRevision: number },
): Promise<AnalysisAnswer> {
  const row = await findAnalysis(deps.db, run.id);
  const behind = row === undefined || row.dataRevision !== run.dataRevision;
  if (behind && (await listFiles(deps.db, run.campaignId, run.id)).length === 0) {
    if (row !== undefined) await deleteAnalysis(deps.db, run.id);
    return { state: "none", dataRevision: null, error: null, analysis: null };
  }
  if (behind) {
    // An upload's own start was lost (a restart): start it now, and say it is running.
    scheduleAnalysis(deps, run.campaignId, run.id);
    return {
      state: "running",
      dataRevision: run.dataRevision,
      error: null,
      analysis: (row?.result as SeriesAnalysis | null | undefined) ?? null,
    };
  }
  if (row === undefined) return { state: "none", dataRevision: null, error: null, analysis: null };
  if (row.state === "running" && Date.now() - row.startedAt.getTime() > STALE_MS)
    scheduleAnalysis(deps, run.campaignId, run.id);
  return {
    state: row.state,
    dataRevision: row.dataRevision,
    error: row.error,
    analysis: (row.result as SeriesAnalysis | null) ?? null,
  };
}
