import { Router } from "express";
import { z } from "zod";
import { instrumentCreateInput, instrumentUpdateInput } from "../../../shared/schemas/instruments";
import { requireAction, scope } from "../../middleware/authorize";
import { parseInput } from "../../middleware/validate";
import {
  createInstrument,
  deleteInstrument,
  editInstrument,
  getInstrument,
  instrumentHistory,
  listCampaignInstruments,
} from "../../services/instruments.service";
import type { GeodesyDeps } from "./geodesy.router";

const idParam = z.object({ instrumentId: z.uuid("Instrument id must be a UUID") });

export function instrumentsRouter({ db }: GeodesyDeps): Router {
  const router = Router({ mergeParams: true });
  router.get("/instruments", requireAction("campaign.read"), async (req, res) => {
    res.json({ instruments: await listCampaignInstruments(db, scope(req).campaignId) });
  });
  router.post("/instruments", requireAction("instrument.manage"), async (req, res) => {
    const input = parseInput(instrumentCreateInput, req.body);
    res.status(201).json({ instrument: await createInstrument(db, scope(req), input) });
  });
  router.get("/instruments/:instrumentId", requireAction("campaign.read"), async (req, res) => {
    const { instrumentId } = parseInput(idParam, req.params);
    res.json({ instrument: await getInstrument(db, scope(req).campaignId, instrumentId) });
  });
  router.get(
    "/instruments/:instrumentId/history",
    requireAction("campaign.read"),
    async (req, res) => {
      const { instrumentId } = parseInput(idParam, req.params);
      res.json({ revisions: await instrumentHistory(db, scope(req).campaignId, instrumentId) });
    },
  );
  router.put("/instruments/:instrumentId", requireAction("instrument.manage"), async (req, res) => {
    const { instrumentId } = parseInput(idParam, req.params);
    const input = parseInput(instrumentUpdateInput, req.body);
    res.json({ instrument: await editInstrument(db, scope(req), instrumentId, input) });
  });
  router.delete(
    "/instruments/:instrumentId",
    requireAction("instrument.manage"),
    async (req, res) => {
      const { instrumentId } = parseInput(idParam, req.params);
      await deleteInstrument(db, scope(req), instrumentId);
      res.status(204).end();
    },
  );
  return router;
}
