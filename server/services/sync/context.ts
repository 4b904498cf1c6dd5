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
