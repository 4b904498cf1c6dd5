// Checklist runs through push and pull on the real server: a run copies its template's items,
// results are append-only with out-of-range numbers flagged by the server, sign-off needs every
// required item and closes the run, and nothing crosses into another campaign.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { pullAll, pushAs, syncClient, type TestSyncClient } from "../helpers/sync";
import { checklistResults, checklistTemplates, sites, users } from "../../server/db/schema";
import type { ChecklistTemplateView } from "../../shared/schemas/checklists";

let ctx: TestContext;
let campaignId: string;
let token: string;
let arrival: ChecklistTemplateView;
let siteId: string;

const at = "2027-06-03T07:30:00.000Z";

beforeAll(async () => {
  ctx = await createTestContext();
  const field = await signInAs(ctx.app, "field");
  token = field.token;
  campaignId = field.memberships[0]?.campaignId ?? "";
  const { changes } = await pullAll(ctx.app, token, campaignId);
  const templates = changes.flatMap((c) => (c.entity === "checklistTemplate" ? [c.data] : []));
  const found = templates.find((t) => t.purpose === "arrival");
  if (!found) throw new Error("the demo arrival checklist was not pulled");
  arrival = found;
  siteId = changes.find((c) => c.entity === "site")?.id ?? "";
});
afterAll(async () => {
  await ctx.close();
});

const push = (client: TestSyncClient, mutations: ReturnType<TestSyncClient["mutation"]>[]) =>
  pushAs(ctx.app, token, { clientId: client.clientId, campaignId, mutations });

const record = (client: TestSyncClient, runId: string, itemId: string, value: unknown) =>
  client.mutation("checklist.record", {
    id: crypto.randomUUID(),
    runId,
    itemId,
    value,
    recordedAt: at,
  });

describe("checklists through sync", () => {
  it("pulls the six demo templates with their cautions", async () => {
    const { changes } = await pullAll(ctx.app, token, campaignId);
    const templates = changes.flatMap((c) => (c.entity === "checklistTemplate" ? [c.data] : []));
    expect(templates.map((t) => t.purpose).sort()).toEqual([
      "arrival",
      "comparison-start",
      "laser-lockup",
      "pack-down",
      "unpacking",
      "vacuum-bakeout",
    ]);
    const weather = arrival.items.find((i) => i.id === "weather");
    expect(weather?.caution?.hazard).toBe("weather");
  });

  it("runs a checklist: results flagged out of range, sign-off refused until complete, then closed", async () => {
    const client = syncClient();
    const runId = crypto.randomUUID();
    const start = client.mutation("checklist.start", {
      id: runId,
      templateId: arrival.id,
      siteId,
      startedAt: at,
    });
    const first = await push(client, [
      start,
      record(client, runId, "room-temp", 31.5),
      record(client, runId, "room-temp", "warm"),
      record(client, runId, "no-such-item", true),
      client.mutation("checklist.signOff", { id: runId, signedOffAt: at }),
    ]);
    expect(first.body.results.map((r) => [r.status, r.message])).toEqual([
      ["applied", undefined],
      ["applied", undefined],
      ["rejected", "Room temperature at the clock's place: expected a number"],
      ["rejected", 'This checklist has no item "no-such-item"'],
      ["rejected", expect.stringMatching(/^Not signed off: no result yet for Access road/)],
    ]);
    const [flagged] = await ctx.database.db
      .select()
      .from(checklistResults)
      .where(eq(checklistResults.runId, runId));
    expect(flagged).toMatchObject({ itemId: "room-temp", value: 31.5, outOfRange: true });

    const required = arrival.items.filter((i) => i.required && i.id !== "room-temp");
    const answers: Record<string, unknown> = {
      check: true,
      number: 2,
      choice: "Stable",
      text: "fine",
      photo: crypto.randomUUID(),
    };
    const second = await push(client, [
      ...required.map((item) => record(client, runId, item.id, answers[item.kind])),
      client.mutation("checklist.signOff", { id: runId, signedOffAt: at, note: "All present" }),
      record(client, runId, "arrival-notes", "too late"),
      client.mutation("checklist.signOff", { id: runId, signedOffAt: at }),
    ]);
    const statuses = second.body.results.map((r) => r.status);
    expect(statuses.slice(0, required.length + 1).every((s) => s === "applied")).toBe(true);
    expect(second.body.results.slice(-2).map((r) => r.message)).toEqual([
      "This checklist was already signed off; the result is kept for recovery",
      "Already signed off",
    ]);

    const { changes } = await pullAll(ctx.app, token, campaignId);
    const run = changes.filter((c) => c.entity === "checklistRun" && c.id === runId).at(-1);
    expect(run?.data).toMatchObject({
      title: "Arrival at the site",
      siteId,
      signOffNote: "All present",
      signedOffAt: at,
    });
    const results = changes.filter((c) => c.entity === "checklistResult" && c.data.runId === runId);
    expect(results).toHaveLength(required.length + 1);
    // Each result carries its author's name, so the tablet can show who recorded it.
    const [author] = await ctx.database.db
      .select({ name: users.name })
      .from(users)
      .where(eq(users.email, "field@demo.equipot.test"));
    expect(
      new Set(results.map((r) => r.entity === "checklistResult" && r.data.recordedByName)),
    ).toEqual(new Set([author?.name]));
  });

  it("keeps a started run's items when the template changes later", async () => {
    const client = syncClient();
    const runId = crypto.randomUUID();
    await push(client, [
      client.mutation("checklist.start", {
        id: runId,
        templateId: arrival.id,
        siteId,
        startedAt: at,
      }),
    ]);
    await ctx.database.db
      .update(checklistTemplates)
      .set({
        items: [
          {
            kind: "check",
            id: "only",
            label: "Only item",
            help: "",
            required: true,
            caution: null,
          },
        ],
      })
      .where(eq(checklistTemplates.id, arrival.id));
    const res = await push(client, [record(client, runId, "room-temp", 21)]);
    expect(res.body.results[0]?.status).toBe("applied");
  });

  it("refuses a run at a site of another campaign and a reviewer by role", async () => {
    const admin = await signInAs(ctx.app, "admin");
    const practice = admin.memberships.find((m) => m.campaignId !== campaignId)?.campaignId ?? "";
    const foreignSite = crypto.randomUUID();
    await ctx.database.db.insert(sites).values({
      id: foreignSite,
      campaignId: practice,
      name: "Practice shed",
      kind: "other",
      latitudeDeg: 1,
      longitudeDeg: 1,
      approxHeightM: 1,
      changeSeq: 1,
    });
    const client = syncClient();
    const res = await push(client, [
      client.mutation("checklist.start", {
        id: crypto.randomUUID(),
        templateId: arrival.id,
        siteId: foreignSite,
        startedAt: at,
      }),
    ]);
    expect(res.body.results[0]?.message).toBe("The site of this checklist is not in this campaign");
    expect(JSON.stringify(res.body)).not.toContain("Practice shed");

    const reviewer = await signInAs(ctx.app, "reviewer");
    const other = syncClient();
    const refused = await pushAs(ctx.app, reviewer.token, {
      clientId: other.clientId,
      campaignId,
      mutations: [
        other.mutation("checklist.start", {
          id: crypto.randomUUID(),
          templateId: arrival.id,
          siteId,
          startedAt: at,
        }),
      ],
    });
    expect(refused.body.results[0]?.message).toMatch(/Your role in this campaign does not allow/);
  });
});
