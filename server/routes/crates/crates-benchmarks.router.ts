import { Router } from "express";
import type { Db } from "../../db/client";
import { listBenchmarks, listCrates } from "../../db/repositories/crates-benchmarks";
import { requireAction, scope } from "../../middleware/authorize";
import { presentBenchmark, presentCrate } from "../../presenters/crate-benchmark";

/** Read-only lists for now; editing arrives with the logistics and height-link work. */
export function cratesBenchmarksRouter(db: Db): Router {
  const router = Router({ mergeParams: true });
  router.get("/crates", requireAction("campaign.read"), async (req, res) => {
    res.json({ crates: (await listCrates(db, scope(req).campaignId)).map(presentCrate) });
  });
  router.get("/benchmarks", requireAction("campaign.read"), async (req, res) => {
    res.json({
      benchmarks: (await listBenchmarks(db, scope(req).campaignId)).map(presentBenchmark),
    });
  });
  return router;
}
