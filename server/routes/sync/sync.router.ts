import { Router } from "express";
import { pullQuery, pushRequest } from "../../../shared/sync/protocol";
import type { Db } from "../../db/client";
import { withScope } from "../../db/scope";
import { requireAuth } from "../../middleware/authenticate";
import { parseInput } from "../../middleware/validate";
import { pull } from "../../services/sync/pull";
import { push } from "../../services/sync/push";

/**
 * Mounted under /api/sync after authentication. `afterPush` runs once a push committed (it may have
 * queued alert e-mails: it wakes the sender).
 */
export function syncRouter(
  db: Db,
  linkBase?: () => string,
  afterPush: () => void = () => undefined,
): Router {
  const router = Router();

  // Membership is checked per mutation inside the push (a removed member's changes are kept).
  router.post("/push", async (req, res) => {
    const input = parseInput(pushRequest, req.body);
    const { userId } = requireAuth(req);
    // A push is for one campaign: the same scope as that campaign's pull.
    const response = await withScope({ user: userId, campaigns: [input.campaignId] }, () =>
      push(db, userId, input, linkBase),
    );
    afterPush();
    res.json(response);
  });

  router.get("/pull", async (req, res) => {
    const query = parseInput(pullQuery, req.query);
    // Membership is checked by the pull's own statement (a non-member gets 404).
    const { userId } = requireAuth(req);
    res.json(
      await withScope({ user: userId, campaigns: [query.campaign] }, () => pull(db, userId, query)),
    );
  });
  return router;
}
