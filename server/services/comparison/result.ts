// The height result of a run, read together from its rows and decided by the shared core
// (shared/comparison/height-result.ts): ΔC and ΔH with the budget, the levelled ΔH, the time left.
import { computeHeightResult, type InstrumentFigures } from "../../../shared/comparison";
import type { HeightResultView } from "../../../shared/schemas/comparison";
import type { AdjustmentView } from "../../../shared/schemas/height-network";
import { findInstrument, findSite, latestAdjustmentResult } from "../../db/repositories/comparison";
import type { InstrumentRow } from "../../db/repositories/instruments";
import { currentAnalysis, type AnalysisDeps } from "./analysis";
import { presentRun } from "./present";
import { liveRun } from "./runs";

const figures = (row: InstrumentRow): InstrumentFigures => ({
  name: row.name,
  instabilityAt1s: row.instabilityAt1s,
  systematic: row.systematic as { name: string; value: number }[],
});

export async function runResult(
  deps: AnalysisDeps,
  campaignId: string,
  runId: string,
  now = new Date(),
): Promise<HeightResultView> {
  const { db } = deps;
  const run = await liveRun(db, campaignId, runId);
  const [site, remote, reference, link, adjustment, analysis] = await Promise.all([
    findSite(db, campaignId, run.remoteSiteId),
    findInstrument(db, campaignId, run.remoteClockId),
    findInstrument(db, campaignId, run.referenceClockId),
    run.linkId === null ? Promise.resolve(null) : findInstrument(db, campaignId, run.linkId),
    latestAdjustmentResult(db, campaignId),
    currentAnalysis(deps, run),
  ]);
  // Foreign keys keep these rows; deleted ones are tombstones and still carry their figures.
  if (!site || !remote || !reference || link === undefined)
    throw new Error(`comparison run ${run.id} names a site or instrument that is gone`);
  return computeHeightResult({
    run: presentRun(run),
    site: { latitudeDeg: site.latitudeDeg, approxHeightM: site.approxHeightM },
    remoteClock: figures(remote),
    referenceClock: figures(reference),
    link: link === null ? null : figures(link),
    analysis: analysis.analysis,
    analysisState: {
      state: analysis.state,
      dataRevision: analysis.dataRevision,
      error: analysis.error,
    },
    adjustment: (adjustment as AdjustmentView | undefined) ?? null,
    now,
  });
}
