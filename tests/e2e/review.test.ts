// Office review end to end: the crew records a checklist and an observation; a reviewer approves
// the checklist and sends the observation back; the tablet, which wrote on the checklist while
// offline, syncs: its change is refused (approved records are read-only) and kept for recovery,
// the checklist shows as approved, and the site board shows the reviewer's comment.
import { afterAll, beforeAll, expect, test } from "vitest";
import type { Page } from "playwright-core";
import { launchProfile, screenshot, viewports, type Profile } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import {
  demoCampaignName,
  readyForOffline,
  seriousViolations,
  signIn,
  waitForSyncStatus,
} from "./flows";

const tablet = tabletForFile(viewports.tabletPortrait);
let office: Profile;
let desk: Page;

beforeAll(async () => {
  office = await launchProfile({ viewport: viewports.tabletLandscape });
  desk = office.context.pages()[0] ?? (await office.context.newPage());
});
afterAll(async () => {
  await office?.close();
});

const item = (page: Page, label: string) =>
  page
    .getByRole("list", { name: "Items of Arrival at the site" })
    .getByRole("listitem")
    .filter({ has: page.getByRole("heading", { name: label }) });

const card = (page: Page, name: RegExp) =>
  page.getByRole("list", { name: "Records" }).getByRole("listitem", { name });

async function openReview(page: Page, baseUrl: string) {
  await signIn(page, baseUrl, "reviewer@demo.equipot.test");
  await page.getByRole("heading", { name: "Choose a campaign" }).waitFor();
  await page.getByRole("link", { name: new RegExp(demoCampaignName) }).click();
  await page
    .getByRole("navigation", { name: "Campaign" })
    .getByRole("link", { name: "Review" })
    .click();
  await page.getByRole("heading", { name: "Review", level: 1 }).waitFor();
}

test("a reviewer approves one record and sends another back; the tablet learns both", async () => {
  const { page, server, profile } = tablet;
  await readyForOffline(page, server.baseUrl, "field");

  // The crew at the hut: a checklist begun and an observation, sent.
  await page.getByRole("link", { name: "Kestrel Ridge hut", exact: true }).click();
  await page.getByRole("button", { name: "Arrival at the site" }).click();
  await page.getByRole("heading", { name: "Arrival at the site", level: 1 }).waitFor();
  const runUrl = page.url();
  await item(page, "Access road").getByRole("button", { name: "Done", exact: true }).click();
  await page.getByRole("link", { name: "Back to Kestrel Ridge hut" }).click();
  await page.getByRole("link", { name: "Observation", exact: true }).click();
  await page.getByLabel("What did you see?").fill("Snow drift across the access track");
  await page.getByRole("button", { name: "Save observation" }).click();
  await page.getByText("Saved on this device").waitFor();
  await waitForSyncStatus(page, "All changes sent", 30_000);
  await profile.context.setOffline(true);

  // The office.
  await openReview(desk, server.baseUrl);
  // Today only: the demo's own records are dated in the campaign's season.
  const today = new Date().toISOString().slice(0, 10);
  await desk.getByLabel("From", { exact: true }).fill(today);
  await desk.getByLabel("To", { exact: true }).fill(today);
  await desk.getByLabel("Kind").selectOption({ label: "Checklist" });
  const checklist = card(desk, /Checklist: Arrival at the site/).filter({
    hasText: "Kestrel Ridge hut",
  });
  await checklist.waitFor();
  expect(await seriousViolations(desk)).toEqual([]);
  await checklist.getByRole("button", { name: /^Approve / }).click();
  await desk.getByText("Nothing here with these filters.").waitFor();
  await desk.getByLabel("Kind").selectOption({ label: "Field entry" });
  const observation = card(desk, /Field entry: Observation/).filter({ hasText: "Snow drift" });
  await observation.getByRole("button", { name: /^Send back / }).click();
  await observation
    .getByLabel("What should the author fix?")
    .fill("Add a photo of the drift and say whether the crates can pass.");
  await observation.getByRole("button", { name: "Send back", exact: true }).click();
  await observation.waitFor({ state: "detached" });
  await desk.getByLabel("Show").selectOption({ label: "Sent back" });
  await card(desk, /Field entry: Observation/)
    .filter({ hasText: "Add a photo of the drift" })
    .waitFor();
  await screenshot(desk, "review-queue-sent-back");

  // Still offline, the crew adds to the checklist the office has just approved.
  await page.goto(runUrl);
  await page.getByRole("heading", { name: "Arrival at the site", level: 1 }).waitFor();
  await item(page, "Weather checked").getByRole("button", { name: "Done", exact: true }).click();
  await profile.context.setOffline(false);
  await waitForSyncStatus(page, "All changes sent", 30_000);

  // The change is refused and kept; the checklist shows the approval and takes no more results.
  await page.getByText("Approved by the office").waitFor();
  expect(await item(page, "Access road").getByRole("button", { name: "Done" }).count()).toBe(0);
  expect(await page.getByRole("button", { name: "Sign off" }).count()).toBe(0);
  await screenshot(page, "review-approved-checklist");
  await page
    .getByRole("navigation", { name: "Campaign" })
    .getByRole("link", { name: /Conflicts/ })
    .click();
  const refused = page.getByRole("list", { name: "Refused changes" }).getByRole("listitem");
  await refused.waitFor();
  expect(await refused.innerText()).toMatch(/approved by .+ and is read-only/);

  // The send-back, with its comment, on the site board and on the entry.
  await page
    .getByRole("navigation", { name: "Campaign" })
    .getByRole("link", { name: "Site board" })
    .click();
  await page.getByRole("link", { name: "Kestrel Ridge hut", exact: true }).click();
  const sentBack = page.getByRole("region", { name: /Sent back by the office: 1/ });
  await sentBack.waitFor();
  expect(await sentBack.innerText()).toContain("Add a photo of the drift");
  await screenshot(page, "review-sent-back-on-board");
  await sentBack.getByRole("link", { name: "Field entry" }).click();
  await page.getByRole("heading", { name: "Observation", level: 1 }).waitFor();
  await page
    .getByRole("paragraph")
    .filter({ hasText: "Snow drift across the access track" })
    .waitFor();
  await page.getByText("Sent back by the office").waitFor();
  expect(await page.getByRole("button", { name: /photo/i }).count()).toBeGreaterThan(0);
  expect(await seriousViolations(page)).toEqual([]);

  // The record's trail in the office names the tablet's changes and the decisions.
  await desk.getByLabel("Show").selectOption({ label: "Approved" });
  await desk.getByLabel("Kind").selectOption({ label: "Checklist" });
  await card(desk, /Checklist: Arrival at the site/)
    .first()
    .getByRole("link", { name: "Arrival at the site" })
    .click();
  const trail = desk.getByRole("list", { name: "Audit trail" });
  await trail.waitFor();
  const lines = await trail.getByRole("listitem").allInnerTexts();
  expect(lines.some((l) => /checklist added by .+ · device/.test(l))).toBe(true);
  expect(lines.at(-1)).toMatch(/checklist approved by/);
  await screenshot(desk, "review-record-trail");
});
