import { and, eq, isNull, sql } from "drizzle-orm";
import type { Queryable } from "../client";
import { memberships, users } from "../schema";

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

export async function findMembership(q: Queryable, userId: string, campaignId: string) {
  const rows = await q
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.campaignId, campaignId)))
    .limit(1);
  return rows[0];
}
