// A crew at the site, offline: starts the arrival checklist, enters one number outside its range
// (flagged at once), sees the weather caution, is told what is missing before sign-off, finishes,
// and everything reaches the server when the network returns.
import { expect, test } from "vitest";
import type { Page } from "playwright-core";
import { screenshot, viewports } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import { pullDemoCampaign, readyForOffline, seriousViolations, waitForSyncStatus } from "./flows";

const tablet = tabletForFile(viewports.tabletPortrait);

const item = (page: Page, label: string) =>
  page
    .getByRole("list", { name: "Items of Arrival at the site" })
    .getByRole("listitem")
    .filter({
      has: page.getByRole("heading", { name: label }),
    });

test("the arrival checklist worked offline, with a number out of range, reaches the server", async () => {
  const { page, server, profile } = tablet;
  await readyForOffline(page, server.baseUrl, "field");

  await profile.context.setOffline(true);
  await page.getByRole("link", { name: "Kestrel Ridge hut", exact: true }).click();
  await page.getByRole("button", { name: "Arrival at the site" }).click();
  await page.getByRole("heading", { name: "Arrival at the site", level: 1 }).waitFor();
  expect(await item(page, "Weather checked").innerText()).toContain(
    "Caution: Mountain or coastal weather",
  );

  const temperature = item(page, "Room temperature");
  await temperature.getByLabel("Value").fill("31,5");
  await temperature.getByRole("button", { name: "Save" }).click();
  await temperature.getByText("outside the allowed range (between 18 and 26 °C)").waitFor();
  await screenshot(page, "checklist-out-of-range");

  await page.getByRole("button", { name: "Sign off" }).click();
  await page.getByText(/Not signed off: no result yet for Access road/).waitFor();

  for (const label of ["Access road", "Weather checked"])
    await item(page, label).getByRole("button", { name: "Done", exact: true }).click();
  const humidity = item(page, "Room relative humidity");
  await humidity.getByLabel("Value").fill("45");
  await humidity.getByRole("button", { name: "Save" }).click();
  await item(page, "Mains power").getByRole("button", { name: "Stable", exact: true }).click();
  const crates = item(page, "Crates delivered");
  await crates.getByLabel("Value").fill("5");
  await crates.getByRole("button", { name: "Save" }).click();
  const photo = item(page, "Photo of the crates");
  const png = Buffer.from(
    "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==",
    "base64",
  );
  await photo
    .locator('input[type="file"]')
    .setInputFiles({ name: "crates.png", mimeType: "image/png", buffer: png });
  await photo.getByText("Photo kept").waitFor();
  expect(await seriousViolations(page)).toEqual([]);
  await page.getByLabel("Note with the sign-off (optional)").fill("Room too warm; fan set up.");
  await page.getByRole("button", { name: "Sign off" }).click();
  await page.getByText("Signed off", { exact: true }).waitFor();
  await screenshot(page, "checklist-signed-off");

  await profile.context.setOffline(false);
  await waitForSyncStatus(page, "All changes sent", 30_000);

  const pulled = await pullDemoCampaign(server.baseUrl, "reviewer");
  const run = pulled.changes.find((c) => c.entity === "checklistRun");
  expect(run?.data).toMatchObject({
    title: "Arrival at the site",
    signOffNote: "Room too warm; fan set up.",
  });
  const results = pulled.changes.flatMap((c) => (c.entity === "checklistResult" ? [c.data] : []));
  expect(results.find((r) => r.itemId === "room-temp")).toMatchObject({
    value: 31.5,
    outOfRange: true,
  });
  expect(results).toHaveLength(7);
  expect(
    pulled.changes.some((c) => c.entity === "attachment" && c.data.subject.kind === "checklistRun"),
  ).toBe(true);
});
