import { and, asc, eq, isNull, sql } from "drizzle-orm";
import type { Queryable } from "../client";
import { campaigns, memberships, users } from "../schema";

export const findUserByEmail = async (q: Queryable, email: string) =>
  (
    await q
      .select()
      .from(users)
      .where(sql`lower(${users.email}) = ${email.toLowerCase()}`)
      .limit(1)
  )[0];

export const findUserById = async (q: Queryable, id: string) =>
  (
    await q
      .select()
      .from(users)
      .where(and(eq(users.id, id), isNull(users.disabledAt)))
      .limit(1)
  )[0];

export async function listMembershipsOfUser(q: Queryable, userId: string) {
  return q
    .select({
      campaignId: memberships.campaignId,
      campaignName: campaigns.name,
      role: memberships.role,
    })
    .from(memberships)
    .innerJoin(campaigns, eq(campaigns.id, memberships.campaignId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(campaigns.name));
}

export async function findMembership(q: Queryable, userId: string, campaignId: string) {
  const rows = await q
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.campaignId, campaignId)))
    .limit(1);
  return rows[0];
}
