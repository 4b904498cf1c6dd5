import type { Queryable } from "../client";
import { auditEvents } from "../schema";

export interface AuditEntry {
  campaignId: string | null;
  userId: string | null;
  clientId?: string | null;
  action: string;
  entity: string;
  entityId: string;
  before?: unknown;
  after?: unknown;
}

export async function recordAudit(q: Queryable, entry: AuditEntry): Promise<void> {
  await q
    .insert(auditEvents)
    .values({ ...entry, before: entry.before ?? null, after: entry.after ?? null });
}
