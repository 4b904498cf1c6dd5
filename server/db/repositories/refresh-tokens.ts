import { and, eq, isNull } from "drizzle-orm";
import type { Queryable } from "../client";
import { refreshTokens } from "../schema";

export async function insertRefreshToken(
  q: Queryable,
  row: { userId: string; familyId: string; tokenHash: string; expiresAt: Date },
) {
  await q.insert(refreshTokens).values(row);
}

/** Locks the row so two concurrent refreshes of one token cannot both succeed. */
export const findRefreshTokenForUpdate = async (q: Queryable, tokenHash: string) =>
  (
    await q
      .select()
      .from(refreshTokens)
      .where(eq(refreshTokens.tokenHash, tokenHash))
      .for("update")
      .limit(1)
  )[0];

export async function markRotated(q: Queryable, id: string) {
  await q.update(refreshTokens).set({ rotatedAt: new Date() }).where(eq(refreshTokens.id, id));
}

export async function revokeFamily(q: Queryable, familyId: string) {
  await q
    .update(refreshTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(refreshTokens.familyId, familyId), isNull(refreshTokens.revokedAt)));
}
