// Applies a pushed batch in order, in one transaction together with the client's counter:
// ids already applied are answered "duplicate" (a retry is harmless), a gap is refused, and a
// refused mutation is recorded and answered "rejected" so that the queue never blocks. Consecutive
// creates (the bulk of a tablet's day offline) are applied as one run, a few queries in all.
import {
  protocolVersion,
  type MutationEnvelope,
  type MutationResult,
  type PushRequest,
  type PushResponse,
} from "../../../shared/sync/protocol";
import { lockChangeStream } from "../../db/change-seq";
import type { Db } from "../../db/client";
import { storableJson } from "../../db/storable";
import { advanceSyncClient, lockSyncClient, recordRejections } from "../../db/repositories/sync";
import { findMembership } from "../../db/repositories/users";
import { badRequest, conflict, forbidden, HttpError } from "../../http-errors";
import { applyMutation, applySiteCreateRun } from "./apply";
import { Rejection, settle, type Settled } from "./context";

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

/** Consecutive creates form one run; every other mutation is a run of its own. */
function runsOf(mutations: MutationEnvelope[]): MutationEnvelope[][] {
  const runs: MutationEnvelope[][] = [];
  for (const mutation of mutations) {
    const run = runs.at(-1);
    if (run && mutation.name === "site.create" && run[0]?.name === "site.create")
      run.push(mutation);
    else runs.push([mutation]);
  }
  return runs;
}

type RunContext = Omit<Parameters<typeof applyMutation>[0], "mutationId">;

async function applyRun(ctx: RunContext, run: MutationEnvelope[]): Promise<Settled[]> {
  if (run[0]?.name === "site.create") return applySiteCreateRun(ctx, run);
  const settled: Settled[] = [];
  for (const mutation of run)
    settled.push(
      await settle(() => applyMutation({ ...ctx, mutationId: mutation.mutationId }, mutation)),
    );
  return settled;
}

/** The refused mutations of a run as rows of sync_rejections, in mutation order. */
const rejectionRows = (ctx: RunContext, run: MutationEnvelope[], settled: Settled[]) =>
  run.flatMap((mutation, i) => {
    const outcome = settled[i];
    if (!(outcome instanceof Rejection)) return [];
    const { clientId, userId, campaignId } = ctx;
    const { mutationId, name, args } = mutation;
    return [
      {
        clientId,
        userId,
        campaignId,
        mutationId,
        name,
        // Kept whole, but in a form jsonb accepts (NUL and broken characters replaced).
        args: storableJson(args),
        reason: outcome.message,
      },
    ];
  });

function resultOf(mutation: MutationEnvelope, settled: Settled | undefined): MutationResult {
  if (!settled) throw new Error(`no outcome for mutation ${mutation.mutationId}`);
  if (settled instanceof Rejection)
    return { mutationId: mutation.mutationId, status: "rejected", message: settled.message };
  return { mutationId: mutation.mutationId, ...settled };
}

export async function push(
  db: Db,
  userId: string,
  request: PushRequest,
  linkBase?: () => string,
): Promise<PushResponse> {
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
    // Counter first, rows after, as every writer of the campaign does (no lock-order deadlock).
    if (membership && request.mutations.some((m) => m.mutationId > last))
      await lockChangeStream(tx, request.campaignId);
    const ctx = {
      tx,
      campaignId: request.campaignId,
      userId,
      role: membership?.role,
      clientId: client.id,
      linkBase,
    };
    // Ids are contiguous, so the ones already applied are a prefix.
    const results: MutationResult[] = request.mutations
      .filter((m) => m.mutationId <= last)
      .map((m) => ({ mutationId: m.mutationId, status: "duplicate" }));
    const fresh = request.mutations.filter((m) => m.mutationId > last);
    for (const run of runsOf(fresh)) {
      const settled = await applyRun(ctx, run);
      await recordRejections(tx, rejectionRows(ctx, run, settled));
      run.forEach((mutation, i) => results.push(resultOf(mutation, settled[i])));
    }
    last = fresh.at(-1)?.mutationId ?? last;
    await advanceSyncClient(tx, client.id, last);
    return { results, lastMutationId: last };
  });
}
