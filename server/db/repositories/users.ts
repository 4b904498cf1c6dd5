import { and, eq, isNull, sql, type SQLWrapper } from "drizzle-orm";
import type { Queryable } from "../client";
import { poolDb, preparedOn } from "../prepared";
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

const membershipQuery = (
  q: Queryable,
  userId: SQLWrapper | string,
  campaignId: SQLWrapper | string,
) =>
  q
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.campaignId, campaignId)))
    .limit(1);

/** Asked on every campaign request: prepared once on the pool. */
export async function findMembership(q: Queryable, userId: string, campaignId: string) {
  const db = poolDb(q);
  const rows = db
    ? await preparedOn(db, "find_membership", (d) =>
        membershipQuery(d, sql.placeholder("userId"), sql.placeholder("campaignId")).prepare(
          "find_membership",
        ),
      ).execute({ userId, campaignId })
    : await membershipQuery(q, userId, campaignId);
  return rows[0];
}
