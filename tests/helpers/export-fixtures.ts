// Records of every kind added to the demo campaign through the real APIs, so that an export and
// its import cover every table: field records by sync push, a file, a comparison series, a review.
import request from "supertest";
import { createHash } from "node:crypto";
import { expect } from "vitest";
import type { TestContext } from "./app";
import { seriesCsv, whiteFmSeries } from "./series";
import { pushAs, syncClient } from "./sync";

let ctx: TestContext;
let campaignId: string;
let tokens: Record<string, string>;
export const attachmentBytes = Buffer.from("mark,reading_m\nEQ-1,1.2345\nEQ-2,0.9876\n");
export const attachmentSha = createHash("sha256").update(attachmentBytes).digest("hex");

const auth = (role: string) => ({ Authorization: `Bearer ${tokens[role] ?? ""}` });
const query = (text: string, values: unknown[] = []) => ctx.database.pool.query(text, values);

export async function firstId(table: string): Promise<string> {
  const r = await query(
    `select id from ${table} where campaign_id = $1 order by change_seq limit 1`,
    [campaignId],
  );
  const id: unknown = r.rows[0]?.id;
  if (typeof id !== "string") throw new Error(`the demo has no ${table}`);
  return id;
}

async function addAttachment() {
  const put = await request(ctx.app)
    .put(`/api/campaigns/${campaignId}/attachments/${attachmentSha}`)
    .set(auth("field"))
    .set("Content-Type", "text/csv")
    .set("x-file-name", "readings.csv")
    .send(attachmentBytes);
  expect(put.status, JSON.stringify(put.body)).toBe(201);
  const client = syncClient();
  const link = {
    id: crypto.randomUUID(),
    sha256: attachmentSha,
    contentType: "text/csv",
    sizeBytes: attachmentBytes.length,
    name: "readings.csv",
    subject: { kind: "site", id: await firstId("sites") },
    caption: "Staff readings",
    takenAt: "2027-06-02T09:15:00.000Z",
  };
  const pushed = await pushAs(ctx.app, tokens.field ?? "", {
    clientId: client.clientId,
    campaignId,
    mutations: [client.mutation("attachment.add", link)],
  });
  expect(pushed.body.results[0]?.status).toBe("applied");
}

async function addInstrument(kind: "clock" | "link", name: string) {
  const id = crypto.randomUUID();
  const res = await request(ctx.app)
    .post(`/api/campaigns/${campaignId}/instruments`)
    .set(auth("geodesist"))
    .send({
      id,
      instrument: {
        kind,
        name,
        instabilityAt1s: 3e-15,
        systematic: [{ name: "BBR", value: 2e-18 }],
      },
    });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return id;
}

async function addSeries() {
  const runId = crypto.randomUUID();
  const run = await request(ctx.app)
    .post(`/api/campaigns/${campaignId}/comparison-runs`)
    .set(auth("geodesist"))
    .send({
      id: runId,
      run: {
        name: "Export run",
        remoteSiteId: await firstId("sites"),
        remoteClockId: await addInstrument("clock", "Export remote clock"),
        referenceClockId: await addInstrument("clock", "Export reference clock"),
        linkName: "fibre link",
        targetHeightUncertaintyM: 0.01,
      },
    });
  expect(run.status, JSON.stringify(run.body)).toBe(201);
  // One sample flagged invalid: stored as NaN, it must travel through the archive as such.
  const csv = seriesCsv(
    whiteFmSeries({ startUnixS: Date.UTC(2027, 6, 1) / 1000, count: 300, seed: 7 }),
  )
    .trim()
    .split("\n")
    .map((line, i) => (i === 0 ? `${line},valid` : `${line},${i === 100 ? 0 : 1}`))
    .join("\n");
  const up = await request(ctx.app)
    .post(`/api/campaigns/${campaignId}/comparison-runs/${runId}/files?fileName=series.csv`)
    .set(auth("geodesist"))
    .set("Content-Type", "text/csv")
    .send(csv);
  expect(up.status, JSON.stringify(up.body)).toBe(201);
  return String((up.body as { file: { id: string } }).file.id);
}

async function addReview() {
  const leg = await query(
    `select id, change_seq from legs where campaign_id = $1 order by change_seq limit 1`,
    [campaignId],
  );
  const row = leg.rows[0] as { id: string; change_seq: string };
  const res = await request(ctx.app)
    .post(`/api/campaigns/${campaignId}/reviews`)
    .set(auth("reviewer"))
    .send({
      subjectKind: "leg",
      subjectId: row.id,
      decision: "approved",
      reviewedSeq: Number(row.change_seq),
    });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
}

/** Field records of every kind through the sync push, as tablets send them. */
async function addFieldRecords() {
  const at = "2027-06-04T08:00:00.000Z";
  const siteId = await firstId("sites");
  const crateId = await firstId("crates");
  const template = await query(
    `select id, items from checklist_templates where campaign_id = $1 order by change_seq limit 1`,
    [campaignId],
  );
  const { id: templateId, items } = template.rows[0] as { id: string; items: { id: string }[] };
  const runId = crypto.randomUUID();
  const sectionId = crypto.randomUUID();
  const client = syncClient();
  const m = client.mutation;
  const setup = (run: "forward" | "backward", bs: number, fs: number) =>
    m("levelling.setup", {
      id: crypto.randomUUID(),
      sectionId,
      run,
      number: 1,
      backsightM: bs,
      foresightM: fs,
      backsightDistanceM: 30,
      foresightDistanceM: 30,
      recordedAt: at,
    });
  const entry = (data: Record<string, unknown>, crate: string | null = crateId) =>
    m("entry.add", {
      id: crypto.randomUUID(),
      siteId,
      crateId: crate,
      observedAt: at,
      recordedAt: at,
      data,
    });
  const mutations = [
    m("checklist.start", { id: runId, templateId, siteId, startedAt: at }),
    m("checklist.record", {
      id: crypto.randomUUID(),
      runId,
      itemId: items[0]?.id,
      value: true,
      recordedAt: at,
    }),
    entry({ kind: "shock-indicator", ratingG: 10, tripped: true }),
    entry({
      kind: "dew-point",
      runId,
      roomTemperatureC: 20,
      roomHumidityPct: 40,
      surfaceTemperatureC: 18,
    }),
    m("levelling.open", {
      id: sectionId,
      siteId,
      fromMark: "EX-1",
      toMark: "EX-2",
      classId: "fgcc-1984-second-order-class-i",
      instrument: "",
      openedAt: at,
    }),
    setup("forward", 1.5, 1.2),
    setup("backward", 1.2, 1.5),
    m("levelling.close", { id: sectionId, closedAt: "2027-06-04T09:00:00.000Z" }),
    m("handover.record", {
      id: crypto.randomUUID(),
      crateId,
      fromName: "Depot",
      toName: "Ines Varga",
      at,
      condition: "intact",
    }),
  ];
  const pushed = await pushAs(ctx.app, tokens.field ?? "", {
    clientId: client.clientId,
    campaignId,
    mutations,
  });
  expect(pushed.body.results.map((r) => [r.status, r.message])).toEqual(
    mutations.map(() => ["applied", undefined]),
  );
  const adjusted = await request(ctx.app)
    .post(`/api/campaigns/${campaignId}/levelling-adjustments`)
    .set(auth("geodesist"))
    .send({});
  expect(adjusted.status, JSON.stringify(adjusted.body)).toBe(201);
}

/** Adds the records; returns the id of the comparison file it uploaded. */
export async function addExportFixtures(
  context: TestContext,
  campaign: string,
  roleTokens: Record<string, string>,
): Promise<string> {
  ctx = context;
  campaignId = campaign;
  tokens = roleTokens;
  await addFieldRecords();
  await addAttachment();
  const fileId = await addSeries();
  await addReview();
  // A later edit moves the first site to a new position, leaving a gap before the reviewed leg.
  const edited = await request(ctx.app)
    .patch(`/api/campaigns/${campaignId}/sites/${await firstId("sites")}`)
    .set(auth("geodesist"))
    .send({ baseVersion: 1, notes: "=Edited after the review, starts with =" });
  expect(edited.status, JSON.stringify(edited.body)).toBe(200);
  return fileId;
}
