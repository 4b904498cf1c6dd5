import { Router } from "express";
import type { GeodesyDeps } from "./geodesy.router";

export function heightNetworkRouter(_deps: GeodesyDeps): Router {
  const router = Router({ mergeParams: true });
  return router;
}
