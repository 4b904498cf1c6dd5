import { Router } from "express";
import { sql } from "drizzle-orm";
import type { Db } from "../../db/client";

export function healthRouter(db: Db, demo: boolean): Router {
  const router = Router();
  router.get("/", async (_req, res) => {
    try {
      await db.execute(sql`select 1`);
      res.json({ status: "ok", database: "ok", demo });
    } catch {
      res.status(503).json({ status: "degraded", database: "unreachable", demo });
    }
  });
  return router;
}
