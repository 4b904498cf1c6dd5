import { Router } from "express";
import { acceptInviteInput } from "../../../shared/schemas/auth";
import { sameOriginOnly } from "../../middleware/same-origin";
import { parseInput } from "../../middleware/validate";
import { acceptInvite } from "../../services/invites.service";
import { sendSession, type AuthRouterDeps } from "../auth/auth.router";

export function invitesRouter(deps: AuthRouterDeps): Router {
  const router = Router();
  router.post("/accept", sameOriginOnly(), async (req, res) => {
    const input = parseInput(acceptInviteInput, req.body);
    sendSession(res, deps, await acceptInvite(deps, input));
  });
  return router;
}
