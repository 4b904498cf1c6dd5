// A crate's journey: logistics plans a leg from the lab to the hut; the field crew, offline,
// records the departure, the arrival and the handover at the hut (the crate picked by scanning a
// photo of its label), and sees the chain of custody; back online, the server has it all.
import { afterAll, expect, test } from "vitest";
import type { Page } from "playwright-core";
import { launchProfile, screenshot, viewports, type Profile } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import { protocolVersion } from "../../shared/sync/protocol";
import {
  apiCall,
  apiSignIn,
  pullDemoCampaign,
  readyForOffline,
  seriousViolations,
  waitForSyncStatus,
} from "./flows";

const tablet = tabletForFile(viewports.tabletLandscape);
let fieldProfile: Profile | undefined;
afterAll(async () => {
  await fieldProfile?.close();
});

const lab = "Brennmoor reference laboratory";
const hut = "Kestrel Ridge hut";
const route = `${lab} → ${hut}`;

async function openCrate(page: Page, baseUrl: string, campaignId: string, label: string) {
  await page.goto(`${baseUrl}/campaigns/${campaignId}/crates`);
  await page.getByRole("heading", { name: "Crates", level: 1 }).waitFor();
  await page.getByRole("list", { name: "Crates" }).getByRole("link", { name: label }).click();
  await page.getByRole("heading", { name: label, level: 1 }).waitFor();
}

test("a leg planned by logistics, travelled and handed over offline, reaches the server", async () => {
  const { page, server } = tablet;
  const demo = await pullDemoCampaign(server.baseUrl, "reviewer");
  const crate = demo.changes.find((c) => c.entity === "crate" && c.data.label === "KR-02");
  expect(crate).toBeDefined();

  // Logistics plans the leg.
  await readyForOffline(page, server.baseUrl, "logistics");
  await openCrate(page, server.baseUrl, demo.campaignId, "KR-02");
  // KR-02 weighs 48 kg: the team-lift caution defers to local rules.
  await page.getByText("Caution: team lift (48 kg)").waitFor();
  // Editing the crate is online: a wrong range is refused at its field, then saved.
  await page.getByRole("button", { name: "Edit crate" }).click();
  const edit = page.getByRole("form", { name: "Edit KR-02" });
  await edit.getByLabel("Lowest temperature").fill("30");
  await edit.getByRole("button", { name: "Save crate" }).click();
  await edit.getByText("The lowest temperature must be below the highest").waitFor();
  expect(await edit.getByLabel("Highest temperature").getAttribute("aria-invalid")).toBe("true");
  await edit.getByLabel("Lowest temperature").fill("15,5");
  await edit.getByLabel("Notes").fill("Keep upright. Eyewear per the laser class when powered.");
  await edit.getByRole("button", { name: "Save crate" }).click();
  await edit.waitFor({ state: "detached" });
  await page.getByText("Shock ≤ 25 g · 15.5 … 28 °C").waitFor();
  await page.getByText("Keep upright. Eyewear per the laser class when powered.").waitFor();
  const plan = page.getByRole("form", { name: "Plan a leg" });
  await plan.getByLabel("Vehicle or carrier (optional)").fill("Air-sprung van");
  await plan.getByLabel("From", { exact: true }).selectOption({ label: lab });
  await plan.getByLabel("To", { exact: true }).selectOption({ label: lab });
  await plan.getByLabel("Planned departure").fill("2027-07-01T07:00");
  await plan.getByLabel("Planned arrival").fill("2027-07-01T15:00");
  await plan.getByRole("button", { name: "Plan leg" }).click();
  // Same start and end: refused at the field, nothing saved.
  await plan.getByText("A leg ends somewhere else than it starts").waitFor();
  await plan.getByLabel("To", { exact: true }).selectOption({ label: hut });
  await plan.getByRole("button", { name: "Plan leg" }).click();
  await plan.getByText("Leg planned").waitFor();
  await page.getByRole("list", { name: "Legs" }).getByText(route).waitFor();
  expect(await seriousViolations(page)).toEqual([]);
  await waitForSyncStatus(page, "All changes sent", 30_000);

  await page.goto(`${server.baseUrl}/campaigns/${demo.campaignId}/logistics`);
  await page.getByRole("heading", { name: "Logistics", level: 1 }).waitFor();
  const table = page.getByRole("table", { name: "All legs" });
  await table.getByRole("row").filter({ hasText: "KR-02" }).waitFor();
  await page.getByLabel("Filter legs").fill("KR-02");
  await page.getByText("1 of 3 legs").waitFor();
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "logistics-dashboard");
  await page.getByRole("link", { name: "All alerts" }).click();
  await page.getByRole("heading", { name: "Alerts", level: 1 }).waitFor();
  expect(await seriousViolations(page)).toEqual([]);
  await page.getByRole("link", { name: "Crates", exact: true }).click();
  await page.getByRole("list", { name: "Crates" }).getByText("KR-05").waitFor();
  expect(await seriousViolations(page)).toEqual([]);

  // The field crew, on their own tablet, goes offline.
  fieldProfile = await launchProfile({ viewport: viewports.tabletLandscape });
  const field = fieldProfile.context.pages()[0] ?? (await fieldProfile.context.newPage());
  await readyForOffline(field, server.baseUrl, "field");
  // The label on the crate, as the tablet's camera would photograph it.
  await field.goto(`${server.baseUrl}/campaigns/${demo.campaignId}/crates/${crate?.id}/label`);
  const labelPhoto = await field.getByTestId("crate-qr").screenshot();
  await fieldProfile.context.setOffline(true);
  await openCrate(field, server.baseUrl, demo.campaignId, "KR-02");
  const legs = field.getByRole("list", { name: "Legs" });
  await legs.getByRole("button", { name: `Depart ${route}` }).click();
  await legs.getByText("On the way", { exact: true }).waitFor();
  await field.getByText(`On the way to ${hut}`).waitFor();
  await legs.getByRole("button", { name: `Arrive ${route}` }).click();
  await legs.getByText("Arrived", { exact: true }).waitFor();
  await field.getByText(`At ${hut}`).waitFor();
  expect(await seriousViolations(field)).toEqual([]);

  await field.getByRole("link", { name: "Crates", exact: true }).click();
  await field.getByRole("link", { name: "Hand over a crate" }).click();
  await field.getByRole("heading", { name: "Hand over a crate" }).waitFor();
  const form = field.getByRole("form", { name: "Handover" });
  await field
    .getByLabel("Scan from a photo")
    .setInputFiles({ name: "label.png", mimeType: "image/png", buffer: labelPhoto });
  await form.getByText("KR-02: Laser rack").waitFor();
  await form.getByLabel("Handed over by").fill("Van driver");
  await form.getByLabel("Received by (typed name)").fill("Hut crew lead");
  await form.getByLabel("Site (optional)").selectOption({ label: hut });
  await form.getByRole("button", { name: "Record handover" }).click();
  await form.getByText("Choose the crate's condition").waitFor();
  await form.getByLabel("Intact").check();
  expect(await seriousViolations(field)).toEqual([]);
  await form.getByRole("button", { name: "Record handover" }).click();
  await field.getByRole("heading", { name: "KR-02: Van driver → Hut crew lead" }).waitFor();
  await field.getByText("Saved on this device").waitFor();
  await field.getByRole("heading", { name: "Photos and files" }).waitFor();
  expect(await seriousViolations(field)).toEqual([]);

  await field.getByRole("link", { name: "Chain of custody of KR-02" }).click();
  const chain = field.getByRole("list", { name: "Chain of custody" });
  await chain.getByText("Van driver → Hut crew lead").waitFor();
  expect(await chain.innerText()).toContain(hut);
  await field.getByText("With Hut crew lead").waitFor();
  await screenshot(field, "crate-custody");

  await fieldProfile.context.setOffline(false);
  await waitForSyncStatus(field, "All changes sent", 30_000);

  const pulled = await pullDemoCampaign(server.baseUrl, "reviewer");
  const leg = pulled.changes.find(
    (c) =>
      c.entity === "leg" && c.data.crateId === crate?.id && c.data.vehicle === "Air-sprung van",
  );
  expect(leg?.data).toMatchObject({
    departedAt: expect.any(String),
    arrivedAt: expect.any(String),
    cancelledAt: null,
  });
  const handover = pulled.changes.find((c) => c.entity === "handover");
  expect(handover?.data).toMatchObject({
    crateId: crate?.id,
    fromName: "Van driver",
    toName: "Hut crew lead",
    condition: "intact",
    legId: leg?.id,
  });
  const edited = pulled.changes.find((c) => c.entity === "crate" && c.data.id === crate?.id);
  expect(edited?.data).toMatchObject({ temperatureMinC: 15.5, temperatureMaxC: 28 });
});

// Thousands of legs, planned from elsewhere through the sync API, reach the tablet; the table keeps
// only the visible rows in the page, and sorts and filters all of them.
test("the legs table stays small in the page with 2,000 legs, sorted and filtered", async () => {
  const { page, server } = tablet;
  const demo = await pullDemoCampaign(server.baseUrl, "reviewer");
  const crates = demo.changes.flatMap((c) => (c.entity === "crate" ? [c.data] : []));
  const sites = demo.changes.flatMap((c) => (c.entity === "site" ? [c.data] : []));
  const [from, to] = sites;
  expect(from && to && crates.length).toBeTruthy();
  const session = await apiSignIn(server.baseUrl, "logistics");
  const clientId = crypto.randomUUID();
  const total = 2000;
  for (let batch = 0; batch < total / 500; batch++) {
    const mutations = Array.from({ length: 500 }, (_, i) => {
      const n = batch * 500 + i;
      const depart = Date.parse("2027-08-01T06:00:00Z") + n * 3_600_000;
      return {
        mutationId: n + 1,
        name: "leg.plan",
        createdAt: new Date().toISOString(),
        args: {
          id: crypto.randomUUID(),
          crateId: crates[n % crates.length]?.id,
          fromSiteId: from?.id,
          toSiteId: to?.id,
          vehicle: `Bulk van ${n + 1}`,
          plannedDepartAt: new Date(depart).toISOString(),
          plannedArriveAt: new Date(depart + 7_200_000).toISOString(),
          note: "",
        },
      };
    });
    const pushed = await apiCall(server.baseUrl, session.accessToken, "POST", "/sync/push", {
      protocolVersion,
      clientId,
      campaignId: demo.campaignId,
      mutations,
    });
    expect(pushed.status).toBe(200);
  }

  await page.goto(`${server.baseUrl}/campaigns/${demo.campaignId}/logistics`);
  await page.getByRole("button", { name: "Sync now" }).click();
  await page.getByText(`${total + 3} of ${total + 3} legs`).waitFor({ timeout: 60_000 });
  const table = page.getByRole("table", { name: "All legs" });
  // Header row plus the rows in view and a few either side: far fewer than 2,003.
  expect(await table.getByRole("row").count()).toBeLessThan(60);
  expect(await table.getAttribute("aria-rowcount")).toBe(String(total + 4));

  await page.getByLabel("Filter legs").fill("Bulk van 1999");
  await page.getByText(`1 of ${total + 3} legs`).waitFor();
  await page.getByLabel("Filter legs").fill("");
  const header = table.getByRole("columnheader", { name: "Planned arrival" });
  expect(await header.getAttribute("aria-sort")).toBe("ascending");
  await header.getByRole("button").click();
  expect(await header.getAttribute("aria-sort")).toBe("descending");
  // Newest planned arrival first: the last bulk leg, 06:00 + 1,999 h + 2 h = 23 Oct 15:00 (by hand).
  expect(await table.getByRole("row").nth(1).innerText()).toContain("2027-10-23 15:00 UTC");
  expect(await seriousViolations(page)).toEqual([]);
});
