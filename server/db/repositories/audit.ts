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

/**
 * The trail of one record with its parts: checklist results of a run, setups of a section, files
 * linked to it, and the review decisions on it. Oldest first.
 */
/** `entityId` must be a UUID (the routes check it): the parts are found through their indexes. */
export async function trailOf(q: Queryable, campaignId: string, entity: string, entityId: string) {
  const result = await q.execute<Record<string, unknown>>(sql`
    select a.id, a.at, a.action, a.entity, a.entity_id, a.user_id, u.name as user_name,
      a.client_id, c.label as device_label, a.before, a.after
    from audit_events a
    left join users u on u.id = a.user_id
    left join sync_clients c on c.id = a.client_id
    where a.campaign_id = ${campaignId} and (
      (a.entity = ${entity} and a.entity_id = ${entityId})
      or (a.entity = 'checklistResult' and a.entity_id in
        (select id::text from checklist_results where run_id = ${entityId}::uuid))
      or (a.entity = 'levellingSetup' and a.entity_id in
        (select id::text from levelling_setups where section_id = ${entityId}::uuid))
      or (a.entity = 'attachment' and a.entity_id in
        (select id::text from attachment_links where subject_id = ${entityId}::uuid
          and campaign_id = ${campaignId})))
    order by a.id
    limit 2000`);
  return result.rows.map((r) => ({
    id: Number(r.id),
    at: new Date(String(r.at)).toISOString(),
    action: String(r.action),
    entity: String(r.entity),
    entityId: String(r.entity_id),
    userId: (r.user_id as string | null) ?? null,
    userName: (r.user_name as string | null) ?? null,
    clientId: (r.client_id as string | null) ?? null,
    deviceLabel: (r.device_label as string | null) ?? null,
    before: r.before ?? null,
    after: r.after ?? null,
  }));
}
