// Office review on the real server: the queue of synced records, approve and send back, the push
// refusing changes to an approved record until it is reopened, decisions reaching the tablet in
// the pull, the record's audit trail, the send-back e-mail and the weekly summary.
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { isoWeek, queueWeeklySummaries } from "../../server/services/review-summary.service";
import type { ChecklistTemplateView } from "../../shared/schemas/checklists";
import type {
  AuditEventView,
  ReviewQueueResponse,
  ReviewRecordResponse,
  ReviewSubjectKind,
} from "../../shared/schemas/reviews";
import { changeRecord } from "../../shared/sync/protocol";
import { createTestContext, outsiderToken, signInAs, type TestContext } from "../helpers/app";
import { pullAll, pushAs, syncClient, type TestSyncClient } from "../helpers/sync";

let ctx: TestContext;
let campaignId: string;
let fieldToken: string;
let reviewerToken: string;
let siteId: string;
let template: ChecklistTemplateView;
const tablet: TestSyncClient = syncClient();
const at = "2027-06-04T08:15:00.000Z";

const sql = <T extends Record<string, unknown>>(text: string, values: unknown[] = []) =>
  ctx.database.pool.query<T>(text, values).then((r) => r.rows);

const push = (mutations: ReturnType<TestSyncClient["mutation"]>[]) =>
  pushAs(ctx.app, fieldToken, { clientId: tablet.clientId, campaignId, mutations });

const api = (token: string) => ({
  get: (path: string) =>
    request(ctx.app)
      .get(`/api/campaigns/${campaignId}${path}`)
      .set("Authorization", `Bearer ${token}`),
  post: (path: string, body: object) =>
    request(ctx.app)
      .post(`/api/campaigns/${campaignId}${path}`)
      .set("Authorization", `Bearer ${token}`)
      .send(body),
});

async function queue(query: Record<string, string> = {}): Promise<ReviewQueueResponse> {
  const res = await api(reviewerToken).get("/reviews/queue").query(query);
  expect(res.status).toBe(200);
  return res.body as ReviewQueueResponse;
}

async function itemOf(kind: ReviewSubjectKind, id: string, show = "all") {
  const found = (await queue({ kind, show })).items.find((i) => i.subjectId === id);
  if (!found) throw new Error(`${kind} ${id} is not in the queue (${show})`);
  return found;
}

const decide = async (
  kind: ReviewSubjectKind,
  id: string,
  decision: string,
  comment = "",
  token = reviewerToken,
) => {
  const { latestSeq } = await itemOf(kind, id);
  return api(token).post("/reviews", {
    subjectKind: kind,
    subjectId: id,
    decision,
    comment,
    reviewedSeq: latestSeq,
  });
};

const runId = crypto.randomUUID();
const entryId = crypto.randomUUID();

beforeAll(async () => {
  ctx = await createTestContext();
  const field = await signInAs(ctx.app, "field");
  fieldToken = field.token;
  campaignId = field.memberships[0]?.campaignId ?? "";
  reviewerToken = (await signInAs(ctx.app, "reviewer")).token;
  const { changes } = await pullAll(ctx.app, fieldToken, campaignId);
  siteId = changes.find((c) => c.entity === "site")?.id ?? "";
  const arrival = changes.find(
    (c) => c.entity === "checklistTemplate" && c.data.purpose === "arrival",
  );
  if (arrival?.entity !== "checklistTemplate") throw new Error("no demo arrival checklist");
  template = arrival.data;
  const res = await push([
    tablet.mutation("checklist.start", {
      id: runId,
      templateId: template.id,
      siteId,
      startedAt: at,
    }),
    tablet.mutation("entry.add", {
      id: entryId,
      siteId,
      crateId: null,
      observedAt: at,
      recordedAt: at,
      data: { kind: "observation", text: "Fresh snow on the access track" },
    }),
  ]);
  expect(res.body.results.map((r) => r.status)).toEqual(["applied", "applied"]);
});
afterAll(async () => {
  await ctx.close();
});

describe("the review queue", () => {
  it("lists new records with their author and site, filtered by kind, site, person and date", async () => {
    const all = await queue();
    const entry = all.items.find((i) => i.subjectId === entryId);
    expect(entry).toMatchObject({
      subjectKind: "fieldEntry",
      title: "Observation",
      detail: expect.stringContaining("snow") as unknown,
      siteId,
      waiting: true,
      last: null,
    });
    expect(entry?.authorName).toBeTruthy();
    expect(all.people.map((p) => p.id)).toContain(entry?.authorId);
    const runs = await queue({ kind: "checklistRun" });
    expect(runs.items.length).toBeGreaterThan(0);
    expect(runs.items.every((i) => i.subjectKind === "checklistRun")).toBe(true);
    const bySite = await queue({ site: siteId });
    expect(bySite.items.every((i) => i.siteId === siteId)).toBe(true);
    const byPerson = await queue({ person: entry?.authorId ?? "" });
    expect(byPerson.items.every((i) => i.authorId === entry?.authorId)).toBe(true);
    expect(
      (await queue({ from: "2027-06-04", to: "2027-06-04" })).items.map((i) => i.subjectId),
    ).toEqual(expect.arrayContaining([entryId, runId]));
    expect((await queue({ from: "2027-06-05" })).items.map((i) => i.subjectId)).not.toContain(
      entryId,
    );
  });

  it("names the bad filter and refuses the queue to roles that do not review", async () => {
    const bad = await api(reviewerToken).get("/reviews/queue").query({ from: "June" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/^from: /);
    expect((await api(fieldToken).get("/reviews/queue")).status).toBe(403);
    // A reviewer of the other demo campaign only: a stranger to this one.
    const admin = await signInAs(ctx.app, "admin");
    const practiceId = admin.memberships.find((m) => m.campaignId !== campaignId)?.campaignId;
    if (!practiceId) throw new Error("no second demo campaign");
    const outsider = await outsiderToken(ctx, practiceId, "reviewer");
    const refused = await api(outsider).get("/reviews/queue");
    expect(refused.status).toBe(404);
    expect(JSON.stringify(refused.body)).not.toContain(entryId);
  });
});

describe("decisions", () => {
  it("approves an entry: it leaves the waiting queue and shows under approved", async () => {
    const res = await decide("fieldEntry", entryId, "approved");
    expect(res.status).toBe(201);
    expect(res.body.review).toMatchObject({ decision: "approved", subjectId: entryId });
    expect((await queue()).items.map((i) => i.subjectId)).not.toContain(entryId);
    expect((await queue({ show: "approved" })).items.map((i) => i.subjectId)).toContain(entryId);
    const again = await decide("fieldEntry", entryId, "approved");
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/reopen/);
  });

  it("refuses a decision on a record that changed since the reviewer looked", async () => {
    const { latestSeq } = await itemOf("checklistRun", runId);
    const item = template.items[0];
    if (!item) throw new Error("the template has no items");
    const value = item.kind === "check" ? true : item.kind === "number" ? 1 : "ok";
    const res = await push([
      tablet.mutation("checklist.record", {
        id: crypto.randomUUID(),
        runId,
        itemId: item.id,
        value,
        recordedAt: at,
      }),
    ]);
    expect(res.body.results[0]?.status).toBe("applied");
    const stale = await api(reviewerToken).post("/reviews", {
      subjectKind: "checklistRun",
      subjectId: runId,
      decision: "approved",
      reviewedSeq: latestSeq,
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/changed since you opened it/);
  });

  it("sends back only with a comment, and queues one e-mail to the author", async () => {
    const bare = await decide("checklistRun", runId, "sentBack");
    expect(bare.status).toBe(400);
    expect(bare.body.error.message).toMatch(/^comment: /);
    const res = await decide("checklistRun", runId, "sentBack", "Photo of the seal is missing");
    expect(res.status).toBe(201);
    const mail = await sql<{ to_address: string; subject: string; text_body: string }>(
      "select to_address, subject, text_body from email_outbox where message_key = $1",
      [`review-sent-back:${res.body.review.id}`],
    );
    expect(mail).toHaveLength(1);
    expect(mail[0]?.to_address).toBe("field@demo.equipot.test");
    expect(mail[0]?.subject).toMatch(/sent back/);
    expect(mail[0]?.text_body).toContain("Photo of the seal is missing");
    expect(mail[0]?.text_body).toContain(`/campaigns/${campaignId}/checklists/${runId}`);
    // Sent back and unchanged: not waiting until the author adds something.
    expect((await queue()).items.map((i) => i.subjectId)).not.toContain(runId);
    expect((await queue({ show: "sentBack" })).items.map((i) => i.subjectId)).toContain(runId);
  });

  it("is refused to the field crew", async () => {
    const res = await decide("checklistRun", runId, "approved", "", fieldToken);
    expect(res.status).toBe(403);
  });
});

describe("an approved record on the tablet", () => {
  it("pulls the decisions, with the send-back comment", async () => {
    const { changes } = await pullAll(ctx.app, fieldToken, campaignId);
    const reviews = changes
      .map((c) => changeRecord.parse(c))
      .flatMap((c) => (c.entity === "review" ? [c.data] : []));
    expect(reviews.find((r) => r.subjectId === runId)?.comment).toBe(
      "Photo of the seal is missing",
    );
    expect(reviews.find((r) => r.subjectId === entryId)?.decision).toBe("approved");
  });

  it("refuses a change to an approved record until a reviewer reopens it", async () => {
    const approve = await decide("checklistRun", runId, "approved");
    expect(approve.status).toBe(201);
    const signOff = () =>
      tablet.mutation("checklist.signOff", { id: runId, signedOffAt: at, note: "" });
    const photo = () =>
      tablet.mutation("attachment.add", {
        id: crypto.randomUUID(),
        sha256: "a".repeat(64),
        contentType: "image/jpeg",
        sizeBytes: 10,
        subject: { kind: "fieldEntry", id: entryId },
      });
    const refused = await push([signOff(), photo()]);
    expect(refused.body.results.map((r) => r.status)).toEqual(["rejected", "rejected"]);
    expect(refused.body.results[0]?.message).toMatch(
      /^This checklist was approved by .+ on \d{4}-\d{2}-\d{2} and is read-only; ask a reviewer to reopen it/,
    );
    expect(refused.body.results[1]?.message).toMatch(/field entry was approved/);

    const reopen = await decide("fieldEntry", entryId, "reopened", "A photo is coming");
    expect(reopen.status).toBe(201);
    expect((await queue()).items.map((i) => i.subjectId)).toContain(entryId);
    const accepted = await push([photo()]);
    expect(accepted.body.results[0]?.status).toBe("applied");
  });
});

describe("approving many at once", () => {
  it("approves what is as shown and leaves a record that changed since for a look", async () => {
    const shown = (await queue()).items.slice(0, 3);
    expect(shown.length).toBeGreaterThan(1);
    const [first, ...rest] = shown;
    if (!first) throw new Error("nothing to approve");
    const items = [
      {
        subjectKind: first.subjectKind,
        subjectId: first.subjectId,
        reviewedSeq: first.latestSeq - 1,
      },
      ...rest.map((i) => ({
        subjectKind: i.subjectKind,
        subjectId: i.subjectId,
        reviewedSeq: i.latestSeq,
      })),
    ];
    const res = await api(reviewerToken).post("/reviews/approve-many", { items });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ approved: rest.length, skipped: 1 });
    const waiting = (await queue()).items.map((i) => i.subjectId);
    expect(waiting).toContain(first.subjectId);
    for (const i of rest) expect(waiting).not.toContain(i.subjectId);
    const empty = await api(reviewerToken).post("/reviews/approve-many", { items: [] });
    expect(empty.status).toBe(400);
    expect(empty.body.error.message).toMatch(/^items: /);
  });
});

describe("the record's audit trail", () => {
  it("shows every change and decision with who, when and from which device", async () => {
    const res = await api(reviewerToken).get(`/reviews/records/checklistRun/${runId}`);
    expect(res.status).toBe(200);
    const body = res.body as ReviewRecordResponse;
    const actions = body.trail.map((e) => `${e.entity}:${e.action}`);
    expect(actions).toEqual([
      "checklistRun:create",
      "checklistResult:create",
      "checklistRun:review.sentBack",
      "checklistRun:review.approved",
    ]);
    const created = body.trail[0];
    expect(created?.clientId).toBe(tablet.clientId);
    expect(created?.userName).toBeTruthy();
    expect(created?.after).toMatchObject({ id: runId });
    expect(body.trail[3]?.before).toMatchObject({ decision: "sentBack" });
    expect(body.decisions.map((d) => d.decision)).toEqual(["approved", "sentBack"]);
    expect((await api(fieldToken).get(`/reviews/records/checklistRun/${runId}`)).status).toBe(403);
    const missing = await api(reviewerToken).get(`/reviews/records/leg/${crypto.randomUUID()}`);
    expect(missing.status).toBe(404);
  });
});

describe("a site's change history", () => {
  it("gives each edit with its device and the values before and after", async () => {
    const { changes } = await pullAll(ctx.app, fieldToken, campaignId);
    const site = changes.find((c) => c.entity === "site" && c.id === siteId);
    if (site?.entity !== "site") throw new Error("the site was not pulled");
    const res = await push([
      tablet.mutation("site.update", {
        id: siteId,
        changes: { notes: "Door code changed" },
        base: { notes: site.data.notes },
      }),
    ]);
    expect(res.body.results[0]?.status).toBe("applied");
    const trail = await api(reviewerToken).get(`/audit/site/${siteId}`);
    expect(trail.status).toBe(200);
    const last = (trail.body as { trail: AuditEventView[] }).trail.at(-1);
    expect(last).toMatchObject({ entity: "site", clientId: tablet.clientId });
    expect(last?.before).toMatchObject({ notes: site.data.notes });
    expect(last?.after).toMatchObject({ notes: "Door code changed" });
    const unknown = await api(reviewerToken).get(`/audit/users/${siteId}`);
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.message).toMatch(/^entity: /);
    expect((await api(fieldToken).get(`/audit/site/${siteId}`)).status).toBe(403);
  });
});

describe("the weekly summary", () => {
  // Expected weeks from Python's datetime.date.isocalendar(), an independent ISO 8601 implementation.
  it.each([
    ["2021-01-03", "2020-W53"],
    ["2026-12-31", "2026-W53"],
    ["2027-01-04", "2027-W01"],
    ["2026-12-03", "2026-W49"],
  ])("puts %s in ISO week %s", (date, week) => {
    expect(isoWeek(new Date(`${date}T12:00:00Z`))).toBe(week);
  });

  it("goes once a week to reviewers who asked for it", async () => {
    const turnOn = await request(ctx.app)
      .put(`/api/campaigns/${campaignId}/reviews/summary`)
      .set("Authorization", `Bearer ${reviewerToken}`)
      .send({ weekly: true });
    expect(turnOn.body).toEqual({ weekly: true });
    const monday = new Date("2027-06-07T06:00:00Z");
    expect(await queueWeeklySummaries(ctx.appDb, monday, "http://equipot.test")).toBe(1);
    const friday = new Date("2027-06-11T06:00:00Z");
    expect(await queueWeeklySummaries(ctx.appDb, friday, "http://equipot.test")).toBe(0);
    const [mail] = await sql<{ to_address: string; text_body: string }>(
      "select to_address, text_body from email_outbox where message_key like 'review-summary:%'",
    );
    expect(mail?.to_address).toBe("reviewer@demo.equipot.test");
    expect(mail?.text_body).toMatch(/Records waiting for review in ".+": \d+/);
    expect(mail?.text_body).toMatch(/Approved\s+\d+/);
    const nextWeek = new Date("2027-06-14T06:00:00Z");
    expect(await queueWeeklySummaries(ctx.appDb, nextWeek, "http://equipot.test")).toBe(1);
    await request(ctx.app)
      .put(`/api/campaigns/${campaignId}/reviews/summary`)
      .set("Authorization", `Bearer ${reviewerToken}`)
      .send({ weekly: false });
    const later = new Date("2027-06-21T06:00:00Z");
    expect(await queueWeeklySummaries(ctx.appDb, later, "http://equipot.test")).toBe(0);
  });
});
