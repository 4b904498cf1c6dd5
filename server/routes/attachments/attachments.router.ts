import { Router, type Response } from "express";
import { pipeline } from "node:stream/promises";
import {
  attachmentNameHeader,
  attachmentParams,
  type AttachmentView,
} from "../../../shared/schemas/attachments";
import { requireAction, scope } from "../../middleware/authorize";
import { parseInput } from "../../middleware/validate";
import {
  attachmentMeta,
  openAttachment,
  uploadAttachment,
  type AttachmentDeps,
} from "../../services/attachments.service";
import {
  contentDisposition,
  declaredType,
  sanitiseFileName,
} from "../../services/attachments-content";

// Content-addressed bytes never change, so the browser may keep them for a year.
const immutable = "private, max-age=31536000, immutable";

function setFileHeaders(res: Response, view: AttachmentView): void {
  res.setHeader("Content-Type", view.contentType);
  res.setHeader("Content-Length", String(view.sizeBytes));
  res.setHeader(
    "Content-Disposition",
    contentDisposition(view.originalName, view.sha256, view.contentType),
  );
  res.setHeader("X-Content-Type-Options", "nosniff");
  res.setHeader("ETag", `"${view.sha256}"`);
  res.setHeader("Cache-Control", immutable);
}

function declaredBytes(header: string | undefined): number | undefined {
  const bytes = header === undefined ? NaN : Number(header);
  return Number.isSafeInteger(bytes) && bytes >= 0 ? bytes : undefined;
}

/** Mounted under /api/campaigns/:campaignId/attachments, after authentication and membership. */
export function attachmentsRouter(deps: AttachmentDeps): Router {
  const router = Router({ mergeParams: true });

  // The raw body is streamed by the service: no body parser runs for this route.
  router.put("/:sha256", requireAction("attachment.write"), async (req, res) => {
    const { sha256 } = parseInput(attachmentParams, req.params);
    const input = {
      sha256,
      declaredType: declaredType(req.get("content-type")),
      declaredBytes: declaredBytes(req.get("content-length")),
      name: sanitiseFileName(req.get(attachmentNameHeader)),
    };
    const result = await uploadAttachment(deps, scope(req), input, req);
    res.status(result.created ? 201 : 200).json({ attachment: result.attachment });
  });

  router.head("/:sha256", requireAction("campaign.read"), async (req, res) => {
    const { sha256 } = parseInput(attachmentParams, req.params);
    setFileHeaders(res, await attachmentMeta(deps.db, scope(req).campaignId, sha256));
    res.status(200).end();
  });

  router.get("/:sha256/meta", requireAction("campaign.read"), async (req, res) => {
    const { sha256 } = parseInput(attachmentParams, req.params);
    res.json({ attachment: await attachmentMeta(deps.db, scope(req).campaignId, sha256) });
  });

  router.get("/:sha256", requireAction("campaign.read"), async (req, res) => {
    const { sha256 } = parseInput(attachmentParams, req.params);
    const { attachment, object } = await openAttachment(deps, scope(req).campaignId, sha256);
    setFileHeaders(res, attachment);
    // Headers are sent by now: a storage failure mid-way can only cut the response short.
    await pipeline(object.stream, res).catch((err: unknown) =>
      req.log?.warn({ err }, "attachment stream failed"),
    );
  });
  return router;
}
