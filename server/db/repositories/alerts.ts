// Alerts (one per entry beyond its crate's limits) and who receives them; scoped by campaign.
import { and, asc, eq, isNull } from "drizzle-orm";
import type { Queryable } from "../client";
import { alerts, campaigns, memberships, sites, users } from "../schema";

export type AlertRow = typeof alerts.$inferSelect;

/** Inserts the alert unless its entry already has one (unique entry_id); undefined when it had. */
export async function insertAlertOnce(
  q: Queryable,
  row: typeof alerts.$inferInsert,
): Promise<AlertRow | undefined> {
  const [inserted] = await q
    .insert(alerts)
    .values(row)
    .onConflictDoNothing({ target: alerts.entryId })
    .returning();
  return inserted;
}

export const findAlertOfEntry = async (q: Queryable, entryId: string) =>
  (await q.select().from(alerts).where(eq(alerts.entryId, entryId)).limit(1))[0];

export const findAlertForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(alerts)
      .where(and(eq(alerts.campaignId, campaignId), eq(alerts.id, id)))
      .for("update")
      .limit(1)
  )[0];

export async function updateAlert(
  q: Queryable,
  id: string,
  patch: Partial<typeof alerts.$inferInsert>,
): Promise<AlertRow> {
  const [updated] = await q.update(alerts).set(patch).where(eq(alerts.id, id)).returning();
  if (!updated) throw new Error(`alert ${id} vanished during its update`);
  return updated;
}

/** The alert recipients: the campaign's logistics members whose accounts are not disabled. */
export const alertRecipients = (q: Queryable, campaignId: string) =>
  q
    .select({ id: users.id, email: users.email, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(
      and(
        eq(memberships.campaignId, campaignId),
        eq(memberships.role, "logistics"),
        isNull(users.disabledAt),
      ),
    )
    .orderBy(asc(users.email));

/** The names an alert's e-mail shows: its campaign and its site. */
export const alertPlaceNames = async (q: Queryable, campaignId: string, siteId: string) =>
  (
    await q
      .select({ campaignName: campaigns.name, siteName: sites.name })
      .from(sites)
      .innerJoin(campaigns, eq(campaigns.id, sites.campaignId))
      .where(and(eq(sites.campaignId, campaignId), eq(sites.id, siteId)))
      .limit(1)
  )[0];
