import { Router } from "express";
import type { Db } from "../../db/client";
import type { Storage } from "../../storage/storage";

export interface ExportsDeps {
  db: Db;
  storage: Storage;
}

/** Mounted under /api/campaigns/:campaignId/exports after the membership check. */
export function exportsRouter(_deps: ExportsDeps): Router {
  return Router({ mergeParams: true });
}

/** Mounted under /api/campaigns/import (before the membership check): an archive into a new campaign. */
export function archiveImportRouter(_deps: ExportsDeps): Router {
  return Router();
}
