import { Router } from "express";
import { z } from "zod";
import {
  checklistTemplateCreateInput,
  checklistTemplateUpdateInput,
} from "../../../shared/schemas/checklist-templates";
import type { Db } from "../../db/client";
import { requireAction, scope } from "../../middleware/authorize";
import { parseInput } from "../../middleware/validate";
import {
  createTemplate,
  deleteTemplate,
  editTemplate,
  listCampaignTemplates,
} from "../../services/checklist-templates.service";

const templateIdParam = z.object({ templateId: z.uuid("Template id must be a UUID") });

/**
 * Mounted under /api/campaigns/:campaignId/checklist-templates, after authentication and campaign
 * membership. Administrators edit in the office, online; tablets get the result through the pull.
 */
export function checklistTemplatesRouter(db: Db): Router {
  const router = Router({ mergeParams: true });

  router.get("/", requireAction("campaign.read"), async (req, res) => {
    res.json({ templates: await listCampaignTemplates(db, scope(req).campaignId) });
  });

  router.post("/", requireAction("checklist.template.write"), async (req, res) => {
    const input = parseInput(checklistTemplateCreateInput, req.body);
    res.status(201).json({ template: await createTemplate(db, scope(req), input) });
  });

  router.put("/:templateId", requireAction("checklist.template.write"), async (req, res) => {
    const { templateId } = parseInput(templateIdParam, req.params);
    const input = parseInput(checklistTemplateUpdateInput, req.body);
    res.json({ template: await editTemplate(db, scope(req), templateId, input) });
  });

  router.delete("/:templateId", requireAction("checklist.template.write"), async (req, res) => {
    const { templateId } = parseInput(templateIdParam, req.params);
    await deleteTemplate(db, scope(req), templateId);
    res.status(204).end();
  });
  return router;
}
