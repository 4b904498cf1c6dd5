import { and, asc, eq, gt, isNull, sql } from "drizzle-orm";
import type { Queryable } from "../client";
import { campaigns, invites, memberships, users } from "../schema";
import type { Role } from "../../../shared/permissions";

export const listCampaignsOfUser = async (q: Queryable, userId: string) =>
  q
    .select({
      id: campaigns.id,
      name: campaigns.name,
      description: campaigns.description,
      role: memberships.role,
    })
    .from(memberships)
    .innerJoin(campaigns, eq(campaigns.id, memberships.campaignId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(campaigns.name));

export const listMembers = async (q: Queryable, campaignId: string) =>
  q
    .select({ userId: users.id, email: users.email, name: users.name, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.campaignId, campaignId))
    .orderBy(asc(users.name));

export async function insertInvite(
  q: Queryable,
  row: {
    campaignId: string;
    email: string;
    role: Role;
    tokenHash: string;
    invitedBy: string;
    expiresAt: Date;
  },
) {
  const [inserted] = await q.insert(invites).values(row).returning();
  if (!inserted) throw new Error("insert into invites returned no row");
  return inserted;
}

export const findOpenInviteForUpdate = async (q: Queryable, tokenHash: string) =>
  (
    await q
      .select()
      .from(invites)
      .where(
        and(
          eq(invites.tokenHash, tokenHash),
          isNull(invites.acceptedAt),
          gt(invites.expiresAt, sql`now()`),
        ),
      )
      .for("update")
      .limit(1)
  )[0];

export async function markInviteAccepted(q: Queryable, id: string) {
  await q.update(invites).set({ acceptedAt: new Date() }).where(eq(invites.id, id));
}

export async function upsertMembership(
  q: Queryable,
  campaignId: string,
  userId: string,
  role: Role,
) {
  await q
    .insert(memberships)
    .values({ campaignId, userId, role })
    .onConflictDoUpdate({ target: [memberships.campaignId, memberships.userId], set: { role } });
}

export const findCampaign = async (q: Queryable, id: string) =>
  (await q.select().from(campaigns).where(eq(campaigns.id, id)).limit(1))[0];
