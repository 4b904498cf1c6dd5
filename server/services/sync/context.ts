import type { z } from "zod";
import type { Role } from "../../../shared/permissions";
import type { mutationSchemas } from "../../../shared/sync/protocol";
import type { Tx } from "../../db/client";
import { recordAudit } from "../../db/repositories/audit";

export interface ApplyContext {
  tx: Tx;
  campaignId: string;
  userId: string;
  role: Role;
  clientId: string;
  mutationId: number;
  /** The address users open, for links in e-mails (config PUBLIC_URL). */
  linkBase?: () => string;
}

export type ApplyOutcome = { status: "applied" | "conflict"; message?: string };

/** A mutation the server will not apply; it is recorded with this reason and the queue moves on. */
export class Rejection extends Error {}

export const sameValue = (a: unknown, b: unknown) =>
  JSON.stringify(a ?? null) === JSON.stringify(b ?? null);

/** What became of one mutation: its outcome, or the reason it was refused. */
export type Settled = ApplyOutcome | Rejection;

/** Runs `work`, turning a Rejection into a value; any other error still aborts the push. */
export async function settle(work: () => Promise<ApplyOutcome>): Promise<Settled> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof Rejection) return error;
    throw error;
  }
}

/** The validated arguments of one mutation kind. */
export type Args<N extends keyof typeof mutationSchemas> = z.output<(typeof mutationSchemas)[N]>;

/** The audit event of one applied mutation: by whom, from which device, before and after. */
export const auditChange = (
  ctx: Pick<ApplyContext, "tx" | "campaignId" | "userId" | "clientId">,
  change: { action: string; entity: string; entityId: string; before?: unknown; after: unknown },
) =>
  recordAudit(ctx.tx, {
    campaignId: ctx.campaignId,
    userId: ctx.userId,
    clientId: ctx.clientId,
    before: null,
    ...change,
  });
