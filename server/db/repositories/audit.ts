import { sql } from "drizzle-orm";
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

const toRow = (entry: AuditEntry) => ({
  ...entry,
  before: entry.before ?? null,
  after: entry.after ?? null,
});

export async function recordAudit(q: Queryable, entry: AuditEntry): Promise<void> {
  await q.insert(auditEvents).values(toRow(entry));
}

/**
 * Several entries in one INSERT, their ids in the order given. The rows travel as one JSON
 * parameter that PostgreSQL unpacks: cheaper than a multi-row VALUES built through drizzle.
 */
export async function recordAudits(q: Queryable, entries: AuditEntry[]): Promise<void> {
  if (entries.length === 0) return;
  const json = JSON.stringify(
    entries.map((e) => ({
      campaign_id: e.campaignId,
      user_id: e.userId,
      client_id: e.clientId ?? null,
      action: e.action,
      entity: e.entity,
      entity_id: e.entityId,
      before: e.before ?? null,
      after: e.after ?? null,
    })),
  );
  await q.execute(sql`
    insert into audit_events (campaign_id, user_id, client_id, action, entity, entity_id, before,
      after)
    select campaign_id, user_id, client_id, action, entity, entity_id, before, after
    from jsonb_populate_recordset(null::audit_events, ${json}::jsonb) with ordinality
    order by ordinality`);
}
