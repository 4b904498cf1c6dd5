// What the middleware chain attaches to a request, typed once.
import type { Role } from "../shared/permissions";

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      auth?: { userId: string };
      membership?: { campaignId: string; role: Role };
    }
  }
}

export {};
