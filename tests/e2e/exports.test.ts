// An administrator hands out the campaign: downloads the archive from the Exports page and brings it
// into this server as a new campaign, which then opens with the same sites.
import { readFile } from "node:fs/promises";
import { expect, test } from "vitest";
import { screenshot, viewports } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import { demoSiteNames, expectSitesListed, openDemoSites, seriousViolations } from "./flows";

const tablet = tabletForFile({ ...viewports.tabletLandscape });

test("the archive downloaded from the Exports page imports as a new campaign", async () => {
  const { page, server } = tablet;
  await openDemoSites(page, server.baseUrl, "admin");
  await page
    .getByRole("navigation", { name: "Campaign" })
    .getByRole("link", { name: "Exports" })
    .click();
  await page.getByRole("heading", { name: "Exports", level: 1 }).waitFor();
  await page
    .getByText("campaign results, not official heights", { exact: false })
    .first()
    .waitFor();
  expect(await seriousViolations(page)).toEqual([]);

  const [download] = await Promise.all([
    page.waitForEvent("download"),
    page.getByRole("button", { name: "Download the campaign archive (ZIP)" }).click(),
  ]);
  expect(download.suggestedFilename()).toMatch(/\.zip$/);
  const path = await download.path();
  const bytes = await readFile(path);
  // A ZIP starts with the local file header signature "PK\x03\x04".
  expect(bytes.subarray(0, 4).toString("latin1")).toBe("PK\u0003\u0004");
  await screenshot(page, "exports-page");

  await page.getByLabel("Archive file").setInputFiles(path);
  await page.getByLabel("Name of the new campaign").fill("Kestrel Ridge rehearsal copy");
  await page.getByRole("button", { name: "Import as a new campaign" }).click();
  await page.getByText("New campaign created").waitFor({ timeout: 30_000 });
  await page.getByRole("link", { name: "Open “Kestrel Ridge rehearsal copy”" }).click();
  await page.getByText("Kestrel Ridge rehearsal copy").first().waitFor();
  await page
    .getByRole("navigation", { name: "Campaign" })
    .getByRole("link", { name: "Sites", exact: true })
    .click();
  await expectSitesListed(page, demoSiteNames);
  await screenshot(page, "exports-imported-campaign");
});
