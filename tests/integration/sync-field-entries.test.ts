// Field entries through push and pull on the real server and PostgreSQL: every kind is stored with
// the server's verdict against its crate's limits, bad rows are refused naming the field without
// blocking the queue, nothing crosses campaigns, crates are pulled read-only, and an unpacking
// checklist is signed off only after a dew-point check that passed or was overridden.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, inArray } from "drizzle-orm";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import {
  foreignCampaignWithSite,
  insertCrate,
  pullAll,
  pushAs,
  syncClient,
  type TestSyncClient,
} from "../helpers/sync";
import { nextChangeSeq } from "../../server/db/change-seq";
import { fieldEntries } from "../../server/db/schema";
import type { ChecklistTemplateView } from "../../shared/schemas/checklists";
import type { CrateView } from "../../shared/schemas/crates";
import type { FieldEntryDataInput, FieldEntryView } from "../../shared/schemas/field-entries";
import { changeRecord } from "../../shared/sync/protocol";

let ctx: TestContext;
let campaignId: string;
let token: string;
let fieldUser: { id: string; name: string };
let siteId: string;
let crates: CrateView[];
let unpacking: ChecklistTemplateView;

const at = "2027-06-04T08:00:00.000Z";

beforeAll(async () => {
  ctx = await createTestContext();
  const field = await signInAs(ctx.app, "field");
  token = field.token;
  fieldUser = (field.body as { user: { id: string; name: string } }).user;
  campaignId = field.memberships[0]?.campaignId ?? "";
  const { changes } = await pullAll(ctx.app, token, campaignId);
  siteId = changes.find((c) => c.entity === "site")?.id ?? "";
  crates = changes.flatMap((c) => (c.entity === "crate" ? [c.data] : []));
  const template = changes.find(
    (c) => c.entity === "checklistTemplate" && c.data.purpose === "unpacking",
  );
  if (template?.entity !== "checklistTemplate") throw new Error("no demo unpacking checklist");
  unpacking = template.data;
});
afterAll(async () => {
  await ctx.close();
});

const crate = (label: string) => {
  const found = crates.find((c) => c.label === label);
  if (!found) throw new Error(`demo crate ${label} was not pulled`);
  return found;
};

const push = (client: TestSyncClient, mutations: ReturnType<TestSyncClient["mutation"]>[]) =>
  pushAs(ctx.app, token, { clientId: client.clientId, campaignId, mutations });

const entry = (
  data: FieldEntryDataInput | Record<string, unknown>,
  overrides: Record<string, unknown> = {},
) => ({
  id: crypto.randomUUID(),
  siteId,
  crateId: crate("KR-03").id,
  observedAt: at,
  recordedAt: at,
  data,
  ...overrides,
});

async function addAndPull(args: ReturnType<typeof entry>): Promise<FieldEntryView> {
  const client = syncClient();
  const res = await push(client, [client.mutation("entry.add", args)]);
  expect(res.body.results.map((r) => [r.status, r.message])).toEqual([["applied", undefined]]);
  const { changes } = await pullAll(ctx.app, token, campaignId);
  const pulled = changes.find((c) => c.id === args.id);
  // The wire schema, not only the type: what a tablet would accept.
  const parsed = changeRecord.parse(pulled);
  if (parsed.entity !== "fieldEntry") throw new Error(`pulled ${parsed.entity}, not fieldEntry`);
  return parsed.data;
}

const shockEvent = (xG: number | null, overrides: Record<string, unknown> = {}) => ({
  at,
  xG,
  yG: null,
  zG: null,
  durationMs: 11,
  ...overrides,
});

/** Dew point by the Magnus form, written out here on its own (REFERENCES.md §5: a = 17.625, b = 243.04 °C). */
function magnusDewPoint(t: number, rh: number): number {
  const gamma = Math.log(rh / 100) + (17.625 * t) / (243.04 + t);
  return (243.04 * gamma) / (17.625 - gamma);
}

describe("field entries through sync", () => {
  it("pulls the demo crates, and a deleted one as a tombstone", async () => {
    expect(crates.map((c) => c.label).sort()).toEqual([
      "KR-01",
      "KR-02",
      "KR-03",
      "KR-04",
      "KR-05",
    ]);
    expect(crate("KR-03")).toMatchObject({
      maxShockG: 15,
      temperatureMinC: 18,
      temperatureMaxC: 25,
    });
    const db = ctx.database.db;
    const gone = await insertCrate(db, campaignId, {
      label: "KR-09",
      deletedAt: new Date(at),
      changeSeq: await nextChangeSeq(db, campaignId),
    });
    const { changes } = await pullAll(ctx.app, token, campaignId);
    const tombstone = changes.find((c) => c.id === gone);
    expect(tombstone?.entity === "crate" && tombstone.data.deletedAt).toBe(
      new Date(at).toISOString(),
    );
    expect(changes.filter((c) => c.entity === "crate" && c.data.deletedAt === null)).toHaveLength(
      5,
    );
  });

  it("applies every kind of entry and pulls it back with its author's name", async () => {
    const kinds: [string, FieldEntryDataInput, string | null][] = [
      [
        "shock-indicator",
        { kind: "shock-indicator", ratingG: 25, tripped: false, indicatorLabel: "Red 25 g" },
        crate("KR-01").id,
      ],
      [
        "shock-log",
        { kind: "shock-log", source: "manual", events: [shockEvent(4.2)] },
        crate("KR-01").id,
      ],
      [
        "temperatures",
        { kind: "temperatures", source: "manual", samples: [{ at, celsius: 21, humidityPct: 40 }] },
        null,
      ],
      [
        "dew-point",
        {
          kind: "dew-point",
          roomTemperatureC: 20,
          roomHumidityPct: 40,
          surfaceTemperatureC: 19,
        },
        crate("KR-01").id,
      ],
      ["observation", { kind: "observation", text: "  Straps loose on the lid  " }, null],
    ];
    for (const [kind, data, crateId] of kinds) {
      const view = await addAndPull(entry(data, { crateId, note: `${kind} note` }));
      expect(view).toMatchObject({
        campaignId,
        siteId,
        crateId,
        kind,
        observedAt: at,
        recordedAt: at,
        note: `${kind} note`,
        recordedBy: fieldUser.id,
        recordedByName: "Mira Castell",
      });
      expect(view.recordedByName).toBe(fieldUser.name);
      expect(view.data.kind).toBe(kind);
    }
    const { changes } = await pullAll(ctx.app, token, campaignId);
    const observation = changes.find(
      (c) => c.entity === "fieldEntry" && c.data.kind === "observation",
    );
    // Trimmed and defaulted as the schema says, and the summary is the text.
    expect(observation?.data).toMatchObject({
      data: { kind: "observation", text: "Straps loose on the lid" },
      flags: { exceeded: false, summary: "Straps loose on the lid" },
    });
    const dew = changes.find((c) => c.entity === "fieldEntry" && c.data.kind === "dew-point");
    expect(dew?.data).toMatchObject({ data: { runId: null, marginK: 3, overrideReason: "" } });
  });

  it("flags a tripped indicator, and shock peaks against the crate's limit", async () => {
    const tripped = await addAndPull(
      entry({ kind: "shock-indicator", ratingG: 10, tripped: true }),
    );
    expect(tripped.flags).toEqual({ exceeded: true, summary: "Indicator tripped (rated 10 g)" });

    // KR-03 allows 15 g (demo scenario).
    const above = await addAndPull(
      entry({
        kind: "shock-log",
        source: "logger",
        loggerModel: "Demo logger",
        events: [shockEvent(9), shockEvent(null, { zG: 22.4 })],
      }),
    );
    expect(above.flags.exceeded).toBe(true);
    expect(above.flags.summary).toBe("1 peak above 15 g; highest 22.4 g on z");

    const below = await addAndPull(
      entry({ kind: "shock-log", source: "manual", events: [shockEvent(9), shockEvent(14.9)] }),
    );
    expect(below.flags).toEqual({
      exceeded: false,
      summary: "2 events, peak 14.9 g, within 15 g",
    });
  });

  it("flags temperatures outside the crate's band with the minutes outside", async () => {
    const t0 = Date.parse(at);
    const sample = (minutes: number, celsius: number) => ({
      at: new Date(t0 + minutes * 60_000).toISOString(),
      celsius,
      humidityPct: null,
    });
    // KR-03 band 18 … 25 °C. Linear between samples: 20 → 30 °C over 10 min crosses 25 °C at
    // 5 min, 30 → 20 °C crosses it again 5 min after the peak: 5 + 5 = 10 min above (by hand).
    const handMinutesOutside = 10 - 5 + 5;
    const outside = await addAndPull(
      entry({
        kind: "temperatures",
        source: "logger",
        samples: [sample(0, 20), sample(10, 30), sample(20, 20)],
      }),
    );
    expect(outside.flags.exceeded).toBe(true);
    expect(outside.flags.summary).toBe(
      `3 readings, 20 °C … 30 °C: outside 18 °C … 25 °C, ${handMinutesOutside} min outside`,
    );

    const inside = await addAndPull(
      entry({ kind: "temperatures", source: "manual", samples: [sample(0, 19), sample(10, 24)] }),
    );
    expect(inside.flags).toEqual({
      exceeded: false,
      summary: "2 readings, 19 °C … 24 °C, within 18 °C … 25 °C",
    });

    // Without a crate there is no band to be outside of.
    const noCrate = await addAndPull(
      entry(
        { kind: "temperatures", source: "manual", samples: [sample(0, 40)] },
        { crateId: null },
      ),
    );
    expect(noCrate.flags).toEqual({ exceeded: false, summary: "1 reading, 40 °C … 40 °C" });
  });

  it("judges the dew-point check by the Magnus formula", async () => {
    // REFERENCES.md §5: T_d(25 °C, 60 %) = 16.698 °C; and the formula written out in this test.
    const dewPointC = magnusDewPoint(25, 60);
    expect(dewPointC).toBeCloseTo(16.698, 3);
    const needs = `${(dewPointC + 3).toFixed(1)} °C`;
    const check = (surfaceTemperatureC: number, overrideReason = "") =>
      entry({
        kind: "dew-point",
        roomTemperatureC: 25,
        roomHumidityPct: 60,
        surfaceTemperatureC,
        overrideReason,
      });

    const passes = await addAndPull(check(21));
    expect(passes.flags).toEqual({
      exceeded: false,
      summary: `May open: surface 21 °C, needs ${needs}`,
    });
    const fails = await addAndPull(check(18));
    expect(fails.flags).toEqual({
      exceeded: true,
      summary: `Do not open yet: surface 18 °C, needs ${needs} (dew point ${dewPointC.toFixed(1)} °C)`,
    });
    const overridden = await addAndPull(check(18, "Shelter heating failed; opened under a tent"));
    expect(overridden.flags.exceeded).toBe(false);
    expect(overridden.flags.summary).toMatch(/^Opened against the check: surface 18 °C/);
  });

  it("refuses bad rows naming the field, stores none of them, and moves the queue on", async () => {
    const client = syncClient();
    const bad = [
      entry({ kind: "shock-log", source: "manual", events: [shockEvent(1500)] }),
      entry({ kind: "shock-indicator", ratingG: 10, tripped: true }, { crateId: null }),
      entry({ kind: "observation", text: "door\u0000jammed" }, { crateId: null }),
      entry({ kind: "humidity", percent: 40 }),
      { ...entry({ kind: "observation", text: "fine" }), colour: "red" },
    ];
    const good = entry({ kind: "observation", text: "All crates on the pallet" });
    const res = await push(client, [
      ...bad.map((args) => client.mutation("entry.add", args)),
      client.mutation("entry.add", good),
    ]);
    expect(res.status).toBe(200);
    expect(res.body.results.map((r) => [r.status, r.message])).toEqual([
      ["rejected", "Invalid entry.add: data.events.0.xG: Peak x must be between 0 and 1000 g"],
      ["rejected", "Invalid entry.add: crateId: Choose the crate this entry is about"],
      [
        "rejected",
        "Invalid entry.add: data.text: Observation contains a NUL character, which cannot be stored",
      ],
      [
        "rejected",
        "Invalid entry.add: data.kind: Invalid discriminator value. Expected 'shock-indicator' | 'shock-log' | 'temperatures' | 'dew-point' | 'observation'",
      ],
      ["rejected", 'Invalid entry.add: Unrecognized key: "colour"'],
      ["applied", undefined],
    ]);
    expect(res.body.lastMutationId).toBe(6);
    const stored = await ctx.database.db
      .select({ id: fieldEntries.id })
      .from(fieldEntries)
      .where(
        inArray(
          fieldEntries.id,
          [...bad, good].map((b) => b.id),
        ),
      );
    expect(stored.map((s) => s.id)).toEqual([good.id]);
  });

  it("refuses a taken id, a site or crate of another campaign and a deleted crate", async () => {
    const db = ctx.database.db;
    const foreign = await foreignCampaignWithSite(db, "F");
    const foreignCrate = await insertCrate(db, foreign.campaignId, { label: "F-secret-crate" });
    const deletedCrate = await insertCrate(db, campaignId, {
      label: "KR-08",
      deletedAt: new Date(at),
      changeSeq: await nextChangeSeq(db, campaignId),
    });
    const first = entry({ kind: "observation", text: "first" });
    const client = syncClient();
    const indicator = { kind: "shock-indicator", ratingG: 10, tripped: false } as const;
    const res = await push(client, [
      client.mutation("entry.add", first),
      client.mutation("entry.add", { ...first, data: { kind: "observation", text: "again" } }),
      client.mutation("entry.add", entry(indicator, { siteId: foreign.siteId })),
      client.mutation("entry.add", entry(indicator, { crateId: foreignCrate })),
      client.mutation("entry.add", entry(indicator, { crateId: deletedCrate })),
      client.mutation("entry.add", entry(indicator, { crateId: crypto.randomUUID() })),
    ]);
    expect(res.body.results.map((r) => [r.status, r.message])).toEqual([
      ["applied", undefined],
      ["rejected", "A field entry with this id already exists"],
      ["rejected", "The site of this entry is not in this campaign"],
      ["rejected", "The crate of this entry is not in this campaign"],
      ["rejected", "The crate of this entry is not in this campaign"],
      ["rejected", "The crate of this entry is not in this campaign"],
    ]);
    expect(JSON.stringify(res.body)).not.toContain("F-secret");
    const [kept] = await db.select().from(fieldEntries).where(eq(fieldEntries.id, first.id));
    expect(kept?.data).toMatchObject({ text: "first" });
  });

  it("refuses a reviewer by role and answers a repeated mutation id as duplicate", async () => {
    const reviewer = await signInAs(ctx.app, "reviewer");
    const other = syncClient();
    const refused = await pushAs(ctx.app, reviewer.token, {
      clientId: other.clientId,
      campaignId,
      mutations: [other.mutation("entry.add", entry({ kind: "observation", text: "seen" }))],
    });
    expect(refused.body.results[0]).toMatchObject({
      status: "rejected",
      message: expect.stringMatching(/Your role in this campaign does not allow/),
    });

    const client = syncClient();
    const once = client.mutation("entry.add", entry({ kind: "observation", text: "once" }));
    expect((await push(client, [once])).body.results[0]?.status).toBe("applied");
    const again = await push(client, [once]);
    expect(again.body.results.map((r) => r.status)).toEqual(["duplicate"]);
    const stored = await ctx.database.db
      .select()
      .from(fieldEntries)
      .where(eq(fieldEntries.id, (once.args as { id: string }).id));
    expect(stored).toHaveLength(1);
  });

  it("attaches a file to a field entry, and refuses an unknown one", async () => {
    const target = entry({ kind: "observation", text: "Dent on the corner" }, { crateId: null });
    await addAndPull(target);
    const link = (subjectId: string) => ({
      id: crypto.randomUUID(),
      sha256: "cd".repeat(32),
      contentType: "image/jpeg",
      sizeBytes: 4096,
      name: "dent.jpg",
      subject: { kind: "fieldEntry", id: subjectId },
    });
    const client = syncClient();
    const onEntry = link(target.id);
    const res = await push(client, [
      client.mutation("attachment.add", onEntry),
      client.mutation("attachment.add", link(crypto.randomUUID())),
    ]);
    expect(res.body.results.map((r) => [r.status, r.message])).toEqual([
      ["applied", undefined],
      ["rejected", "The fieldEntry this file belongs to is not in this campaign"],
    ]);
    const { changes } = await pullAll(ctx.app, token, campaignId);
    expect(changes.find((c) => c.id === onEntry.id)?.data).toMatchObject({
      subject: { kind: "fieldEntry", id: target.id },
    });
  });
});

describe("the dew-point gate on an unpacking checklist", () => {
  const answers: Record<string, unknown> = { check: true, text: "none", number: 1 };

  async function completedRun(client: TestSyncClient): Promise<string> {
    const runId = crypto.randomUUID();
    const res = await push(client, [
      client.mutation("checklist.start", {
        id: runId,
        templateId: unpacking.id,
        siteId,
        startedAt: at,
      }),
      ...unpacking.items
        .filter((i) => i.required)
        .map((item) =>
          client.mutation("checklist.record", {
            id: crypto.randomUUID(),
            runId,
            itemId: item.id,
            value: item.kind === "photo" ? crypto.randomUUID() : answers[item.kind],
            recordedAt: at,
          }),
        ),
    ]);
    expect(res.body.results.every((r) => r.status === "applied")).toBe(true);
    return runId;
  }

  const dewPoint = (runId: string | null, surfaceTemperatureC: number, overrideReason = "") =>
    entry(
      {
        kind: "dew-point",
        runId,
        roomTemperatureC: 25,
        roomHumidityPct: 60,
        surfaceTemperatureC,
        overrideReason,
      },
      { crateId: crate("KR-01").id },
    );

  const gate =
    "Not signed off: the dew-point check must pass, or be overridden with a reason, before the crate is unpacked";

  it("refuses sign-off without a clearing check, then signs off after one that passed", async () => {
    const client = syncClient();
    const runId = await completedRun(client);
    const otherRun = await completedRun(client);
    const signOff = () => client.mutation("checklist.signOff", { id: runId, signedOffAt: at });
    const res = await push(client, [
      signOff(),
      // A failed check, and a passed one for another run, do not clear this run.
      client.mutation("entry.add", dewPoint(runId, 18)),
      client.mutation("entry.add", dewPoint(otherRun, 21)),
      client.mutation("entry.add", dewPoint(null, 21)),
      signOff(),
      client.mutation("entry.add", dewPoint(runId, 21)),
      signOff(),
    ]);
    expect(res.body.results.map((r) => [r.status, r.message])).toEqual([
      ["rejected", gate],
      ["applied", undefined],
      ["applied", undefined],
      ["applied", undefined],
      ["rejected", gate],
      ["applied", undefined],
      ["applied", undefined],
    ]);
    const { changes } = await pullAll(ctx.app, token, campaignId);
    const run = changes.filter((c) => c.id === runId).at(-1);
    expect(run?.data).toMatchObject({ signedOffAt: at });
  });

  it("signs off after a failed check that was overridden with a reason", async () => {
    const client = syncClient();
    const runId = await completedRun(client);
    const res = await push(client, [
      client.mutation("entry.add", dewPoint(runId, 18, "Optics sealed in bags; opened in a tent")),
      client.mutation("checklist.signOff", { id: runId, signedOffAt: at }),
    ]);
    expect(res.body.results.map((r) => r.status)).toEqual(["applied", "applied"]);
  });
});
