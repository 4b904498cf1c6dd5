// The levelling field book on the tablet: a section and its setups are written with their outbox
// entries, bad readings are refused naming the field, a correction replaces a setup, and closing
// waits for both runs and for a reason when the misclosure is out of tolerance.
import { describe, expect, it } from "vitest";
import {
  closeSectionLocally,
  findLevellingSection,
  listLevellingSections,
  listLevellingSetups,
  listSetupsBySection,
  openSectionLocally,
  recordSetupLocally,
  type SetupDraft,
} from "../../../src/db/levelling-store";
import { createSiteLocally } from "../../../src/db/site-store";
import {
  emptyEntry,
  entriesWithDraft,
  entryFrom,
  parseEntry,
} from "../../../src/features/levelling/entry-draft";
import { runningReduction } from "../../../shared/science/levelling/running";
import { newDb } from "../../helpers/fake-sync";

const campaignId = crypto.randomUUID();
const SECOND_I = "fgcc-1984-second-order-class-i";

async function withSite() {
  const db = newDb();
  const siteId = await createSiteLocally(db, campaignId, {
    name: "Col hut",
    kind: "mountain",
    latitudeDeg: 46.9,
    longitudeDeg: 10.1,
    approxHeightM: 2400,
    notes: "",
  });
  const sectionId = await openSectionLocally(db, campaignId, {
    siteId,
    fromMark: "Clock reference",
    toMark: "BM 12",
    classId: SECOND_I,
    instrument: "Digital level 3",
  });
  return { db, siteId, sectionId };
}

const draft = (
  run: SetupDraft["run"],
  number: number,
  backsightM: number,
  foresightM: number,
  backsightDistanceM: number,
  foresightDistanceM: number,
): SetupDraft => ({ run, number, backsightM, foresightM, backsightDistanceM, foresightDistanceM });

// Hand-computed (rise and fall): forward ΔH +0.3666 m over 179 m, backward −0.3660 m over 181 m
// with the second backward foresight 0.9560; misclosure +0.6 mm, K = 0.180 km, allowed
// 6·√0.18 = 2.5 mm (FGCC 1984 second-order I, REFERENCES.md §4). Read 0.9460 instead: +10.6 mm.
const forward = [
  draft("forward", 1, 1.5234, 0.8123, 30, 29),
  draft("forward", 2, 0.9876, 1.4321, 35, 34),
  draft("forward", 3, 1.2, 1.1, 25, 26),
];
const backward = (fs2: number) => [
  draft("backward", 1, 1.3, 1.4, 27, 28),
  draft("backward", 2, 1.4, fs2, 33, 33),
  draft("backward", 3, 0.8, 1.51, 30, 30),
];

async function recordAll(
  db: Awaited<ReturnType<typeof withSite>>["db"],
  sectionId: string,
  drafts: SetupDraft[],
) {
  for (const d of drafts) await recordSetupLocally(db, campaignId, sectionId, d);
}

describe("levelling on the tablet", () => {
  it("opens a section and records setups with their outbox entries, marked not yet sent", async () => {
    const { db, siteId, sectionId } = await withSite();
    const setupId = await recordSetupLocally(db, campaignId, sectionId, forward[0] as SetupDraft);
    expect(await listLevellingSections(db, campaignId, siteId)).toMatchObject([
      {
        id: sectionId,
        fromMark: "Clock reference",
        toMark: "BM 12",
        classId: SECOND_I,
        closedAt: null,
        pending: true,
      },
    ]);
    expect(await listLevellingSetups(db, campaignId, sectionId)).toMatchObject([
      { id: setupId, run: "forward", number: 1, backsightM: 1.5234, note: "", pending: true },
    ]);
    const outbox = await db.outbox.toArray();
    expect(outbox.map((e) => [e.name, e.entityId])).toEqual([
      ["site.create", siteId],
      ["levelling.open", sectionId],
      ["levelling.setup", setupId],
    ]);
    expect((await listSetupsBySection(db, campaignId, [sectionId])).get(sectionId)).toHaveLength(1);
    // Another campaign sees nothing of it.
    expect(await findLevellingSection(db, crypto.randomUUID(), sectionId)).toBeNull();
  });

  it("refuses readings and marks out of range, naming the field, and writes nothing", async () => {
    const { db, siteId, sectionId } = await withSite();
    const before = await db.outbox.count();
    await expect(
      recordSetupLocally(db, campaignId, sectionId, draft("forward", 1, 5.2, 1, 30, 30)),
    ).rejects.toMatchObject({
      field: "backsightM",
      message: "Backsight must be between 0 and 5 m",
    });
    await expect(
      recordSetupLocally(db, campaignId, sectionId, draft("forward", 1, 1, 1, 30, Number.NaN)),
    ).rejects.toMatchObject({ field: "foresightDistanceM" });
    await expect(
      recordSetupLocally(db, campaignId, sectionId, draft("forward", 0, 1, 1, 30, 30)),
    ).rejects.toMatchObject({ field: "number", message: expect.stringMatching(/^Setup number/) });
    await expect(
      openSectionLocally(db, campaignId, {
        siteId,
        fromMark: " ",
        toMark: "BM 12",
        classId: SECOND_I,
        instrument: "",
      }),
    ).rejects.toMatchObject({ field: "fromMark", message: "From mark is required" });
    await expect(
      openSectionLocally(db, campaignId, {
        siteId,
        fromMark: "A",
        toMark: "B",
        classId: "fourth-order",
        instrument: "",
      }),
    ).rejects.toMatchObject({ field: "classId", message: "Choose a levelling class" });
    await expect(
      openSectionLocally(db, campaignId, {
        siteId: crypto.randomUUID(),
        fromMark: "A",
        toMark: "B",
        classId: SECOND_I,
        instrument: "",
      }),
    ).rejects.toMatchObject({ field: "siteId", message: "This site is not on this device" });
    expect(await db.outbox.count()).toBe(before);
  });

  it("refuses a setup for an unknown section", async () => {
    const { db } = await withSite();
    await expect(
      recordSetupLocally(db, campaignId, crypto.randomUUID(), forward[0] as SetupDraft),
    ).rejects.toThrow("This levelling section is not on this device");
  });

  it("closes only with both runs, and out of tolerance only with a reason", async () => {
    const { db, sectionId } = await withSite();
    await recordAll(db, sectionId, forward);
    await expect(closeSectionLocally(db, campaignId, sectionId)).rejects.toThrow(
      "Not closed: the backward run has no setups yet",
    );
    await recordAll(db, sectionId, backward(0.946));
    await expect(closeSectionLocally(db, campaignId, sectionId, "  ")).rejects.toMatchObject({
      field: "note",
      message:
        "Out of tolerance: Misclosure 10.6 mm of ±2.5 mm allowed (Second-order, Class I, K = 0.18 km). Re-level, or give the reason for closing anyway",
    });
    // The correction: a newer setup with the same number.
    await recordSetupLocally(db, campaignId, sectionId, draft("backward", 2, 1.4, 0.956, 33, 33));
    await closeSectionLocally(db, campaignId, sectionId);
    const closed = await findLevellingSection(db, campaignId, sectionId);
    expect(closed?.closedAt).toEqual(expect.any(String));
    expect(closed?.closure).toEqual({
      forwardDeltaM: expect.closeTo(0.3666, 9),
      backwardDeltaM: expect.closeTo(-0.366, 9),
      lengthKm: expect.closeTo(0.18, 12),
      misclosureM: expect.closeTo(0.0006, 9),
      toleranceM: expect.closeTo(0.006 * Math.sqrt(0.18), 12),
      withinTolerance: true,
    });
    await expect(
      recordSetupLocally(db, campaignId, sectionId, forward[0] as SetupDraft),
    ).rejects.toThrow("This section is closed and takes no more setups");
    await expect(closeSectionLocally(db, campaignId, sectionId)).rejects.toThrow(
      "This section is already closed",
    );
    expect((await db.outbox.toArray()).map((e) => e.name).slice(-2)).toEqual([
      "levelling.setup",
      "levelling.close",
    ]);
  });

  it("closes out of tolerance when a reason is given, keeping the verdict", async () => {
    const { db, sectionId } = await withSite();
    await recordAll(db, sectionId, [...forward, ...backward(0.946)]);
    await closeSectionLocally(
      db,
      campaignId,
      sectionId,
      "Staff sank on soft ground; re-level tomorrow",
    );
    const closed = await findLevellingSection(db, campaignId, sectionId);
    expect(closed).toMatchObject({
      closeNote: "Staff sank on soft ground; re-level tomorrow",
      closure: { withinTolerance: false, misclosureM: expect.closeTo(0.0106, 9) },
      pending: true,
    });
  });
});

describe("the setup being typed (field book entry)", () => {
  it("accepts a decimal comma, names a bad field, and knows when it is complete", () => {
    const parsed = parseEntry(
      { ...emptyEntry, backsightM: "1,5234", foresightM: "7", backsightDistanceM: "abc" },
      4,
    );
    expect(parsed.number).toBe(4);
    expect(parsed.values).toEqual({ backsightM: 1.5234 });
    expect(parsed.errors).toEqual({
      foresightM: "Between 0 and 5 m",
      backsightDistanceM: "Type a number, e.g. 1.2345",
    });
    expect(parsed.complete).toBe(false);
    const full = parseEntry(
      {
        ...emptyEntry,
        number: "2",
        backsightM: "1.4",
        foresightM: "0,946",
        backsightDistanceM: "33",
        foresightDistanceM: "33",
      },
      4,
    );
    expect(full).toMatchObject({ number: 2, complete: true, errors: {} });
    expect(parseEntry({ ...emptyEntry, number: "2.5" }, 1).errors.number).toMatch(/whole number/);
  });

  it("puts a correction in the place of the setup it replaces, for the live reduction", () => {
    const saved = [1, 2, 3].map((n) => ({
      id: `s${n}`,
      run: "backward" as const,
      number: n,
      backsightM: 1.4,
      foresightM: 1.3,
      backsightDistanceM: 30,
      foresightDistanceM: 30,
      recordedAt: "2026-06-01T08:00:00Z",
    }));
    const parsed = parseEntry(
      { ...entryFrom(saved[1] as (typeof saved)[number]), foresightM: "1.2" },
      4,
    );
    const { entries, draftIndex } = entriesWithDraft(saved, parsed);
    expect(draftIndex).toBe(1);
    expect(entries.map((e) => e.foresightM)).toEqual([1.3, 1.2, 1.3]);
    // Hand sum: 0.1 + 0.2 + 0.1 = 0.4 m at the last setup.
    expect(runningReduction(entries).cumulativeM).toBeCloseTo(0.4, 12);
    expect(entriesWithDraft(saved, parseEntry(emptyEntry, 4)).draftIndex).toBe(3);
  });
});
