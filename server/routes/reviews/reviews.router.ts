import { Router } from "express";
import type { Db } from "../../db/client";

export interface ReviewsDeps {
  db: Db;
  linkBase: () => string;
  onMailQueued: () => void;
}

/** Mounted under /api/campaigns/:campaignId after the membership check. */
export function reviewsRouter(_deps: ReviewsDeps): Router {
  return Router({ mergeParams: true });
}
