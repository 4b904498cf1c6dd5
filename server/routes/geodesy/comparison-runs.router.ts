import { Router } from "express";
import { z } from "zod";
import {
  comparisonLimits,
  comparisonRunCreateInput,
  comparisonRunUpdateInput,
  seriesUploadQuery,
} from "../../../shared/schemas/comparison";
import { HttpError } from "../../http-errors";
import { requireAction, scope } from "../../middleware/authorize";
import { parseInput } from "../../middleware/validate";
import { currentAnalysis, scheduleAnalysis } from "../../services/comparison/analysis";
import { removeFile } from "../../services/comparison/files";
import { runResult } from "../../services/comparison/result";
import {
  createRun,
  deleteRun,
  editRun,
  getRunWithFiles,
  listCampaignRuns,
  liveRun,
} from "../../services/comparison/runs";
import { uploadSeries } from "../../services/comparison/upload";
import type { GeodesyDeps } from "./geodesy.router";

const runParam = z.object({ runId: z.uuid("Run id must be a UUID") });
const fileParam = runParam.extend({ fileId: z.uuid("File id must be a UUID") });

export function comparisonRunsRouter(deps: GeodesyDeps): Router {
  const { db } = deps;
  const router = Router({ mergeParams: true });
  const base = "/comparison-runs";
  router.get(base, requireAction("campaign.read"), async (req, res) => {
    res.json({ runs: await listCampaignRuns(db, scope(req).campaignId) });
  });
  router.post(base, requireAction("comparison.manage"), async (req, res) => {
    const input = parseInput(comparisonRunCreateInput, req.body);
    res.status(201).json({ run: await createRun(db, scope(req), input) });
  });
  router.get(`${base}/:runId`, requireAction("campaign.read"), async (req, res) => {
    const { runId } = parseInput(runParam, req.params);
    res.json(await getRunWithFiles(db, scope(req).campaignId, runId));
  });
  router.put(`${base}/:runId`, requireAction("comparison.manage"), async (req, res) => {
    const { runId } = parseInput(runParam, req.params);
    const input = parseInput(comparisonRunUpdateInput, req.body);
    res.json({ run: await editRun(db, scope(req), runId, input) });
  });
  router.delete(`${base}/:runId`, requireAction("comparison.manage"), async (req, res) => {
    const { runId } = parseInput(runParam, req.params);
    await deleteRun(db, scope(req), runId);
    res.status(204).end();
  });

  // The body is the file's bytes (any text type), streamed: express.json leaves it alone.
  router.post(`${base}/:runId/files`, requireAction("comparison.manage"), async (req, res) => {
    const { runId } = parseInput(runParam, req.params);
    const query = parseInput(seriesUploadQuery, req.query);
    if (query.valueKind === "ratio" && query.nominalRatio === undefined)
      throw new HttpError(
        400,
        "validation_failed",
        "nominalRatio: a ratio file needs its nominal ratio",
        [{ path: "nominalRatio", message: "A ratio file needs its nominal ratio" }],
      );
    const declared = Number(req.headers["content-length"] ?? 0);
    if (declared > comparisonLimits.fileBytesMax)
      throw new HttpError(
        413,
        "payload_too_large",
        `A series file may hold at most ${comparisonLimits.fileBytesMax / 1e6} MB`,
      );
    const outcome = await uploadSeries(db, scope(req), runId, query, req);
    if (!outcome.ok) {
      res.status(422).json({
        error: {
          code: "invalid_file",
          message: outcome.message,
          rows: outcome.rows,
          badRows: outcome.badRows,
        },
      });
      return;
    }
    scheduleAnalysis(deps, scope(req).campaignId, runId);
    res.status(201).json({ file: outcome.file, dataRevision: outcome.dataRevision });
  });
  router.delete(
    `${base}/:runId/files/:fileId`,
    requireAction("comparison.manage"),
    async (req, res) => {
      const { runId, fileId } = parseInput(fileParam, req.params);
      await removeFile(db, scope(req), runId, fileId);
      scheduleAnalysis(deps, scope(req).campaignId, runId);
      res.status(204).end();
    },
  );

  router.get(`${base}/:runId/analysis`, requireAction("campaign.read"), async (req, res) => {
    const { runId } = parseInput(runParam, req.params);
    const run = await liveRun(db, scope(req).campaignId, runId);
    const answer = await currentAnalysis(deps, run);
    res.json({ state: answer.state, analysis: answer.analysis });
  });
  router.get(`${base}/:runId/result`, requireAction("campaign.read"), async (req, res) => {
    const { runId } = parseInput(runParam, req.params);
    res.json(await runResult(deps, scope(req).campaignId, runId));
  });
  return router;
}
