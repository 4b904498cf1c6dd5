// Logistics on the tablet: legs step once in order, custody runs in time order from the last
// receiver, alerts are acknowledged once, refusals name their field, and the dashboard's summaries
// (where a crate is, overdue legs, handovers still owed) match hand-worked cases.
import { describe, expect, it } from "vitest";
import type { AlertView } from "../../../shared/schemas/logistics";
import type { LocalLeg } from "../../../src/db/database";
import {
  cratePlace,
  countByState,
  currentHolder,
  listAlerts,
  listCrateHandovers,
  listCrateLegs,
  overdueLegs,
  pendingHandovers,
  shownCrateState,
} from "../../../src/db/logistics-queries";
import {
  acknowledgeAlertLocally,
  arriveLegLocally,
  cancelLegLocally,
  departLegLocally,
  LogisticsInputError,
  planLegLocally,
  recordHandoverLocally,
} from "../../../src/db/logistics-store";
import { writeMeta } from "../../../src/db/meta";
import { authorNameKey } from "../../../src/db/outbox";
import { mentionsLithium, needsTeamLift } from "../../../src/features/logistics/format";
import { applyPulledPage } from "../../../src/sync/apply-pull";
import { localSiteAndCrate, newDb } from "../../helpers/fake-sync";

const campaignId = crypto.randomUUID();
const labId = crypto.randomUUID();
const hutId = crypto.randomUUID();
const crateId = crypto.randomUUID();

async function withCrateAndSites() {
  const db = newDb();
  const { site, crate } = localSiteAndCrate(campaignId, hutId, crateId);
  await db.sites.bulkPut([site, { ...site, id: labId, name: "Valley lab", kind: "reference-lab" }]);
  await db.crates.put(crate);
  return db;
}

const plan = {
  crateId,
  fromSiteId: labId,
  toSiteId: hutId,
  vehicle: "Van 2",
  plannedDepartAt: "2027-06-10T06:00:00.000Z",
  plannedArriveAt: "2027-06-10T14:00:00.000Z",
};

async function refusal(promise: Promise<unknown>): Promise<{ field: string; message: string }> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(LogisticsInputError);
  const { field, message } = error as LogisticsInputError;
  return { field, message };
}

describe("legs on the tablet", () => {
  it("plans a leg and refuses a bad plan at the field it is about", async () => {
    const db = await withCrateAndSites();
    expect(await refusal(planLegLocally(db, campaignId, { ...plan, toSiteId: labId }))).toEqual({
      field: "toSiteId",
      message: "A leg ends somewhere else than it starts",
    });
    expect(
      await refusal(
        planLegLocally(db, campaignId, { ...plan, plannedArriveAt: "2027-06-09T00:00:00Z" }),
      ),
    ).toMatchObject({ field: "plannedArriveAt" });
    expect(
      await refusal(planLegLocally(db, campaignId, { ...plan, crateId: crypto.randomUUID() })),
    ).toEqual({ field: "crateId", message: "This crate is not on this device" });
    expect(
      await refusal(planLegLocally(db, campaignId, { ...plan, plannedDepartAt: "soon" })),
    ).toMatchObject({ field: "plannedDepartAt", message: "Planned departure must be a time" });

    const legId = await planLegLocally(db, campaignId, plan);
    expect(await listCrateLegs(db, campaignId, crateId)).toMatchObject([
      { id: legId, vehicle: "Van 2", departedAt: null, pending: true },
    ]);
    expect(await db.outbox.count()).toBe(1);
  });

  it("departs, then arrives not before the departure, each once", async () => {
    const db = await withCrateAndSites();
    const legId = await planLegLocally(db, campaignId, plan);
    expect(await refusal(arriveLegLocally(db, campaignId, legId))).toEqual({
      field: "at",
      message: "This leg has not departed yet: record the departure first",
    });
    await departLegLocally(db, campaignId, legId, "2027-06-10T06:10:00Z", "Road open");
    expect(await refusal(departLegLocally(db, campaignId, legId))).toMatchObject({ field: "at" });
    expect(
      await refusal(arriveLegLocally(db, campaignId, legId, "2027-06-10T06:00:00Z")),
    ).toMatchObject({ field: "at", message: expect.stringContaining("before the departure") });
    expect(await refusal(cancelLegLocally(db, campaignId, legId))).toMatchObject({
      message: "This leg has already departed; only a planned leg can be cancelled",
    });
    await arriveLegLocally(db, campaignId, legId, "2027-06-10T13:20:00Z");
    const [leg] = await listCrateLegs(db, campaignId, crateId);
    expect(leg).toMatchObject({
      departedAt: "2027-06-10T06:10:00Z",
      arrivedAt: "2027-06-10T13:20:00Z",
      note: "Departure: Road open",
    });
    expect(await db.outbox.count()).toBe(3);
  });

  it("cancels a planned leg, which then takes no steps", async () => {
    const db = await withCrateAndSites();
    const legId = await planLegLocally(db, campaignId, plan);
    await cancelLegLocally(db, campaignId, legId, "2027-06-09T10:00:00Z", "Storm");
    expect(await refusal(departLegLocally(db, campaignId, legId))).toMatchObject({
      field: "id",
      message: expect.stringContaining("cancelled"),
    });
    expect((await listCrateLegs(db, campaignId, crateId))[0]?.cancelledAt).toBe(
      "2027-06-09T10:00:00Z",
    );
  });

  it("keeps the server's leg once a pull confirms the plan", async () => {
    const db = await withCrateAndSites();
    const legId = await planLegLocally(db, campaignId, plan);
    const server = {
      ...plan,
      id: legId,
      campaignId,
      note: "",
      departedAt: null,
      arrivedAt: null,
      cancelledAt: null,
      createdBy: crypto.randomUUID(),
    };
    await applyPulledPage(db, campaignId, {
      changes: [{ entity: "leg", seq: 1, id: legId, data: server }],
      cursor: 1,
      hasMore: false,
      lastMutationId: 1,
      rejections: [],
    });
    expect(await db.outbox.count()).toBe(0);
    expect(await db.legs.get(legId)).toMatchObject({ pending: false, createdBy: server.createdBy });
  });
});

describe("custody on the tablet", () => {
  const handover = {
    crateId,
    fromName: "Ana Field",
    toName: "Carrier Ltd driver",
    at: "2027-06-10T06:05:00.000Z",
    siteId: labId,
    condition: "intact" as const,
  };

  it("records handovers in time order, each from the one who received it last", async () => {
    const db = await withCrateAndSites();
    await writeMeta(db, authorNameKey, "Ana Field");
    await recordHandoverLocally(db, campaignId, handover);
    // Same time as the last one: refused, as is an earlier one.
    expect(
      await refusal(
        recordHandoverLocally(db, campaignId, { ...handover, fromName: "Carrier Ltd driver" }),
      ),
    ).toMatchObject({ field: "at", message: expect.stringContaining("time order") });
    expect(
      await refusal(
        recordHandoverLocally(db, campaignId, {
          ...handover,
          fromName: "Someone else",
          at: "2027-06-10T13:30:00Z",
        }),
      ),
    ).toEqual({
      field: "fromName",
      message: "Handed over by: KR-03 is held by Carrier Ltd driver, not Someone else",
    });
    // Trimmed and case-insensitive, as a typed signature is.
    await recordHandoverLocally(db, campaignId, {
      ...handover,
      fromName: "  carrier LTD driver ",
      toName: "Hut warden",
      at: "2027-06-10T13:30:00Z",
      siteId: hutId,
      condition: "marked",
    });
    const chain = await listCrateHandovers(db, campaignId, crateId);
    expect(chain.map((h) => h.toName)).toEqual(["Carrier Ltd driver", "Hut warden"]);
    expect(chain[0]).toMatchObject({ recordedByName: "Ana Field", pending: true, legId: null });
    expect(currentHolder(chain)).toBe("Hut warden");
  });

  it("refuses an empty signature and a leg of another crate", async () => {
    const db = await withCrateAndSites();
    expect(
      await refusal(recordHandoverLocally(db, campaignId, { ...handover, toName: "  " })),
    ).toEqual({ field: "toName", message: "Received by (typed name) is required" });
    expect(
      await refusal(
        recordHandoverLocally(db, campaignId, { ...handover, legId: crypto.randomUUID() }),
      ),
    ).toMatchObject({ field: "legId" });
  });
});

describe("alerts on the tablet", () => {
  it("acknowledges an alert once, newest alerts first", async () => {
    const db = await withCrateAndSites();
    const alert = (id: string, createdAt: string): AlertView => ({
      id,
      campaignId,
      crateId,
      siteId: hutId,
      entryId: null,
      kind: "shock",
      summary: "KR-03: 22 g over its 15 g limit",
      createdAt,
      acknowledgedAt: null,
      acknowledgedBy: null,
      acknowledgeNote: "",
    });
    const older = crypto.randomUUID();
    const newer = crypto.randomUUID();
    await applyPulledPage(db, campaignId, {
      changes: [
        { entity: "alert", seq: 1, id: older, data: alert(older, "2027-06-10T08:00:00Z") },
        { entity: "alert", seq: 2, id: newer, data: alert(newer, "2027-06-11T08:00:00Z") },
      ],
      cursor: 2,
      hasMore: false,
      lastMutationId: null,
      rejections: [],
    });
    await acknowledgeAlertLocally(db, campaignId, older, "Indicator checked, cavity fine");
    expect(await refusal(acknowledgeAlertLocally(db, campaignId, older))).toMatchObject({
      field: "id",
      message: "This alert is already acknowledged",
    });
    const list = await listAlerts(db, campaignId);
    expect(list.map((a) => a.id)).toEqual([newer, older]);
    expect(list[1]).toMatchObject({
      pending: true,
      acknowledgeNote: "Indicator checked, cavity fine",
    });
    expect(list[1]?.acknowledgedAt).not.toBeNull();
  });
});

describe("logistics summaries", () => {
  const leg = (over: Partial<LocalLeg>): LocalLeg => ({
    id: crypto.randomUUID(),
    campaignId,
    crateId,
    fromSiteId: labId,
    toSiteId: hutId,
    vehicle: "",
    plannedDepartAt: "2027-06-10T06:00:00Z",
    plannedArriveAt: "2027-06-10T14:00:00Z",
    departedAt: null,
    arrivedAt: null,
    cancelledAt: null,
    note: "",
    createdBy: null,
    pending: false,
    ...over,
  });

  // Hand-worked: the crate went lab → hut (arrived 13:20), then hut → lab departed 16:00.
  it("places a crate at its last arrival, or on the way", () => {
    const first = leg({ departedAt: "2027-06-10T06:10:00Z", arrivedAt: "2027-06-10T13:20:00Z" });
    expect(cratePlace([first])).toEqual({ kind: "at", siteId: hutId });
    const back = leg({ fromSiteId: hutId, toSiteId: labId, departedAt: "2027-06-11T16:00:00Z" });
    expect(cratePlace([first, back])).toEqual({ kind: "moving", toSiteId: labId });
    expect(cratePlace([leg({})])).toEqual({ kind: "unknown" });
  });

  it("shows a step not yet sent in the crate's state at once, and the server's state otherwise", () => {
    const ready = { state: "ready" as const };
    const departed = { departedAt: "2027-06-10T06:10:00Z" };
    expect(shownCrateState(ready, [leg({ ...departed, pending: true })])).toBe("moving");
    const arrived = { ...departed, arrivedAt: "2027-06-10T13:20:00Z", pending: true };
    expect(shownCrateState(ready, [leg(arrived)])).toBe("arrived");
    expect(shownCrateState(ready, [leg({ ...departed, pending: false })])).toBe("ready");
  });

  it("finds overdue legs and handovers still owed", () => {
    const now = Date.parse("2027-06-10T15:00:00Z");
    const late = leg({ departedAt: "2027-06-10T06:10:00Z" });
    const onTime = leg({ plannedArriveAt: "2027-06-10T16:00:00Z" });
    const cancelled = leg({ cancelledAt: "2027-06-09T00:00:00Z" });
    const arrived = leg({ departedAt: "2027-06-10T06:10:00Z", arrivedAt: "2027-06-10T13:20:00Z" });
    expect(overdueLegs([late, onTime, cancelled, arrived], now)).toEqual([late]);
    const h = (at: string) => ({ crateId, at }) as Parameters<typeof pendingHandovers>[1][number];
    expect(pendingHandovers([arrived], [h("2027-06-10T06:05:00Z")])).toEqual([arrived]);
    // A handover exactly at the arrival counts.
    expect(pendingHandovers([arrived], [h("2027-06-10T13:20:00Z")])).toEqual([]);
  });

  it("counts crates in every state", () => {
    expect(
      countByState(
        [{ state: "moving" }, { state: "moving" }, { state: "held" }],
        ["ready", "moving", "held"],
      ),
    ).toEqual({ ready: 0, moving: 2, held: 1 });
  });
});

describe("crate cautions", () => {
  it("asks for a team lift above 25 kg (common practice) and flags lithium batteries", () => {
    expect(needsTeamLift({ weightKg: 25 })).toBe(false);
    expect(needsTeamLift({ weightKg: 25.1 })).toBe(true);
    // The demo's UPS crate names its batteries in the contents.
    expect(mentionsLithium({ contents: "UPS with lithium-ion batteries", notes: "" })).toBe(true);
    expect(mentionsLithium({ contents: "Spare Li-ion packs", notes: "" })).toBe(true);
    expect(mentionsLithium({ contents: "Laser rack", notes: "Keep upright" })).toBe(false);
  });
});
