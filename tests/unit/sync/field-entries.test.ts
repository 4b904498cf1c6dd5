// Field entries on the tablet: flagged against the crate's limits at once, refused with the field's
// name when wrong, an import written whole or not at all, large imports pushed in several bodies,
// and pulled entries, crates and levelling records landing in their working copies.
import { describe, expect, it } from "vitest";
import type { FieldEntryView } from "../../../shared/schemas/field-entries";
import { fieldEntryLimits } from "../../../shared/schemas/field-entries";
import type { OutboxEntry } from "../../../src/db/database";
import { listCrates, listSiteEntries } from "../../../src/db/field-entry-queries";
import { addFieldEntriesLocally, addFieldEntryLocally } from "../../../src/db/field-entry-store";
import { authorNameKey } from "../../../src/db/outbox";
import { writeMeta } from "../../../src/db/meta";
import { applyPulledPage } from "../../../src/sync/apply-pull";
import { batches, pushBudgetChars } from "../../../src/sync/engine";
import { localSiteAndCrate, newDb } from "../../helpers/fake-sync";

const campaignId = crypto.randomUUID();
const siteId = crypto.randomUUID();
const { site, crate } = localSiteAndCrate(campaignId, siteId, crypto.randomUUID());
const at = (minute: number) => new Date(Date.UTC(2027, 5, 2, 8, minute)).toISOString();

async function siteWithCrate() {
  const db = newDb();
  await db.sites.put(site);
  await db.crates.put(crate);
  await writeMeta(db, authorNameKey, "Ada Field");
  return db;
}

const indicator = (tripped: boolean) => ({
  siteId,
  crateId: crate.id,
  observedAt: at(1),
  data: { kind: "shock-indicator" as const, ratingG: 25, tripped },
});

describe("field entries on the tablet", () => {
  it("flags a tripped indicator at once and keeps the author's name on the working copy", async () => {
    const db = await siteWithCrate();
    const { id, flags } = await addFieldEntryLocally(db, campaignId, indicator(true));
    expect(flags).toEqual({ exceeded: true, summary: "Indicator tripped (rated 25 g)" });
    const [entry] = await listSiteEntries(db, campaignId, siteId);
    expect(entry).toMatchObject({
      id,
      pending: true,
      recordedByName: "Ada Field",
      kind: "shock-indicator",
    });
    expect(await db.outbox.count()).toBe(1);
  });

  it("flags a logger peak above the crate's limit and not one below it", async () => {
    const db = await siteWithCrate();
    const log = (peak: number) => ({
      siteId,
      crateId: crate.id,
      observedAt: at(2),
      data: {
        kind: "shock-log" as const,
        source: "manual" as const,
        events: [{ at: at(2), xG: 3, yG: peak, zG: null, durationMs: 11 }],
      },
    });
    expect((await addFieldEntryLocally(db, campaignId, log(14.9))).flags.exceeded).toBe(false);
    const high = await addFieldEntryLocally(db, campaignId, log(22));
    expect(high.flags).toMatchObject({ exceeded: true });
    expect(high.flags.summary).toContain("highest 22 g on y");
  });

  it("refuses a wrong entry naming the field, and writes nothing", async () => {
    const db = await siteWithCrate();
    await expect(
      addFieldEntryLocally(db, campaignId, { ...indicator(false), crateId: null }),
    ).rejects.toMatchObject({ field: "crateId", message: "Choose the crate this entry is about" });
    await expect(
      addFieldEntryLocally(db, campaignId, {
        ...indicator(false),
        data: { kind: "shock-indicator", ratingG: 2000, tripped: false },
      }),
    ).rejects.toMatchObject({ field: "data.ratingG" });
    await expect(
      addFieldEntryLocally(db, campaignId, { ...indicator(false), crateId: crypto.randomUUID() }),
    ).rejects.toMatchObject({ field: "crateId", message: "This crate is not on this device" });
    expect(await db.outbox.count()).toBe(0);
    expect(await db.fieldEntries.count()).toBe(0);
  });

  it("keeps an import of several parts whole or not at all", async () => {
    const db = await siteWithCrate();
    const part = (celsius: number) => ({
      siteId,
      crateId: crate.id,
      observedAt: at(3),
      data: {
        kind: "temperatures" as const,
        source: "logger" as const,
        samples: [{ at: at(3), celsius, humidityPct: null }],
      },
    });
    await expect(
      addFieldEntriesLocally(db, campaignId, [part(20), part(21), part(400)]),
    ).rejects.toMatchObject({ field: "data.samples.0.celsius" });
    expect(await db.outbox.count()).toBe(0);
    const saved = await addFieldEntriesLocally(db, campaignId, [part(20), part(30)]);
    expect(saved.map((s) => s.flags.exceeded)).toEqual([false, true]);
    expect(await db.fieldEntries.count()).toBe(2);
  });

  it("pushes large imports in bodies under the budget, in order", () => {
    const sample = { at: at(0), celsius: 21.25, humidityPct: 40 };
    const big = (mutationId: number): OutboxEntry => ({
      mutationId,
      campaignId,
      name: "entry.add",
      entityId: String(mutationId),
      createdAt: at(0),
      args: {
        data: { samples: Array.from({ length: fieldEntryLimits.samplesMax }, () => sample) },
      },
    });
    const entries = [1, 2, 3, 4, 5].map(big);
    const groups = batches(entries, 200);
    expect(groups.length).toBeGreaterThan(1);
    expect(groups.flat().map((e) => e.mutationId)).toEqual([1, 2, 3, 4, 5]);
    for (const group of groups)
      expect(JSON.stringify(group.map((e) => e.args)).length).toBeLessThanOrEqual(
        pushBudgetChars + group.length,
      );
  });

  it("lands pulled crates and entries in their tables and confirms the tablet's own", async () => {
    const db = await siteWithCrate();
    const { id } = await addFieldEntryLocally(db, campaignId, indicator(false));
    const [mine] = await db.outbox.toArray();
    const local = await db.fieldEntries.get(id);
    if (!local) throw new Error("the entry is not on the tablet");
    const server: FieldEntryView = { ...local, recordedBy: crypto.randomUUID() };
    await applyPulledPage(db, campaignId, {
      changes: [
        { entity: "crate", seq: 1, id: crate.id, data: { ...crate, label: "KR-03b" } },
        { entity: "fieldEntry", seq: 2, id, data: server },
      ],
      cursor: 2,
      hasMore: false,
      lastMutationId: mine?.mutationId ?? 0,
      rejections: [],
    });
    expect(await db.outbox.count()).toBe(0);
    expect((await listCrates(db, campaignId)).map((c) => c.label)).toEqual(["KR-03b"]);
    expect(await db.fieldEntries.get(id)).toMatchObject({
      pending: false,
      recordedBy: server.recordedBy,
    });
  });
});
