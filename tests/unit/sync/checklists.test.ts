// Checklists on the tablet: a run keeps its template's items, a number outside its range is
// flagged at once, a wrong value is refused with the item's name, and sign-off waits for every
// required item.
import { describe, expect, it } from "vitest";
import { checklistItems } from "../../../shared/schemas/checklists";
import {
  dewPointGate,
  latestResults,
  recordResultLocally,
  signOffLocally,
  startChecklistLocally,
} from "../../../src/db/checklist-store";
import { findChecklistRun, listChecklistRuns } from "../../../src/db/queries";
import { addFieldEntryLocally } from "../../../src/db/field-entry-store";
import { writeMeta } from "../../../src/db/meta";
import { authorNameKey } from "../../../src/db/outbox";
import { localSiteAndCrate, newDb } from "../../helpers/fake-sync";

const campaignId = crypto.randomUUID();
const siteId = crypto.randomUUID();
const templateId = crypto.randomUUID();

async function withTemplate() {
  const db = newDb();
  await db.checklistTemplates.put({
    id: templateId,
    campaignId,
    title: "Arrival",
    purpose: "arrival",
    version: 1,
    updatedAt: "2027-06-01T00:00:00.000Z",
    deletedAt: null,
    items: checklistItems.parse([
      { kind: "number", id: "room-temp", label: "Room temperature", unit: "°C", min: 18, max: 26 },
      { kind: "check", id: "door", label: "Door clear" },
      { kind: "text", id: "notes", label: "Notes", required: false },
    ]),
  });
  return db;
}

describe("checklists on the tablet", () => {
  it("starts a run with the template's items and flags an out-of-range number at once", async () => {
    const db = await withTemplate();
    const runId = await startChecklistLocally(db, campaignId, templateId, siteId);
    expect(await listChecklistRuns(db, campaignId, siteId)).toMatchObject([
      { id: runId, title: "Arrival", pending: true, signedOffAt: null },
    ]);
    expect(await recordResultLocally(db, campaignId, runId, "room-temp", 29)).toMatchObject({
      outOfRange: true,
    });
    await recordResultLocally(db, campaignId, runId, "room-temp", 21.5);
    const latest = await latestResults(db, runId);
    expect(latest.get("room-temp")).toMatchObject({
      value: 21.5,
      outOfRange: false,
      pending: true,
    });
    expect(await db.checklistResults.count()).toBe(2);
  });

  it("refuses a value of the wrong kind and an unknown item, writing nothing", async () => {
    const db = await withTemplate();
    const runId = await startChecklistLocally(db, campaignId, templateId, siteId);
    await expect(recordResultLocally(db, campaignId, runId, "door", "yes")).rejects.toThrow(
      "Door clear: expected ticked or not",
    );
    await expect(recordResultLocally(db, campaignId, runId, "nope", true)).rejects.toThrow(
      'This checklist has no item "nope"',
    );
    expect(await db.outbox.count()).toBe(1);
  });

  it("signs off only when every required item has a result, then takes no more", async () => {
    const db = await withTemplate();
    const runId = await startChecklistLocally(db, campaignId, templateId, siteId);
    await recordResultLocally(db, campaignId, runId, "room-temp", 20);
    await expect(signOffLocally(db, campaignId, runId)).rejects.toThrow(
      "Not signed off: no result yet for Door clear",
    );
    await recordResultLocally(db, campaignId, runId, "door", true);
    await signOffLocally(db, campaignId, runId, "All fine");
    expect(await findChecklistRun(db, campaignId, runId)).toMatchObject({
      signOffNote: "All fine",
      signedOffAt: expect.any(String),
    });
    await expect(recordResultLocally(db, campaignId, runId, "notes", "late")).rejects.toThrow(
      /signed off/,
    );
    expect((await db.outbox.toArray()).map((e) => e.name)).toEqual([
      "checklist.start",
      "checklist.record",
      "checklist.record",
      "checklist.signOff",
    ]);
  });

  it("keeps an unpacking checklist open until a dew-point check for it passed or was overridden", async () => {
    const db = await withTemplate();
    await db.checklistTemplates.update(templateId, { purpose: "unpacking" });
    const crateId = crypto.randomUUID();
    const { site, crate } = localSiteAndCrate(campaignId, siteId, crateId);
    await db.sites.put(site);
    await db.crates.put(crate);
    await writeMeta(db, authorNameKey, "Ada Field");
    const runId = await startChecklistLocally(db, campaignId, templateId, siteId);
    await recordResultLocally(db, campaignId, runId, "room-temp", 21);
    await recordResultLocally(db, campaignId, runId, "door", true);
    expect((await latestResults(db, runId)).get("door")?.recordedByName).toBe("Ada Field");
    await expect(signOffLocally(db, campaignId, runId)).rejects.toThrow(dewPointGate);
    // Room 22 °C at 60 % RH: dew point 13.9 °C by Magnus (Alduchov & Eskridge constants), so a
    // surface at 10 °C fails with the usual 3 K margin; the reason to open anyway clears it.
    const check = (surface: number, overrideReason = "") =>
      addFieldEntryLocally(db, campaignId, {
        siteId,
        crateId,
        observedAt: "2027-06-02T08:00:00.000Z",
        data: {
          kind: "dew-point",
          runId,
          roomTemperatureC: 22,
          roomHumidityPct: 60,
          surfaceTemperatureC: surface,
          overrideReason,
        },
      });
    expect((await check(10)).flags.exceeded).toBe(true);
    await expect(signOffLocally(db, campaignId, runId)).rejects.toThrow(dewPointGate);
    expect(
      (await check(12, "Crate must be opened to stop the ion pump alarm")).flags.exceeded,
    ).toBe(false);
    await signOffLocally(db, campaignId, runId);
    expect(await findChecklistRun(db, campaignId, runId)).toMatchObject({
      signedOffAt: expect.any(String),
    });
  });
});
