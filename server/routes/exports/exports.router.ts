import express, { Router, type RequestHandler, type Response } from "express";
import { z } from "zod";
import {
  archiveImportQuery,
  archiveLimits,
  archiveTable,
} from "../../../shared/schemas/campaign-archive";
import { officialHeightsCaution } from "../../../shared/schemas/comparison";
import type { Db } from "../../db/client";
import { isAdminOfAnyCampaign } from "../../db/repositories/campaign-import";
import { forbidden, HttpError } from "../../http-errors";
import { requireAuth } from "../../middleware/authenticate";
import { requireAction, scope } from "../../middleware/authorize";
import { parseInput } from "../../middleware/validate";
import { buildArchive } from "../../services/export/archive-build";
import { importArchive } from "../../services/export/archive-import";
import { exportFileName } from "../../services/export/csv";
import { exportGeoJson, exportTableCsv } from "../../services/export/table-export";
import type { Storage } from "../../storage/storage";

export interface ExportsDeps {
  db: Db;
  storage: Storage;
}

const tableParam = z.object({ table: archiveTable });

/** A download: the file name is generated (ASCII only), never taken from the request. */
function sendFile(res: Response, fileName: string, type: string, body: string | Buffer) {
  res.setHeader("Content-Type", type);
  res.setHeader("Content-Disposition", `attachment; filename="${fileName}"`);
  res.setHeader("X-Content-Type-Options", "nosniff");
  res.send(body);
}

/** Mounted under /api/campaigns/:campaignId/exports after the membership check. */
export function exportsRouter({ db, storage }: ExportsDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireAction("campaign.export"));

  router.get("/tables/:table.csv", async (req, res) => {
    const { table } = parseInput(tableParam, req.params);
    const out = await exportTableCsv(db, scope(req).campaignId, table, new Date());
    if (out.heights) res.setHeader("X-Equipot-Caution", officialHeightsCaution);
    sendFile(res, out.fileName, "text/csv; charset=utf-8", out.csv);
  });

  router.get("/geojson", async (req, res) => {
    const out = await exportGeoJson(db, scope(req).campaignId, new Date());
    sendFile(res, out.fileName, "application/geo+json", JSON.stringify(out.collection));
  });

  router.get("/archive.zip", async (req, res) => {
    const now = new Date();
    const out = await buildArchive({ db, storage }, scope(req).campaignId, now);
    res.setHeader("Content-Length", String(out.zip.byteLength));
    res.setHeader("X-Equipot-Caution", officialHeightsCaution);
    const body = Buffer.from(out.zip.buffer, out.zip.byteOffset, out.zip.byteLength);
    sendFile(res, exportFileName(out.campaignName, "archive", "zip", now), "application/zip", body);
  });
  return router;
}

/** Importing is for people who administer a campaign on this server. */
const adminSomewhere =
  (db: Db): RequestHandler =>
  async (req, _res, next) => {
    if (!(await isAdminOfAnyCampaign(db, requireAuth(req).userId)))
      throw forbidden("Importing an archive needs the admin role in at least one campaign");
    next();
  };

const zipBody = express.raw({ type: "application/zip", limit: archiveLimits.zipBytes });

/** Mounted under /api/campaigns/import (before the membership check): an archive into a new campaign. */
export function archiveImportRouter({ db, storage }: ExportsDeps): Router {
  const router = Router();
  router.post("/", adminSomewhere(db), zipBody, async (req, res) => {
    const { name } = parseInput(archiveImportQuery, req.query);
    const body: unknown = req.body;
    if (!Buffer.isBuffer(body) || body.length === 0)
      throw new HttpError(415, "bad_request", "Send the archive's bytes as application/zip");
    const result = await importArchive({ db, storage }, requireAuth(req).userId, name, body);
    res.status(201).json(result);
  });
  return router;
}
