// Applies a pushed batch in order, in one transaction together with the client's counter:
// ids already applied are answered "duplicate" (a retry is harmless), a gap is refused, and a
// refused mutation is recorded and answered "rejected" so that the queue never blocks.
import {
  protocolVersion,
  type MutationResult,
  type PushRequest,
  type PushResponse,
} from "../../../shared/sync/protocol";
import type { Db } from "../../db/client";
import { advanceSyncClient, lockSyncClient, recordRejection } from "../../db/repositories/sync";
import { findMembership } from "../../db/repositories/users";
import { badRequest, conflict, forbidden, HttpError } from "../../http-errors";
import { applyMutation } from "./apply";
import { Rejection } from "./context";

export function assertProtocol(version: number): void {
  if (version !== protocolVersion) {
    throw new HttpError(
      426,
      "update_required",
      `This version of Equipot is out of date (sync protocol ${version}, the server speaks ${protocolVersion}). Update the app: your unsent changes stay on this device.`,
    );
  }
}

function assertContiguous(request: PushRequest): void {
  request.mutations.forEach((m, i) => {
    const previous = request.mutations[i - 1];
    if (previous && m.mutationId !== previous.mutationId + 1) {
      throw badRequest(
        `mutations.${i}.mutationId: mutation ids in a push must follow each other (expected ${previous.mutationId + 1})`,
      );
    }
  });
}

export async function push(db: Db, userId: string, request: PushRequest): Promise<PushResponse> {
  assertProtocol(request.protocolVersion);
  assertContiguous(request);
  return db.transaction(async (tx) => {
    const client = await lockSyncClient(tx, request.clientId, userId);
    if (client.userId !== userId)
      throw forbidden(
        "This device is registered to another user: sign in again to get a new device id",
      );
    let last = client.lastMutationId;
    const first = request.mutations[0];
    if (first && first.mutationId > last + 1) {
      throw conflict(
        `Mutations ${last + 1} to ${first.mutationId - 1} have not reached the server yet; send them first`,
        [{ path: "mutations.0.mutationId", message: `expected ${last + 1}` }],
      );
    }
    // The role is read inside the transaction: a member removed a moment ago is refused now.
    const membership = await findMembership(tx, userId, request.campaignId);
    const results: MutationResult[] = [];
    for (const mutation of request.mutations) {
      if (mutation.mutationId <= last) {
        results.push({ mutationId: mutation.mutationId, status: "duplicate" });
        continue;
      }
      const ctx = {
        tx,
        campaignId: request.campaignId,
        userId,
        role: membership?.role,
        clientId: client.id,
        mutationId: mutation.mutationId,
      };
      try {
        const outcome = await applyMutation(ctx, mutation);
        results.push({ mutationId: mutation.mutationId, ...outcome });
      } catch (error) {
        if (!(error instanceof Rejection)) throw error;
        await recordRejection(tx, {
          clientId: client.id,
          userId,
          campaignId: request.campaignId,
          mutationId: mutation.mutationId,
          name: mutation.name,
          args: mutation.args ?? null,
          reason: error.message,
        });
        results.push({
          mutationId: mutation.mutationId,
          status: "rejected",
          message: error.message,
        });
      }
      last = mutation.mutationId;
    }
    await advanceSyncClient(tx, client.id, last);
    return { results, lastMutationId: last };
  });
}
