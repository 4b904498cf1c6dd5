// Administrators edit checklist templates over REST: each write advances the version and the
// campaign's change position (so tablets pull it) and leaves an audit event; other roles are
// refused, non-members see nothing, bad items are refused by field, and a run under way keeps
// the items it copied at its start.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { and, eq } from "drizzle-orm";
import { createTestContext, outsiderToken, signInAs, type TestContext } from "../helpers/app";
import { pullAll, pushAs, syncClient } from "../helpers/sync";
import { auditEvents, checklistTemplates, users } from "../../server/db/schema";
import type { ChecklistTemplateView } from "../../shared/schemas/checklists";

let ctx: TestContext;
let campaignId: string;
let adminToken: string;
let outsider: string;
let base: string;

beforeAll(async () => {
  ctx = await createTestContext();
  const admin = await signInAs(ctx.app, "admin");
  adminToken = admin.token;
  const field = await signInAs(ctx.app, "field");
  campaignId = field.memberships[0]?.campaignId ?? "";
  base = `/api/campaigns/${campaignId}/checklist-templates`;
  // An administrator of the other demo campaign only: a stranger to this one.
  const practice = admin.memberships.find((m) => m.campaignId !== campaignId)?.campaignId ?? "";
  if (!practice) throw new Error("no second demo campaign");
  outsider = await outsiderToken(ctx, practice, "admin");
});
afterAll(async () => {
  await ctx.close();
});

const auth = (token: string) => ({ Authorization: `Bearer ${token}` });

const newTemplate = (overrides: Record<string, unknown> = {}) => ({
  id: crypto.randomUUID(),
  title: "Cryostat cool-down",
  purpose: "other",
  items: [
    { kind: "check", id: "valves-closed", label: "Vent valves closed" },
    {
      kind: "number",
      id: "pressure",
      label: "Chamber pressure",
      unit: "hPa",
      min: 0,
      max: 1e-6,
    },
  ],
  ...overrides,
});

const templateRow = async (id: string) =>
  (await ctx.database.db.select().from(checklistTemplates).where(eq(checklistTemplates.id, id)))[0];

const templateChanges = async (token: string, id: string) => {
  const { changes } = await pullAll(ctx.app, token, campaignId);
  return changes.filter((c) => c.entity === "checklistTemplate" && c.id === id);
};

describe("checklist templates by an administrator", () => {
  it("creates, updates and deletes a template; tablets pull each version", async () => {
    const input = newTemplate();
    const created = await request(ctx.app).post(base).set(auth(adminToken)).send(input);
    expect(created.status).toBe(201);
    const template = created.body.template as ChecklistTemplateView;
    // Defaults filled in by the shared schema are what is stored and served.
    expect(template).toMatchObject({ id: input.id, campaignId, version: 1, deletedAt: null });
    expect(template.items[0]).toMatchObject({ help: "", required: true, caution: null });
    const first = await templateRow(input.id);

    const listed = await request(ctx.app).get(base).set(auth(adminToken));
    expect(listed.status).toBe(200);
    expect(listed.body.templates.map((t: { id: string }) => t.id)).toContain(input.id);

    const items = [
      ...input.items,
      {
        kind: "choice",
        id: "pump",
        label: "Pump state",
        options: ["Running", "Stopped"],
        caution: { hazard: "high-voltage", text: "Ion pump controller: follow local rules." },
      },
    ];
    const updated = await request(ctx.app)
      .put(`${base}/${input.id}`)
      .set(auth(adminToken))
      .send({ baseVersion: 1, title: "Cryostat cool-down (v2)", purpose: "other", items });
    expect(updated.status).toBe(200);
    expect(updated.body.template).toMatchObject({ version: 2, title: "Cryostat cool-down (v2)" });
    const second = await templateRow(input.id);
    expect(second?.changeSeq).toBeGreaterThan(first?.changeSeq ?? Infinity);
    const [admin] = await ctx.database.db
      .select({ id: users.id })
      .from(users)
      .where(eq(users.email, "admin@demo.equipot.test"));
    expect(second?.updatedBy).toBe(admin?.id);

    // A tablet (the field crew) pulls the new items.
    const field = await signInAs(ctx.app, "field");
    const pulled = await templateChanges(field.token, input.id);
    expect(pulled).toHaveLength(1);
    expect(pulled[0]?.seq).toBe(second?.changeSeq);
    const pulledItems = (pulled[0]?.data as ChecklistTemplateView).items;
    expect(pulledItems.map((i) => i.id)).toEqual(["valves-closed", "pressure", "pump"]);

    const [audit] = await ctx.database.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, input.id), eq(auditEvents.action, "update")));
    expect(audit).toMatchObject({ entity: "checklistTemplate", campaignId, userId: admin?.id });
    expect(audit?.before).toMatchObject({ version: 1, title: "Cryostat cool-down" });
    expect(audit?.after).toMatchObject({ version: 2, title: "Cryostat cool-down (v2)" });

    const removed = await request(ctx.app).delete(`${base}/${input.id}`).set(auth(adminToken));
    expect(removed.status).toBe(204);
    const third = await templateRow(input.id);
    expect(third?.deletedAt).toBeInstanceOf(Date);
    expect(third?.version).toBe(3);
    expect(third?.changeSeq).toBeGreaterThan(second?.changeSeq ?? Infinity);
    const after = await request(ctx.app).get(base).set(auth(adminToken));
    expect(after.body.templates.map((t: { id: string }) => t.id)).not.toContain(input.id);
    // The tombstone reaches the tablets too.
    const tombstone = await templateChanges(field.token, input.id);
    expect((tombstone[0]?.data as ChecklistTemplateView).deletedAt).not.toBeNull();
    const deleteAudit = await ctx.database.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, input.id), eq(auditEvents.action, "delete")));
    expect(deleteAudit[0]?.before).toMatchObject({ version: 2, deletedAt: null });
    expect(deleteAudit[0]?.after).toMatchObject({ version: 3 });

    const again = await request(ctx.app).delete(`${base}/${input.id}`).set(auth(adminToken));
    expect(again.status).toBe(404);
  });

  it("refuses a stale baseVersion with 409 naming the current version", async () => {
    const input = newTemplate();
    await request(ctx.app).post(base).set(auth(adminToken)).send(input).expect(201);
    const body = { baseVersion: 1, title: "First edit", purpose: "other", items: input.items };
    await request(ctx.app).put(`${base}/${input.id}`).set(auth(adminToken)).send(body).expect(200);
    const stale = await request(ctx.app)
      .put(`${base}/${input.id}`)
      .set(auth(adminToken))
      .send({ ...body, title: "Second edit from an old screen" });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("conflict");
    expect(stale.body.error.message).toContain("now version 2");
    expect((await templateRow(input.id))?.title).toBe("First edit");
  });

  it("refuses a template id that already exists", async () => {
    const input = newTemplate();
    await request(ctx.app).post(base).set(auth(adminToken)).send(input).expect(201);
    const res = await request(ctx.app).post(base).set(auth(adminToken)).send(input);
    expect(res.status).toBe(409);
  });
});

describe("who may edit templates", () => {
  it.each(["field", "logistics", "geodesist", "reviewer"])(
    "lets %s read but not write (403)",
    async (role) => {
      const { token } = await signInAs(ctx.app, role);
      expect((await request(ctx.app).get(base).set(auth(token))).status).toBe(200);
      const input = newTemplate();
      const post = await request(ctx.app).post(base).set(auth(token)).send(input);
      expect(post.status).toBe(403);
      const [arrival] = await ctx.database.db
        .select()
        .from(checklistTemplates)
        .where(
          and(
            eq(checklistTemplates.campaignId, campaignId),
            eq(checklistTemplates.purpose, "arrival"),
          ),
        );
      const put = await request(ctx.app)
        .put(`${base}/${arrival?.id}`)
        .set(auth(token))
        .send({ baseVersion: 1, title: "x", purpose: "arrival", items: input.items });
      expect(put.status).toBe(403);
      expect(
        (await request(ctx.app).delete(`${base}/${arrival?.id}`).set(auth(token))).status,
      ).toBe(403);
      expect((await templateRow(arrival?.id ?? ""))?.version).toBe(1);
    },
  );

  it("does not reach another campaign's template through one's own campaign", async () => {
    const admin = await signInAs(ctx.app, "admin");
    const practice = admin.memberships.find((m) => m.campaignId !== campaignId)?.campaignId ?? "";
    const [arrival] = await ctx.database.db
      .select()
      .from(checklistTemplates)
      .where(
        and(
          eq(checklistTemplates.campaignId, campaignId),
          eq(checklistTemplates.purpose, "arrival"),
        ),
      );
    const path = `/api/campaigns/${practice}/checklist-templates/${arrival?.id}`;
    const put = await request(ctx.app)
      .put(path)
      .set(auth(adminToken))
      .send({ baseVersion: 1, title: "Taken over", purpose: "arrival", items: arrival?.items });
    expect(put.status).toBe(404);
    expect((await request(ctx.app).delete(path).set(auth(adminToken))).status).toBe(404);
    const copy = await request(ctx.app)
      .post(`/api/campaigns/${practice}/checklist-templates`)
      .set(auth(adminToken))
      .send(newTemplate({ id: arrival?.id }));
    expect(copy.status).toBe(409);
    expect(JSON.stringify(copy.body)).not.toContain("Arrival");
    expect(await templateRow(arrival?.id ?? "")).toMatchObject({ campaignId, version: 1 });
  });

  it("answers 404 to someone outside the campaign, revealing nothing", async () => {
    const list = await request(ctx.app).get(base).set(auth(outsider));
    expect(list.status).toBe(404);
    expect(JSON.stringify(list.body)).not.toContain("Arrival");
    const post = await request(ctx.app).post(base).set(auth(outsider)).send(newTemplate());
    expect(post.status).toBe(404);
  });
});

describe("bad templates are refused by field", () => {
  const cases: [string, Record<string, unknown>, string][] = [
    [
      "duplicate item ids",
      {
        items: [
          { kind: "check", id: "same", label: "One" },
          { kind: "check", id: "same", label: "Two" },
        ],
      },
      "items",
    ],
    [
      "a number whose lowest allowed value is above the highest",
      { items: [{ kind: "number", id: "t", label: "Temperature", unit: "°C", min: 30, max: 20 }] },
      "items.0.max",
    ],
    [
      "a choice with one option",
      { items: [{ kind: "choice", id: "c", label: "Pick", options: ["Only"] }] },
      "items.0.options",
    ],
    ["an unknown kind", { items: [{ kind: "slider", id: "s", label: "Slide" }] }, "items.0.kind"],
    [
      "an extra field on an item",
      { items: [{ kind: "check", id: "c", label: "Check", colour: "red" }] },
      "items.0.colour",
    ],
    ["an extra field on the template", { version: 7 }, "version"],
    [
      "a NUL in a label",
      { items: [{ kind: "check", id: "c", label: "Bad\u0000label" }] },
      "items.0.label",
    ],
    [
      "a NUL in an option",
      { items: [{ kind: "choice", id: "c", label: "Pick", options: ["A", "B\u0000"] }] },
      "items.0.options.1",
    ],
    ["no items", { items: [] }, "items"],
    ["an unknown purpose", { purpose: "party" }, "purpose"],
  ];

  it.each(cases)("refuses %s", async (_name, overrides, path) => {
    const input = newTemplate(overrides);
    const res = await request(ctx.app).post(base).set(auth(adminToken)).send(input);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("validation_failed");
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(path);
    expect(await templateRow(input.id)).toBeUndefined();
  });

  it("refuses bad items on update too, leaving the template as it was", async () => {
    const input = newTemplate();
    await request(ctx.app).post(base).set(auth(adminToken)).send(input).expect(201);
    const res = await request(ctx.app)
      .put(`${base}/${input.id}`)
      .set(auth(adminToken))
      .send({
        baseVersion: 1,
        title: input.title,
        purpose: input.purpose,
        items: [{ kind: "number", id: "n", label: "N", min: 5, max: 1 }],
      });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe("items.0.max");
    expect((await templateRow(input.id))?.version).toBe(1);
  });
});

describe("runs under way", () => {
  it("keep the items they copied when the template is edited later", async () => {
    const field = await signInAs(ctx.app, "field");
    const { changes } = await pullAll(ctx.app, field.token, campaignId);
    const siteId = changes.find((c) => c.entity === "site")?.id ?? "";
    const input = newTemplate({ purpose: "arrival", title: "Short arrival" });
    await request(ctx.app).post(base).set(auth(adminToken)).send(input).expect(201);

    const client = syncClient();
    const runId = crypto.randomUUID();
    const started = await pushAs(ctx.app, field.token, {
      clientId: client.clientId,
      campaignId,
      mutations: [
        client.mutation("checklist.start", {
          id: runId,
          templateId: input.id,
          siteId,
          startedAt: "2027-06-03T07:30:00.000Z",
        }),
      ],
    });
    expect(started.body.results[0]?.status).toBe("applied");

    const replaced = [{ kind: "text", id: "remarks", label: "Remarks" }];
    await request(ctx.app)
      .put(`${base}/${input.id}`)
      .set(auth(adminToken))
      .send({ baseVersion: 1, title: "Short arrival", purpose: "arrival", items: replaced })
      .expect(200);

    const after = await pullAll(ctx.app, field.token, campaignId);
    const run = after.changes.filter((c) => c.entity === "checklistRun" && c.id === runId).at(-1);
    expect((run?.data as { items: { id: string }[] }).items.map((i) => i.id)).toEqual([
      "valves-closed",
      "pressure",
    ]);
    const template = after.changes.filter(
      (c) => c.entity === "checklistTemplate" && c.id === input.id,
    );
    expect((template.at(-1)?.data as ChecklistTemplateView).items.map((i) => i.id)).toEqual([
      "remarks",
    ]);
    // A result for an item the template no longer has is still accepted by the run.
    const recorded = await pushAs(ctx.app, field.token, {
      clientId: client.clientId,
      campaignId,
      mutations: [
        client.mutation("checklist.record", {
          id: crypto.randomUUID(),
          runId,
          itemId: "valves-closed",
          value: true,
          recordedAt: "2027-06-03T07:35:00.000Z",
        }),
      ],
    });
    expect(recorded.body.results[0]?.status).toBe("applied");
  });
});
