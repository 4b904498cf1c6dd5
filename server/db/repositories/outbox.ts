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

/** The instant a due time is compared with: the database's now(), or the given clock reading. */
const instant = (at: Date | undefined) => (at ? sql`${at.toISOString()}::timestamptz` : sql`now()`);

/**
 * Claims messages due at `at` (default: the database's now()), locked until the caller's
 * transaction ends; SKIP LOCKED lets several workers (or instances) share the outbox without
 * taking the same row.
 */
export async function claimDueEmails(q: Queryable, limit: number, at?: Date) {
  return q
    .select()
    .from(emailOutbox)
    .where(sql`${emailOutbox.sentAt} is null and ${emailOutbox.nextAttemptAt} <= ${instant(at)}`)
    .orderBy(emailOutbox.id)
    .limit(limit)
    .for("update", { skipLocked: true });
}

export async function markEmailSent(q: Queryable, id: number, at = new Date()) {
  await q.update(emailOutbox).set({ sentAt: at, lastError: null }).where(eq(emailOutbox.id, id));
}

export async function markEmailFailed(
  q: Queryable,
  id: number,
  attempts: number,
  error: string,
  retryInS: number,
  at?: Date,
) {
  await q
    .update(emailOutbox)
    .set({
      attempts,
      lastError: error.slice(0, 500),
      nextAttemptAt: sql`${instant(at)} + make_interval(secs => ${retryInS})`,
    })
    .where(eq(emailOutbox.id, id));
}
