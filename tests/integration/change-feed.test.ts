// The pull reads every synced table in one statement (server/db/repositories/change-feed.ts).
// Checked against an independent path: drizzle's own select of each table, with its own driver
// mappings and the author's name joined, presented the same way and sorted by change position.
// A campaign holding records of every synced kind, paged through in small and large pages.
import { asc, eq, getTableColumns } from "drizzle-orm";
import type { PgColumn, PgTable } from "drizzle-orm/pg-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  alerts,
  attachmentLinks,
  checklistResults,
  checklistRuns,
  checklistTemplates,
  conflicts,
  crates,
  entryReviews,
  fieldEntries,
  handovers,
  legs,
  levellingSections,
  levellingSetups,
  sites,
  users,
} from "../../server/db/schema";
import { presentAlert } from "../../server/presenters/alert";
import { presentAttachmentLink } from "../../server/presenters/attachment-link";
import { presentResult, presentRun, presentTemplate } from "../../server/presenters/checklist";
import { presentConflict } from "../../server/presenters/conflict";
import { presentCrate } from "../../server/presenters/crate-benchmark";
import { presentFieldEntry } from "../../server/presenters/field-entry";
import { presentSection, presentSetup } from "../../server/presenters/levelling";
import { presentHandover, presentLeg } from "../../server/presenters/logistics";
import { presentReview } from "../../server/presenters/review";
import { presentSite } from "../../server/presenters/site";
import { changeRecord, type ChangeRecord } from "../../shared/sync/protocol";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { addExportFixtures } from "../helpers/export-fixtures";
import { pullAll, pushAs, syncClient } from "../helpers/sync";

let ctx: TestContext;
let campaignId: string;
let fieldToken: string;
const tokens: Record<string, string> = {};

interface Expected {
  entity: ChangeRecord["entity"];
  table: PgTable & { campaignId: PgColumn; changeSeq: PgColumn };
  present: (row: never) => unknown;
  author?: { by: PgColumn; as: string };
}

const recorded = (by: PgColumn) => ({ by, as: "recordedByName" });
const expectedTables: Expected[] = [
  { entity: "site", table: sites, present: presentSite },
  { entity: "conflict", table: conflicts, present: presentConflict },
  { entity: "attachment", table: attachmentLinks, present: presentAttachmentLink },
  { entity: "checklistTemplate", table: checklistTemplates, present: presentTemplate },
  { entity: "checklistRun", table: checklistRuns, present: presentRun },
  {
    entity: "checklistResult",
    table: checklistResults,
    present: presentResult,
    author: recorded(checklistResults.recordedBy),
  },
  { entity: "crate", table: crates, present: presentCrate },
  {
    entity: "fieldEntry",
    table: fieldEntries,
    present: presentFieldEntry,
    author: recorded(fieldEntries.recordedBy),
  },
  { entity: "levellingSection", table: levellingSections, present: presentSection },
  {
    entity: "levellingSetup",
    table: levellingSetups,
    present: presentSetup,
    author: recorded(levellingSetups.recordedBy),
  },
  { entity: "leg", table: legs, present: presentLeg },
  {
    entity: "handover",
    table: handovers,
    present: presentHandover,
    author: recorded(handovers.recordedBy),
  },
  { entity: "alert", table: alerts, present: presentAlert },
  {
    entity: "review",
    table: entryReviews,
    present: presentReview,
    author: { by: entryReviews.decidedBy, as: "decidedByName" },
  },
];

/** The stream as drizzle selects it, one table at a time. */
async function expectedStream(): Promise<{ entity: string; seq: number; data: unknown }[]> {
  const { db } = ctx.database;
  const all: { entity: string; seq: number; data: unknown }[] = [];
  for (const t of expectedTables) {
    const columns = getTableColumns(t.table);
    const rows = t.author
      ? await db
          .select({ ...columns, [t.author.as]: users.name })
          .from(t.table)
          .leftJoin(users, eq(users.id, t.author.by))
          .where(eq(t.table.campaignId, campaignId))
          .orderBy(asc(t.table.changeSeq))
      : await db
          .select()
          .from(t.table)
          .where(eq(t.table.campaignId, campaignId))
          .orderBy(asc(t.table.changeSeq));
    for (const row of rows as Record<string, unknown>[])
      all.push({ entity: t.entity, seq: Number(row.changeSeq), data: t.present(row as never) });
  }
  return all.sort((a, b) => a.seq - b.seq);
}

/** A conflict and a limit alert, the two kinds the export fixtures do not make. */
async function addConflictAndAlert(): Promise<void> {
  const site = {
    id: crypto.randomUUID(),
    name: "Feed hut",
    kind: "mountain",
    latitudeDeg: 46.1,
    longitudeDeg: 7.2,
    approxHeightM: 2400,
    notes: "",
  };
  const tabletA = syncClient();
  const tabletB = syncClient();
  const push = (client: typeof tabletA, token: string, mutation: object) =>
    pushAs(ctx.app, token, { clientId: client.clientId, campaignId, mutations: [mutation] });
  await push(tabletA, fieldToken, tabletA.mutation("site.create", site));
  await push(
    tabletA,
    fieldToken,
    tabletA.mutation("site.update", {
      id: site.id,
      changes: { name: "Feed hut (upper)" },
      base: { name: "Feed hut" },
    }),
  );
  const late = await push(
    tabletB,
    tokens.geodesist ?? "",
    tabletB.mutation("site.update", {
      id: site.id,
      changes: { name: "Feed refuge" },
      base: { name: "Feed hut" },
    }),
  );
  expect(late.body.results[0]?.status).toBe("conflict");

  const { changes } = await pullAll(ctx.app, fieldToken, campaignId);
  const crate = changes.find((c) => c.entity === "crate");
  if (crate?.entity !== "crate") throw new Error("the demo has no crate");
  const at = "2027-06-04T08:15:00.000Z";
  const tripped = await push(
    tabletA,
    fieldToken,
    tabletA.mutation("entry.add", {
      id: crypto.randomUUID(),
      siteId: site.id,
      crateId: crate.id,
      observedAt: at,
      recordedAt: at,
      data: { kind: "shock-indicator", ratingG: 10, tripped: true },
    }),
  );
  expect(tripped.body.results[0]?.status).toBe("applied");
}

beforeAll(async () => {
  ctx = await createTestContext();
  for (const role of ["field", "logistics", "geodesist", "reviewer", "admin"]) {
    const session = await signInAs(ctx.app, role);
    tokens[role] = session.token;
    if (role === "field") campaignId = session.memberships[0]?.campaignId ?? "";
  }
  fieldToken = tokens.field ?? "";
  await addExportFixtures(ctx, campaignId, tokens);
  await addConflictAndAlert();
}, 60_000);
afterAll(() => ctx.close());

describe("the change feed", () => {
  it("holds records of every synced kind (else the comparison below proves less)", async () => {
    const kinds = new Set((await expectedStream()).map((c) => c.entity));
    expect([...kinds].sort()).toEqual(expectedTables.map((t) => t.entity).sort());
  });

  it.each([3, 17, 500])(
    "pages the stream exactly as drizzle's per-table selects give it, %i at a time",
    async (limit) => {
      const expected = await expectedStream();
      const { pages, changes } = await pullAll(ctx.app, fieldToken, campaignId, undefined, limit);
      expect(changes.map((c) => ({ entity: c.entity, seq: c.seq, data: c.data }))).toEqual(
        expected,
      );
      for (const c of changes) expect(changeRecord.safeParse(c).success).toBe(true);
      // Every page but the last is full and says so; the cursor is the last position sent.
      for (const [i, page] of pages.entries()) {
        const last = i === pages.length - 1;
        expect(page.hasMore).toBe(!last);
        if (!last) expect(page.changes).toHaveLength(limit);
        expect(page.cursor).toBe(page.changes.at(-1)?.seq ?? pages[i - 1]?.cursor ?? 0);
      }
    },
  );

  it("names the device's last applied mutation from the same read, and none without a device", async () => {
    const tablet = syncClient();
    const site = {
      id: crypto.randomUUID(),
      name: "Feed depot",
      kind: "depot",
      latitudeDeg: 46.2,
      longitudeDeg: 7.3,
      approxHeightM: 600,
      notes: "",
    };
    const first = tablet.mutation("site.create", site);
    const second = tablet.mutation("site.update", {
      id: site.id,
      changes: { notes: "Gate code at the office" },
      base: { notes: "" },
    });
    await pushAs(ctx.app, fieldToken, {
      clientId: tablet.clientId,
      campaignId,
      mutations: [first, second],
    });
    const withDevice = await pullAll(ctx.app, fieldToken, campaignId, tablet.clientId);
    expect(withDevice.pages.at(-1)?.lastMutationId).toBe(second.mutationId);
    const unknownDevice = await pullAll(ctx.app, fieldToken, campaignId, crypto.randomUUID());
    expect(unknownDevice.pages.at(-1)?.lastMutationId).toBe(0);
    const noDevice = await pullAll(ctx.app, fieldToken, campaignId);
    expect(noDevice.pages.at(-1)?.lastMutationId).toBeNull();
  });
});
