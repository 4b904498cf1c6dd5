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

/** Queues a message at most once per key (unique message_key); false when it was queued before. */
export async function enqueueEmailOnce(
  q: Queryable,
  email: OutgoingEmail & { messageKey: string },
): Promise<boolean> {
  const inserted = await q
    .insert(emailOutbox)
    .values(email)
    .onConflictDoNothing({ target: emailOutbox.messageKey })
    .returning({ id: emailOutbox.id });
  return inserted.length > 0;
}

/** The Message-ID of an outbox row: the same on every attempt, so a resend is recognisable. */
export const outboxMessageId = (id: number) => `<outbox-${id}@equipot>`;

/**
 * Claims due messages, locked until the caller's transaction ends; SKIP LOCKED lets several
 * workers (or instances) share the outbox without taking the same row.
 */
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
