import { Router } from "express";
import { z } from "zod";
import { adjustmentOptions, heightTieImportInput } from "../../../shared/schemas/height-network";
import { latestAdjustment, listAdjustments } from "../../db/repositories/height-network";
import { requireAction, scope } from "../../middleware/authorize";
import { parseInput } from "../../middleware/validate";
import { presentObservation } from "../../presenters/height-network";
import { adjustNetwork } from "../../services/height-network/adjust";
import type { TieRowError } from "../../services/height-network/tie-file";
import {
  deleteTie,
  importTies,
  listCampaignTies,
  networkObservations,
} from "../../services/height-network.service";
import type { GeodesyDeps } from "./geodesy.router";

const tieIdParam = z.object({ tieId: z.uuid("Height tie id must be a UUID") });

/** The refused file's body: the one error shape, with the bad rows beside the message. */
interface InvalidFileBody {
  error: { code: "invalid_file"; message: string; rows: TieRowError[] };
}

export function heightNetworkRouter({ db, science }: GeodesyDeps): Router {
  const router = Router({ mergeParams: true });
  router.get("/height-ties", requireAction("campaign.read"), async (req, res) => {
    res.json({ ties: await listCampaignTies(db, scope(req).campaignId) });
  });
  router.post("/height-ties/import", requireAction("levelling.adjust"), async (req, res) => {
    const input = parseInput(heightTieImportInput, req.body);
    const outcome = await importTies(db, scope(req), input);
    if (!outcome.ok) {
      const body: InvalidFileBody = {
        error: { code: "invalid_file", message: outcome.message, rows: outcome.rows },
      };
      res.status(422).json(body);
      return;
    }
    res.status(201).json({ ties: outcome.ties });
  });
  router.delete("/height-ties/:tieId", requireAction("levelling.adjust"), async (req, res) => {
    const { tieId } = parseInput(tieIdParam, req.params);
    await deleteTie(db, scope(req), tieId);
    res.status(204).end();
  });
  router.get("/height-network/observations", requireAction("campaign.read"), async (req, res) => {
    const observations = await networkObservations(db, scope(req).campaignId);
    res.json({ observations: observations.map(presentObservation) });
  });
  router.post("/levelling-adjustments", requireAction("levelling.adjust"), async (req, res) => {
    const options = parseInput(adjustmentOptions, req.body ?? {});
    res.status(201).json({ adjustment: await adjustNetwork(db, science, scope(req), options) });
  });
  router.get("/levelling-adjustments/latest", requireAction("campaign.read"), async (req, res) => {
    // Never adjusted is a state the page shows, not an error: null with 200.
    res.json({ adjustment: await latestAdjustment(db, scope(req).campaignId) });
  });
  router.get("/levelling-adjustments", requireAction("campaign.read"), async (req, res) => {
    const rows = await listAdjustments(db, scope(req).campaignId);
    res.json({
      adjustments: rows.map((r) => ({
        ...r,
        computedAt: r.computedAt.toISOString(),
        passed: r.passed ?? null,
      })),
    });
  });
  return router;
}
