// Changes after the cursor, in change-stream order, one page at a time (see db/change-seq.ts for
// why a cursor can never skip a change that committed late).
import type { z } from "zod";
import type { ChangeRecord, PullResponse, pullQuery } from "../../../shared/sync/protocol";
import type { Db } from "../../db/client";
import { conflictsAfter, findSyncClient, sitesAfter } from "../../db/repositories/sync";
import { forbidden } from "../../http-errors";
import { presentConflict } from "../../presenters/conflict";
import { presentSite } from "../../presenters/site";
import { assertProtocol } from "./push";

type PullQuery = z.output<typeof pullQuery>;

export async function pull(db: Db, userId: string, query: PullQuery): Promise<PullResponse> {
  assertProtocol(query.protocolVersion);
  // One snapshot for every table read, so a page is consistent across entities.
  return db.transaction(
    async (tx) => {
      const { campaign, cursor, limit } = query;
      const [siteRows, conflictRows] = await Promise.all([
        sitesAfter(tx, campaign, cursor, limit + 1),
        conflictsAfter(tx, campaign, cursor, limit + 1),
      ]);
      const all: ChangeRecord[] = [
        ...siteRows.map((r): ChangeRecord => ({
          entity: "site",
          seq: r.changeSeq,
          id: r.id,
          data: presentSite(r),
        })),
        ...conflictRows.map((r): ChangeRecord => ({
          entity: "conflict",
          seq: r.changeSeq,
          id: r.id,
          data: presentConflict(r),
        })),
      ].sort((a, b) => a.seq - b.seq);
      const changes = all.slice(0, limit);
      let lastMutationId: number | null = null;
      if (query.clientId) {
        const client = await findSyncClient(tx, query.clientId);
        if (client && client.userId !== userId)
          throw forbidden("This device is registered to another user");
        lastMutationId = client?.lastMutationId ?? 0;
      }
      return {
        changes,
        cursor: changes.at(-1)?.seq ?? cursor,
        hasMore: all.length > limit,
        lastMutationId,
      };
    },
    { isolationLevel: "repeatable read", accessMode: "read only" },
  );
}
