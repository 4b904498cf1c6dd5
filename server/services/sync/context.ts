import type { Role } from "../../../shared/permissions";
import type { Tx } from "../../db/client";

export interface ApplyContext {
  tx: Tx;
  campaignId: string;
  userId: string;
  role: Role;
  clientId: string;
  mutationId: number;
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
