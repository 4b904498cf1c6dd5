// The opt-in weekly summary for reviewers: once per ISO week per campaign and person, through the
// e-mail outbox (a message key per week, so two instances or a retry never send it twice).
import { and, eq, isNull, ne, or, sql } from "drizzle-orm";
import { can } from "../../shared/permissions";
import { reviewDecisionLabels, reviewDecisions } from "../../shared/schemas/reviews";
import type { Db } from "../db/client";
import { asSystem, withScope } from "../db/scope";
import { enqueueEmailOnce } from "../db/repositories/outbox";
import {
  campaigns,
  entryReviews,
  memberships,
  reviewSummarySubscriptions,
  users,
} from "../db/schema";
import { reviewQueue } from "./reviews.service";

/** ISO 8601 week of a UTC date, as "YYYY-Www" (the week with the year's first Thursday is W01). */
export function isoWeek(date: Date): string {
  const day = new Date(Date.UTC(date.getUTCFullYear(), date.getUTCMonth(), date.getUTCDate()));
  const weekday = day.getUTCDay() || 7;
  // The Thursday of this week decides the year.
  day.setUTCDate(day.getUTCDate() + 4 - weekday);
  const yearStart = Date.UTC(day.getUTCFullYear(), 0, 1);
  const week = Math.ceil(((day.getTime() - yearStart) / 86_400_000 + 1) / 7);
  return `${day.getUTCFullYear()}-W${String(week).padStart(2, "0")}`;
}

async function dueSubscriptions(db: Db, week: string) {
  return db
    .select({
      campaignId: reviewSummarySubscriptions.campaignId,
      campaignName: campaigns.name,
      userId: users.id,
      email: users.email,
      name: users.name,
      role: memberships.role,
    })
    .from(reviewSummarySubscriptions)
    .innerJoin(campaigns, eq(campaigns.id, reviewSummarySubscriptions.campaignId))
    .innerJoin(users, eq(users.id, reviewSummarySubscriptions.userId))
    .innerJoin(
      memberships,
      and(
        eq(memberships.campaignId, reviewSummarySubscriptions.campaignId),
        eq(memberships.userId, reviewSummarySubscriptions.userId),
      ),
    )
    .where(
      and(
        isNull(users.disabledAt),
        or(
          isNull(reviewSummarySubscriptions.lastWeek),
          ne(reviewSummarySubscriptions.lastWeek, week),
        ),
      ),
    );
}

async function decisionsSince(db: Db, campaignId: string, since: Date) {
  const rows = await db
    .select({ decision: entryReviews.decision, count: sql<number>`count(*)::int` })
    .from(entryReviews)
    .where(and(eq(entryReviews.campaignId, campaignId), sql`${entryReviews.decidedAt} >= ${since}`))
    .groupBy(entryReviews.decision);
  return new Map(rows.map((r) => [r.decision, r.count]));
}

/** Queues the summaries due in `now`'s week; returns how many were queued. */
export async function queueWeeklySummaries(db: Db, now: Date, linkBase: string): Promise<number> {
  const week = isoWeek(now);
  let queued = 0;
  const due = await asSystem("finding the review summaries due", () => dueSubscriptions(db, week));
  for (const sub of due) {
    if (!can(sub.role, "entry.review")) continue;
    // Each summary is read as its reader would see the campaign.
    const scope = { user: sub.userId, campaigns: [sub.campaignId] };
    if (await withScope(scope, () => queueSummary(db, sub, week, now, linkBase))) queued += 1;
  }
  return queued;
}

async function queueSummary(
  db: Db,
  sub: Awaited<ReturnType<typeof dueSubscriptions>>[number],
  week: string,
  now: Date,
  linkBase: string,
): Promise<boolean> {
  const waiting = (await reviewQueue(db, sub.campaignId, { show: "waiting" })).items.length;
  const decided = await decisionsSince(
    db,
    sub.campaignId,
    new Date(now.getTime() - 7 * 86_400_000),
  );
  const lines = reviewDecisions.map(
    (d) => `  ${reviewDecisionLabels[d].padEnd(10)} ${decided.get(d) ?? 0}`,
  );
  return db.transaction(async (tx) => {
    const fresh = await enqueueEmailOnce(tx, {
      messageKey: `review-summary:${sub.campaignId}:${sub.userId}:${week}`,
      toAddress: sub.email,
      subject: `Equipot, ${sub.campaignName}: weekly review summary (${week})`,
      textBody: [
        `Hello ${sub.name},`,
        "",
        `Records waiting for review in "${sub.campaignName}": ${waiting}`,
        "",
        "Decisions in the last 7 days:",
        ...lines,
        "",
        `${linkBase.replace(/\/$/, "")}/campaigns/${sub.campaignId}/review`,
        "",
        "You get this because you asked for it on the review page; you can turn it off there.",
      ].join("\n"),
    });
    await tx
      .update(reviewSummarySubscriptions)
      .set({ lastWeek: week })
      .where(
        and(
          eq(reviewSummarySubscriptions.campaignId, sub.campaignId),
          eq(reviewSummarySubscriptions.userId, sub.userId),
        ),
      );
    return fresh;
  });
}
