// Review decisions and the records they are about. Every query is scoped by campaign.
import { and, desc, eq, sql, type SQL } from "drizzle-orm";
import type { ReviewSubjectKind } from "../../../shared/schemas/reviews";
import type { Queryable } from "../client";
import { entryReviews, reviewSummarySubscriptions, users } from "../schema";

export type ReviewRow = typeof entryReviews.$inferSelect & { decidedByName: string | null };

const withName = {
  id: entryReviews.id,
  campaignId: entryReviews.campaignId,
  subjectKind: entryReviews.subjectKind,
  subjectId: entryReviews.subjectId,
  decision: entryReviews.decision,
  comment: entryReviews.comment,
  reviewedSeq: entryReviews.reviewedSeq,
  decidedBy: entryReviews.decidedBy,
  decidedAt: entryReviews.decidedAt,
  changeSeq: entryReviews.changeSeq,
  decidedByName: users.name,
};

export async function insertReview(
  q: Queryable,
  row: typeof entryReviews.$inferInsert,
): Promise<ReviewRow> {
  const [inserted] = await q.insert(entryReviews).values(row).returning({ id: entryReviews.id });
  if (!inserted) throw new Error("insert into entry_reviews returned nothing");
  const [read] = await q
    .select(withName)
    .from(entryReviews)
    .leftJoin(users, eq(users.id, entryReviews.decidedBy))
    .where(eq(entryReviews.id, inserted.id));
  if (!read) throw new Error("a review decision vanished after its insert");
  return read;
}

/** Every decision on one record, newest first. */
export const reviewsOf = (
  q: Queryable,
  campaignId: string,
  kind: ReviewSubjectKind,
  subjectId: string,
) =>
  q
    .select(withName)
    .from(entryReviews)
    .leftJoin(users, eq(users.id, entryReviews.decidedBy))
    .where(
      and(
        eq(entryReviews.campaignId, campaignId),
        eq(entryReviews.subjectKind, kind),
        eq(entryReviews.subjectId, subjectId),
      ),
    )
    .orderBy(desc(entryReviews.changeSeq));

export async function latestReview(
  q: Queryable,
  campaignId: string,
  kind: ReviewSubjectKind,
  subjectId: string,
): Promise<ReviewRow | undefined> {
  const [row] = await reviewsOf(q, campaignId, kind, subjectId).limit(1);
  return row;
}

/**
 * One row per reviewable record: where, what, who, when, and the newest change position of the
 * record with its parts (checklist results, levelling setups, attached files). The queue and a
 * single record's page both read it.
 */
export const subjectsSql = (campaignId: string): SQL => sql`
  select 'checklistRun' as kind, r.id, r.site_id, r.title,
      case when r.signed_off_at is null then 'Not signed off' else 'Signed off' end as detail,
      r.started_by as author, r.started_at as at,
      greatest(r.change_seq,
        coalesce((select max(x.change_seq) from checklist_results x where x.run_id = r.id), 0)) as seq
    from checklist_runs r where r.campaign_id = ${campaignId}
  union all
  select 'fieldEntry', e.id, e.site_id, e.kind::text, e.summary, e.recorded_by, e.observed_at,
      e.change_seq
    from field_entries e where e.campaign_id = ${campaignId}
  union all
  select 'levellingSection', s.id, s.site_id, s.from_mark || ' → ' || s.to_mark,
      case when s.closed_at is null then 'Open' else 'Closed' end, s.opened_by, s.opened_at,
      greatest(s.change_seq,
        coalesce((select max(x.change_seq) from levelling_setups x where x.section_id = s.id), 0))
    from levelling_sections s where s.campaign_id = ${campaignId}
  union all
  select 'leg', l.id, l.from_site_id, c.label || ': ' || fs.name || ' → ' || ts.name,
      case when l.cancelled_at is not null then 'Cancelled'
        when l.arrived_at is not null then 'Arrived'
        when l.departed_at is not null then 'On the way' else 'Planned' end,
      l.created_by, l.planned_depart_at, l.change_seq
    from legs l join crates c on c.id = l.crate_id
      join sites fs on fs.id = l.from_site_id join sites ts on ts.id = l.to_site_id
    where l.campaign_id = ${campaignId}
  union all
  select 'handover', h.id, h.site_id, c.label || ': ' || h.from_name || ' → ' || h.to_name,
      h.condition::text, h.recorded_by, h.at, h.change_seq
    from handovers h join crates c on c.id = h.crate_id where h.campaign_id = ${campaignId}`;

export interface SubjectRow {
  kind: ReviewSubjectKind;
  id: string;
  siteId: string | null;
  siteName: string | null;
  title: string;
  detail: string;
  authorId: string | null;
  authorName: string | null;
  authorEmail: string | null;
  at: Date;
  latestSeq: number;
  lastId: string | null;
}

export interface SubjectFilter {
  kind?: ReviewSubjectKind;
  id?: string;
  site?: string;
  person?: string;
  fromDate?: string;
  toDate?: string;
}

const filterSql = (f: SubjectFilter): SQL => {
  const parts: SQL[] = [sql`true`];
  if (f.kind) parts.push(sql`s.kind = ${f.kind}`);
  if (f.id) parts.push(sql`s.id = ${f.id}`);
  if (f.site) parts.push(sql`s.site_id = ${f.site}`);
  if (f.person) parts.push(sql`s.author = ${f.person}`);
  if (f.fromDate) parts.push(sql`s.at >= ${f.fromDate}::date`);
  if (f.toDate) parts.push(sql`s.at < ${f.toDate}::date + 1`);
  return sql.join(parts, sql` and `);
};

export async function listSubjects(
  q: Queryable,
  campaignId: string,
  filter: SubjectFilter,
  limit: number,
): Promise<SubjectRow[]> {
  const result = await q.execute<Record<string, unknown>>(sql`
    select s.kind, s.id, s.site_id, site.name as site_name, s.title, s.detail,
      s.author, u.name as author_name, u.email as author_email, s.at,
      greatest(s.seq, coalesce(att.seq, 0)) as latest_seq, rv.id as last_id
    from (${subjectsSql(campaignId)}) s
    left join sites site on site.id = s.site_id
    left join users u on u.id = s.author
    left join lateral (
      select max(a.change_seq) as seq from attachment_links a
      where a.campaign_id = ${campaignId} and a.subject_kind::text = s.kind and a.subject_id = s.id
    ) att on true
    left join lateral (
      select r.id from entry_reviews r
      where r.campaign_id = ${campaignId} and r.subject_kind::text = s.kind and r.subject_id = s.id
      order by r.change_seq desc limit 1
    ) rv on true
    where ${filterSql(filter)}
    order by s.at desc, s.id
    limit ${limit}`);
  return result.rows.map((r) => ({
    kind: r.kind as ReviewSubjectKind,
    id: String(r.id),
    siteId: (r.site_id as string | null) ?? null,
    siteName: (r.site_name as string | null) ?? null,
    title: String(r.title),
    detail: String(r.detail),
    authorId: (r.author as string | null) ?? null,
    authorName: (r.author_name as string | null) ?? null,
    authorEmail: (r.author_email as string | null) ?? null,
    at: new Date(String(r.at)),
    latestSeq: Number(r.latest_seq),
    lastId: (r.last_id as string | null) ?? null,
  }));
}

/** The decisions with these ids, by id. */
export async function reviewsById(q: Queryable, ids: string[]): Promise<Map<string, ReviewRow>> {
  if (ids.length === 0) return new Map();
  const rows = await q
    .select(withName)
    .from(entryReviews)
    .leftJoin(users, eq(users.id, entryReviews.decidedBy))
    .where(sql`${entryReviews.id} = any(${sql.param(ids)}::uuid[])`);
  return new Map(rows.map((r) => [r.id, r]));
}

export async function setSummarySubscription(
  q: Queryable,
  campaignId: string,
  userId: string,
  weekly: boolean,
): Promise<void> {
  if (weekly)
    await q.insert(reviewSummarySubscriptions).values({ campaignId, userId }).onConflictDoNothing();
  else
    await q
      .delete(reviewSummarySubscriptions)
      .where(
        and(
          eq(reviewSummarySubscriptions.campaignId, campaignId),
          eq(reviewSummarySubscriptions.userId, userId),
        ),
      );
}

export async function hasSummarySubscription(q: Queryable, campaignId: string, userId: string) {
  const [row] = await q
    .select({ userId: reviewSummarySubscriptions.userId })
    .from(reviewSummarySubscriptions)
    .where(
      and(
        eq(reviewSummarySubscriptions.campaignId, campaignId),
        eq(reviewSummarySubscriptions.userId, userId),
      ),
    );
  return row !== undefined;
}
