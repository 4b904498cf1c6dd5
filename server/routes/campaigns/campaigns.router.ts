import { Router } from "express";
import type { Logger } from "pino";
import { inviteInput } from "../../../shared/schemas/auth";
import type { Db } from "../../db/client";
import { listCampaignsOfUser, listMembers } from "../../db/repositories/campaigns";
import { requireAuth } from "../../middleware/authenticate";
import { campaignMember, requireAction, scope } from "../../middleware/authorize";
import { parseInput } from "../../middleware/validate";
import { createInvite } from "../../services/invites.service";
import type { Storage } from "../../storage/storage";
import type { SciencePool } from "../../workers/science-pool";
import { attachmentsRouter } from "../attachments/attachments.router";
import { checklistTemplatesRouter } from "../checklist-templates/checklist-templates.router";
import { cratesBenchmarksRouter } from "../crates/crates-benchmarks.router";
import { sitesRouter } from "../sites/sites.router";
import { geodesyRouter } from "../geodesy/geodesy.router";
import { archiveImportRouter, exportsRouter } from "../exports/exports.router";
import { reviewsRouter } from "../reviews/reviews.router";

export interface CampaignsRouterDeps {
  db: Db;
  linkBase: () => string;
  onMailQueued: () => void;
  storage: Storage;
  science: SciencePool;
  log: Logger;
}

/** Mounted under /api/campaigns after authentication. */
export function campaignsRouter({
  db,
  linkBase,
  onMailQueued,
  storage,
  science,
  log,
}: CampaignsRouterDeps): Router {
  const router = Router();

  router.get("/", async (req, res) => {
    res.json({ campaigns: await listCampaignsOfUser(db, requireAuth(req).userId) });
  });

  // A campaign archive becomes a new campaign: before the membership check of /:campaignId.
  router.use("/import", archiveImportRouter({ db, storage }));

  router.use("/:campaignId", campaignMember(db));

  router.get("/:campaignId/members", requireAction("member.read"), async (req, res) => {
    res.json({ members: await listMembers(db, scope(req).campaignId) });
  });

  router.post("/:campaignId/invites", requireAction("invite.create"), async (req, res) => {
    const input = parseInput(inviteInput, req.body);
    const invite = await createInvite(db, scope(req), input, linkBase());
    onMailQueued();
    res.status(201).json({ invite });
  });

  router.use("/:campaignId/sites", sitesRouter(db));
  router.use("/:campaignId", cratesBenchmarksRouter(db));
  router.use("/:campaignId/attachments", attachmentsRouter({ db, storage }));
  router.use("/:campaignId/checklist-templates", checklistTemplatesRouter(db));
  // Geodesy: benchmarks, instruments, the levelling network and comparison runs.
  router.use("/:campaignId", geodesyRouter({ db, science, log }));
  // Office review (queue, decisions, audit trail), exports and the campaign archive.
  router.use("/:campaignId", reviewsRouter({ db, linkBase, onMailQueued }));
  router.use("/:campaignId/exports", exportsRouter({ db, storage }));
  return router;
}
