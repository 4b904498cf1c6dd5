// Removing an uploaded file: its chunks go with it (cascade) and the run's data moves on.
import { sql } from "drizzle-orm";
import type { Db } from "../../db/client";
import { recordAudit } from "../../db/repositories/audit";
import { deleteFile, findFileWithName } from "../../db/repositories/comparison";
import { comparisonRuns } from "../../db/schema";
import { notFound } from "../../http-errors";
import type { Scope } from "../revision";
import { presentFile } from "./present";
import { liveRun } from "./runs";
import { fileEntity } from "./upload";

export async function removeFile(db: Db, scope: Scope, runId: string, fileId: string) {
  await db.transaction(async (tx) => {
    await liveRun(tx, scope.campaignId, runId, true);
    const row = await findFileWithName(tx, scope.campaignId, fileId);
    if (!row || row.runId !== runId) throw notFound("Series file not found");
    await deleteFile(tx, scope.campaignId, runId, fileId);
    await tx
      .update(comparisonRuns)
      .set({ dataRevision: sql`${comparisonRuns.dataRevision} + 1` })
      .where(sql`${comparisonRuns.id} = ${runId}`);
    await recordAudit(tx, {
      ...scope,
      action: "delete",
      entity: fileEntity,
      entityId: fileId,
      before: presentFile(row),
    });
  });
}
