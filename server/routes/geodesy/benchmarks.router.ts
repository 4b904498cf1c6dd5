import { Router } from "express";
import { z } from "zod";
import {
  benchmarkCreateInput,
  benchmarkImportInput,
  benchmarkUpdateInput,
  type ImportRowError,
} from "../../../shared/schemas/benchmarks";
import { requireAction, scope } from "../../middleware/authorize";
import { parseInput } from "../../middleware/validate";
import { importBenchmarks } from "../../services/benchmark-import";
import {
  createBenchmark,
  deleteBenchmark,
  editBenchmark,
  listCampaignBenchmarks,
} from "../../services/benchmarks.service";
import type { GeodesyDeps } from "./geodesy.router";

const benchmarkIdParam = z.object({ benchmarkId: z.uuid("Benchmark id must be a UUID") });

/** The refused file's body: the one error shape, with the bad rows beside the message. */
interface InvalidFileBody {
  error: { code: "invalid_file"; message: string; rows: ImportRowError[] };
}

export function benchmarksRouter({ db }: GeodesyDeps): Router {
  const router = Router({ mergeParams: true });
  router.get("/benchmarks", requireAction("campaign.read"), async (req, res) => {
    res.json({ benchmarks: await listCampaignBenchmarks(db, scope(req).campaignId) });
  });
  router.post("/benchmarks", requireAction("benchmark.manage"), async (req, res) => {
    const input = parseInput(benchmarkCreateInput, req.body);
    res.status(201).json({ benchmark: await createBenchmark(db, scope(req), input) });
  });
  router.post("/benchmarks/import", requireAction("benchmark.manage"), async (req, res) => {
    const input = parseInput(benchmarkImportInput, req.body);
    const outcome = await importBenchmarks(db, scope(req), input);
    if (!outcome.ok) {
      const body: InvalidFileBody = {
        error: { code: "invalid_file", message: outcome.message, rows: outcome.rows },
      };
      res.status(422).json(body);
      return;
    }
    res.status(201).json(outcome.result);
  });
  router.put("/benchmarks/:benchmarkId", requireAction("benchmark.manage"), async (req, res) => {
    const { benchmarkId } = parseInput(benchmarkIdParam, req.params);
    const input = parseInput(benchmarkUpdateInput, req.body);
    res.json({ benchmark: await editBenchmark(db, scope(req), benchmarkId, input) });
  });
  router.delete("/benchmarks/:benchmarkId", requireAction("benchmark.manage"), async (req, res) => {
    const { benchmarkId } = parseInput(benchmarkIdParam, req.params);
    await deleteBenchmark(db, scope(req), benchmarkId);
    res.status(204).end();
  });
  return router;
}
