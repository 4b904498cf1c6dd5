import { Router } from "express";
import { z } from "zod";
import { crateCreateInput, crateUpdateInput } from "../../../shared/schemas/logistics";
import type { Db } from "../../db/client";
import { listCrates } from "../../db/repositories/crates-benchmarks";
import { requireAction, scope } from "../../middleware/authorize";
import { parseInput } from "../../middleware/validate";
import { presentCrate } from "../../presenters/crate-benchmark";
import { createCrate, deleteCrate, editCrate } from "../../services/crates.service";

const crateIdParam = z.object({ crateId: z.uuid("Crate id must be a UUID") });

/** Crates are edited here by logistics, online; tablets get them through the pull. Benchmarks: routes/geodesy. */
export function cratesBenchmarksRouter(db: Db): Router {
  const router = Router({ mergeParams: true });
  router.get("/crates", requireAction("campaign.read"), async (req, res) => {
    res.json({ crates: (await listCrates(db, scope(req).campaignId)).map(presentCrate) });
  });
  router.post("/crates", requireAction("crate.manage"), async (req, res) => {
    const input = parseInput(crateCreateInput, req.body);
    res.status(201).json({ crate: await createCrate(db, scope(req), input) });
  });
  router.put("/crates/:crateId", requireAction("crate.manage"), async (req, res) => {
    const { crateId } = parseInput(crateIdParam, req.params);
    const input = parseInput(crateUpdateInput, req.body);
    res.json({ crate: await editCrate(db, scope(req), crateId, input) });
  });
  router.delete("/crates/:crateId", requireAction("crate.manage"), async (req, res) => {
    const { crateId } = parseInput(crateIdParam, req.params);
    await deleteCrate(db, scope(req), crateId);
    res.status(204).end();
  });
  return router;
}
