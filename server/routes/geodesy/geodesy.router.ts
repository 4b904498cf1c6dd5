import { Router } from "express";
import type { Logger } from "pino";
import type { Db } from "../../db/client";
import type { SciencePool } from "../../workers/science-pool";
import { benchmarksRouter } from "./benchmarks.router";
import { comparisonRunsRouter } from "./comparison-runs.router";
import { heightNetworkRouter } from "./height-network.router";
import { instrumentsRouter } from "./instruments.router";

export interface GeodesyDeps {
  db: Db;
  science: SciencePool;
  log: Logger;
}

/** Mounted under /api/campaigns/:campaignId after the membership check. */
export function geodesyRouter(deps: GeodesyDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(benchmarksRouter(deps));
  router.use(instrumentsRouter(deps));
  router.use(heightNetworkRouter(deps));
  router.use(comparisonRunsRouter(deps));
  return router;
}
