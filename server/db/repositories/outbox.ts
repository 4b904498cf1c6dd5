import { eq, sql } from "drizzle-orm";
import type { Queryable } from "../client";
import { emailOutbox } from "../schema";

export interface OutgoingEmail {
  toAddress: string;
  subject: string;
  textBody: string;
}

export async function enqueueEmail(q: Queryable, email: OutgoingEmail): Promise<void> {
  await q.insert(emailOutbox).values(email);
}

/** Claims due messages; SKIP LOCKED lets several workers (or instances) share the outbox safely. */
export async function claimDueEmails(q: Queryable, limit: number) {
  return q
    .select()
    .from(emailOutbox)
    .where(sql`${emailOutbox.sentAt} is null and ${emailOutbox.nextAttemptAt} <= now()`)
    .orderBy(emailOutbox.id)
    .limit(limit)
    .for("update", { skipLocked: true });
}

export async function markEmailSent(q: Queryable, id: number) {
  await q
    .update(emailOutbox)
    .set({ sentAt: new Date(), lastError: null })
    .where(eq(emailOutbox.id, id));
}

export async function markEmailFailed(
  q: Queryable,
  id: number,
  attempts: number,
  error: string,
  retryInS: number,
) {
  await q
    .update(emailOutbox)
    .set({
      attempts,
      lastError: error.slice(0, 500),
      nextAttemptAt: sql`now() + make_interval(secs => ${retryInS})`,
    })
    .where(eq(emailOutbox.id, id));
}
