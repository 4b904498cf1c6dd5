import { Router } from "express";
import type { GeodesyDeps } from "./geodesy.router";

export function instrumentsRouter(_deps: GeodesyDeps): Router {
  const router = Router({ mergeParams: true });
  return router;
}
