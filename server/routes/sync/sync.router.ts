import { Router } from "express";
import { pullQuery, pushRequest } from "../../../shared/sync/protocol";
import type { Db } from "../../db/client";
import { findMembership } from "../../db/repositories/users";
import { requireAuth } from "../../middleware/authenticate";
import { notFound } from "../../http-errors";
import { parseInput } from "../../middleware/validate";
import { pull } from "../../services/sync/pull";
import { push } from "../../services/sync/push";

/** Mounted under /api/sync after authentication. */
export function syncRouter(db: Db): Router {
  const router = Router();

  // Membership is checked per mutation inside the push (a removed member's changes are kept).
  router.post("/push", async (req, res) => {
    const input = parseInput(pushRequest, req.body);
    res.json(await push(db, requireAuth(req).userId, input));
  });

  router.get("/pull", async (req, res) => {
    const query = parseInput(pullQuery, req.query);
    const { userId } = requireAuth(req);
    if (!(await findMembership(db, userId, query.campaign))) throw notFound("Campaign not found");
    res.json(await pull(db, userId, query));
  });
  return router;
}
