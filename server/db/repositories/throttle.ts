import { eq, inArray, sql } from "drizzle-orm";
import type { Queryable } from "../client";
import { authThrottle } from "../schema";

export const findThrottles = async (q: Queryable, keys: string[]) =>
  q.select().from(authThrottle).where(inArray(authThrottle.key, keys));

/** Counts one failure for the key, restarting the window when it has expired. Returns the new row. */
export async function recordFailure(
  q: Queryable,
  key: string,
  windowS: number,
  blockFor: (failures: number) => number,
) {
  const rows = await q
    .insert(authThrottle)
    .values({ key, failures: 1 })
    .onConflictDoUpdate({
      target: authThrottle.key,
      set: {
        failures: sql`case when ${authThrottle.windowStartedAt} < now() - make_interval(secs => ${windowS}) then 1 else ${authThrottle.failures} + 1 end`,
        windowStartedAt: sql`case when ${authThrottle.windowStartedAt} < now() - make_interval(secs => ${windowS}) then now() else ${authThrottle.windowStartedAt} end`,
      },
    })
    .returning();
  const row = rows[0];
  if (!row) return;
  const blockS = blockFor(row.failures);
  if (blockS > 0) {
    await q
      .update(authThrottle)
      .set({ blockedUntil: sql`now() + make_interval(secs => ${blockS})` })
      .where(eq(authThrottle.key, key));
  }
}

export async function clearThrottle(q: Queryable, key: string) {
  await q.delete(authThrottle).where(eq(authThrottle.key, key));
}
