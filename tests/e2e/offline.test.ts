// After one online visit the app opens offline: the shell from the service worker, the session
// from what this device remembers, and the sites from this device's working copy (IndexedDB).
import { expect, test } from "vitest";
import { screenshot, viewports } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import {
  demoCampaignName,
  demoSiteNames,
  expectSitesListed,
  openDemoSites,
  waitForSyncStatus,
} from "./flows";

const tablet = tabletForFile(viewports.tabletLandscape);

test("signed in once online, the app reopens offline with the cached sites", async () => {
  const { page, server, profile } = tablet;
  await openDemoSites(page, server.baseUrl, "field");
  const sitesUrl = page.url();

  // The service worker must control the page, and the campaign must be pulled onto the device.
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
  await waitForSyncStatus(page, "All changes sent");
  expect(await page.evaluate(() => localStorage.getItem("equipot.session.v1"))).toContain(
    "field@demo.equipot.test",
  );

  await profile.context.setOffline(true);
  await page.reload();
  await page.getByRole("heading", { name: "Sites", exact: true }).waitFor();
  // Chromium 150 may report navigator.onLine as true in an emulated offline context after a
  // reload; the app then says the server is out of reach, which is as true to the crew.
  const status = page.getByRole("status").filter({ hasText: /Offline|Server out of reach/ });
  await status.waitFor();
  await expectSitesListed(page, demoSiteNames);
  expect(await page.getByText("Mira Castell").count()).toBeGreaterThan(0);
  const problem = page.getByRole("region", { name: "Sync" }).getByRole("alert");
  expect(await problem.innerText()).toContain("No connection to the server");
  await screenshot(page, "offline-sites-1024x768");

  // Other screens open offline too: the picker from the cache, a deep link from the shell.
  await page.getByRole("link", { name: "Change campaign" }).click();
  await page.getByRole("link", { name: new RegExp(demoCampaignName) }).waitFor();
  await page.goto(`${sitesUrl}/new`);
  await page.getByRole("heading", { name: "Add a site" }).waitFor();
  await page.setViewportSize(viewports.tabletPortrait);
  await page.goto(sitesUrl);
  await expectSitesListed(page, demoSiteNames);
  await screenshot(page, "offline-sites-800x1280");

  // Back online: the remembered session is confirmed with the server again.
  await profile.context.setOffline(false);
  await page.getByRole("status").filter({ hasText: "Online" }).waitFor({ timeout: 15_000 });
  expect(await page.getByRole("status").filter({ hasText: "Offline" }).count()).toBe(0);
});
