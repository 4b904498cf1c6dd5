import { Router } from "express";
import { z } from "zod";
import { siteCreateInput, siteUpdateInput } from "../../../shared/schemas/sites";
import type { Db } from "../../db/client";
import { requireAction, scope } from "../../middleware/authorize";
import { parseInput } from "../../middleware/validate";
import { createSite, deleteSite, editSite, listCampaignSites } from "../../services/sites.service";

const siteIdParam = z.object({ siteId: z.uuid("Site id must be a UUID") });

/** Mounted under /api/campaigns/:campaignId/sites, after authentication and campaign membership. */
export function sitesRouter(db: Db): Router {
  const router = Router({ mergeParams: true });

  router.get("/", requireAction("campaign.read"), async (req, res) => {
    res.json({ sites: await listCampaignSites(db, scope(req).campaignId) });
  });

  router.post("/", requireAction("site.write"), async (req, res) => {
    const input = parseInput(siteCreateInput, req.body);
    res.status(201).json({ site: await createSite(db, scope(req), input) });
  });

  router.patch("/:siteId", requireAction("site.write"), async (req, res) => {
    const { siteId } = parseInput(siteIdParam, req.params);
    const input = parseInput(siteUpdateInput, req.body);
    res.json({ site: await editSite(db, scope(req), siteId, input) });
  });

  router.delete("/:siteId", requireAction("site.delete"), async (req, res) => {
    const { siteId } = parseInput(siteIdParam, req.params);
    await deleteSite(db, scope(req), siteId);
    res.status(204).end();
  });
  return router;
}
