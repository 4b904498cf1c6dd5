// Local-first sites: work offline for a while, reload offline, come back, and everything reaches
// the server and other people. Two devices changing the same field open a conflict to resolve.
import { readFileSync } from "node:fs";
import pg from "pg";
import { afterAll, beforeAll, expect, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import {
  launchBrowser,
  launchProfile,
  screenshot,
  screenshotOnFailure,
  viewports,
  type Profile,
} from "../helpers/browser";
import { startTestServer, type TestServer } from "../helpers/server";
import {
  addSite,
  demoCampaignName,
  demoEmail,
  demoSiteNames,
  editNotes,
  expectSitesListed,
  signIn,
  openDemoSites,
  readyForOffline,
  serverSites,
  syncStatusText,
  waitForSyncStatus,
} from "./flows";

let server: TestServer;
let profile: Profile;
let browser: Browser;
let current: Page | undefined;

beforeAll(async () => {
  server = await startTestServer();
  profile = await launchProfile({ viewport: viewports.tabletLandscape });
  browser = await launchBrowser();
});

screenshotOnFailure(() => current);

afterAll(async () => {
  await profile?.close();
  await browser?.close();
  await server?.stop();
});

const shelter = {
  name: "Glenvar pass shelter",
  kind: "mountain",
  latitude: "46,95512",
  longitude: "10.40210",
  height: "2311",
  notes: "Shelter key with the hut warden.",
};
const hutNotes = "Generator refuelled; 40 L left in the store.";

const pendingRow = (page: Page, name: string) =>
  page.getByRole("row", { name: new RegExp(name) }).getByText("Not yet sent");

test("sites added and edited offline survive a reload and reach the server and others", async () => {
  const page = profile.context.pages()[0] ?? (await profile.context.newPage());
  current = page;
  await readyForOffline(page, server.baseUrl, "field");

  await profile.context.setOffline(true);
  await page.getByRole("banner").getByRole("status").filter({ hasText: "Offline" }).waitFor();
  await addSite(page, shelter);
  expect(await page.getByText("Saved on this device").count()).toBe(1);
  await editNotes(page, "Kestrel Ridge hut", hutNotes);
  await waitForSyncStatus(page, "2 changes not yet sent");

  await page.reload();
  await page.getByRole("heading", { name: "Sites", exact: true }).waitFor();
  await page.getByRole("rowheader", { name: new RegExp(shelter.name) }).waitFor();
  await waitForSyncStatus(page, "2 changes not yet sent");
  expect(await pendingRow(page, shelter.name).count()).toBe(1);
  expect(await pendingRow(page, "Kestrel Ridge hut").count()).toBe(1);
  expect(await pendingRow(page, "Saltmere tide station").count()).toBe(0);
  expect(await page.getByRole("row", { name: /Kestrel Ridge hut/ }).innerText()).toContain(
    "Generator refuelled",
  );
  await screenshot(page, "sync-offline-pending-1024x768");

  await profile.context.setOffline(false);
  await waitForSyncStatus(page, "All changes sent", 30_000);
  expect(await page.getByText("Not yet sent").count()).toBe(0);
  expect(await syncStatusText(page)).toContain("All changes sent");
  await screenshot(page, "sync-online-sent-1024x768");

  const onServer = await serverSites(server.baseUrl, "logistics");
  expect(onServer.find((s) => s.name === shelter.name)?.notes).toBe(shelter.notes);
  expect(onServer.find((s) => s.name === "Kestrel Ridge hut")?.notes).toBe(hutNotes);

  const other = await browser.newContext({ viewport: viewports.tabletLandscape });
  const otherPage = await other.newPage();
  current = otherPage;
  await openDemoSites(otherPage, server.baseUrl, "geodesist");
  await otherPage.getByRole("rowheader", { name: new RegExp(shelter.name) }).waitFor();
  const hutRow = await otherPage.getByRole("row", { name: /Kestrel Ridge hut/ }).innerText();
  expect(hutRow).toContain("Generator refuelled");
  await other.close();
  current = undefined;
});

test("two devices change the same field offline: a conflict is listed and resolved", async () => {
  const contextA = await browser.newContext({ viewport: viewports.tabletLandscape });
  const contextB = await browser.newContext({ viewport: viewports.tabletLandscape });
  const a = await contextA.newPage();
  const b = await contextB.newPage();
  current = a;
  await openDemoSites(a, server.baseUrl, "logistics");
  await openDemoSites(b, server.baseUrl, "geodesist");
  await waitForSyncStatus(a, "All changes sent");
  await waitForSyncStatus(b, "All changes sent");
  await contextA.setOffline(true);
  await contextB.setOffline(true);
  await editNotes(a, "Saltmere tide station", "Tide gauge moved to the north pier.");
  await editNotes(b, "Saltmere tide station", "Tide gauge kept at the south pier.");

  await contextA.setOffline(false);
  await waitForSyncStatus(a, "All changes sent", 30_000);
  current = b;
  await contextB.setOffline(false);
  await waitForSyncStatus(b, "All changes sent", 30_000);

  const tab = b.getByRole("navigation", { name: "Campaign" }).getByRole("link", {
    name: /Conflicts/,
  });
  await tab.filter({ hasText: "1" }).waitFor({ timeout: 20_000 });
  await tab.click();
  const conflict = b.getByRole("list", { name: "Open conflicts" }).getByRole("listitem");
  await conflict.waitFor();
  const text = await conflict.innerText();
  expect(text).toContain("Saltmere tide station · Notes");
  expect(text).toContain("On the server");
  expect(text).toContain("Tide gauge moved to the north pier.");
  expect(text).toContain("Tide gauge kept at the south pier.");
  await screenshot(b, "sync-conflict-1024x768");

  await b.getByRole("button", { name: "Keep Tide gauge kept at the south pier." }).click();
  await b.getByText("No conflicts").waitFor();
  await waitForSyncStatus(b, "All changes sent", 30_000);
  await b.getByRole("link", { name: "Sites", exact: true }).click();
  const row = b.getByRole("row", { name: /Saltmere tide station/ });
  expect(await row.innerText()).toContain("Tide gauge kept at the south pier.");
  // The status can still read "All changes sent" for a moment after the choice: wait for the server.
  await expect
    .poll(
      async () =>
        (await serverSites(server.baseUrl, "admin")).find((s) => s.name === "Saltmere tide station")
          ?.notes,
      { timeout: 20_000 },
    )
    .toBe("Tide gauge kept at the south pier.");
  await contextA.close();
  await contextB.close();
  current = undefined;
});

test("before the first pull the list says it is loading, or offline that nothing is here yet", async () => {
  const context = await browser.newContext({ viewport: viewports.tabletLandscape });
  const page = await context.newPage();
  current = page;
  let releasePull = () => {};
  const held = new Promise<void>((resolve) => (releasePull = resolve));
  await page.route("**/api/sync/pull**", async (route) => {
    await held;
    await route.continue().catch(() => undefined);
  });
  await signIn(page, server.baseUrl, demoEmail("reviewer"));
  await page.getByRole("link", { name: new RegExp(demoCampaignName) }).click();
  await page.getByText("Loading the campaign onto this device…").waitFor();
  await screenshot(page, "sync-first-load-1024x768");

  await context.setOffline(true);
  await page.getByText("Nothing on this device yet").waitFor();
  expect(await page.getByText("Loading the campaign onto this device…").count()).toBe(0);

  await context.setOffline(false);
  releasePull();
  await expectSitesListed(page, demoSiteNames);
  await waitForSyncStatus(page, "All changes sent");
  expect(await page.getByText("Nothing on this device yet").count()).toBe(0);
  await context.close();
  current = undefined;
});

test("signing out with unsent changes warns, offers them as a file, and keeps them for later", async () => {
  const context = await browser.newContext({
    viewport: viewports.tabletLandscape,
    acceptDownloads: true,
  });
  const page = await context.newPage();
  current = page;
  await openDemoSites(page, server.baseUrl, "field");
  await waitForSyncStatus(page, "All changes sent");
  await context.setOffline(true);
  await addSite(page, { ...shelter, name: "Moorend relay hut" });
  await waitForSyncStatus(page, "1 change not yet sent");

  await page.getByRole("link", { name: "This device" }).click();
  await page.getByRole("heading", { name: "This device", exact: true }).waitFor();
  await page.getByText("1 change waits on this device for the server.").waitFor();
  await screenshot(page, "sync-device-1024x768");

  await page.getByRole("button", { name: "Sign out" }).click();
  const warning = page.getByRole("dialog", { name: "1 change not yet sent" });
  await warning.waitFor();
  const [download] = await Promise.all([
    page.waitForEvent("download"),
    warning.getByRole("button", { name: "Download unsent changes" }).click(),
  ]);
  expect(download.suggestedFilename()).toMatch(/^equipot-unsent-changes-.*\.json$/);
  const saved = JSON.parse(readFileSync((await download.path()) ?? "", "utf8")) as {
    kind: string;
    entries: { name: string; args: { name?: string } }[];
  };
  expect(saved.kind).toBe("equipot-outbox");
  expect(saved.entries.map((e) => [e.name, e.args.name])).toEqual([
    ["site.create", "Moorend relay hut"],
  ]);
  await screenshot(page, "sync-sign-out-warning-1024x768");
  await warning.getByRole("button", { name: "Sign out anyway" }).click();
  await page.getByRole("heading", { name: "Sign in" }).waitFor();

  // Back online and signed in again, the change kept on this device is sent.
  await context.setOffline(false);
  await openDemoSites(page, server.baseUrl, "field");
  await page.getByRole("rowheader", { name: /Moorend relay hut/ }).waitFor();
  await waitForSyncStatus(page, "All changes sent", 30_000);
  expect((await serverSites(server.baseUrl, "admin")).map((s) => s.name)).toContain(
    "Moorend relay hut",
  );
  await context.close();
  current = undefined;
});

async function setRole(email: string, role: string) {
  const client = new pg.Client({ connectionString: server.databaseUrl });
  await client.connect();
  try {
    await client.query(
      "update memberships set role = $1 where user_id = (select id from users where email = $2)",
      [role, email],
    );
  } finally {
    await client.end();
  }
}

test("a change refused at push time is kept for recovery, with the reason, as a file", async () => {
  const context = await browser.newContext({
    viewport: viewports.tabletLandscape,
    acceptDownloads: true,
  });
  const page = await context.newPage();
  current = page;
  await openDemoSites(page, server.baseUrl, "field");
  await waitForSyncStatus(page, "All changes sent");
  await context.setOffline(true);
  await addSite(page, { ...shelter, name: "Harrow gap depot" });
  // While the tablet is away, the person's role in the campaign changes to one that cannot write.
  await setRole(demoEmail("field"), "reviewer");
  try {
    await context.setOffline(false);
    await waitForSyncStatus(page, "All changes sent", 30_000);
    const tab = page.getByRole("navigation", { name: "Campaign" }).getByRole("link", {
      name: /Conflicts/,
    });
    await tab.filter({ hasText: "1" }).waitFor();
    expect(await page.getByRole("rowheader", { name: /Harrow gap depot/ }).count()).toBe(0);
    await tab.click();
    const kept = page.getByRole("list", { name: "Refused changes" }).getByRole("listitem");
    await kept.waitFor();
    const text = await kept.innerText();
    expect(text).toContain("New site: Harrow gap depot");
    expect(text).toMatch(/Refused: \S+/);
    await screenshot(page, "sync-recovery-1024x768");
    const [download] = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("button", { name: "Download as JSON" }).click(),
    ]);
    const saved = JSON.parse(readFileSync((await download.path()) ?? "", "utf8")) as {
      kind: string;
      entries: { name: string; args: { name?: string }; reason: string }[];
    };
    expect(saved.kind).toBe("equipot-recovery");
    expect(saved.entries.map((e) => e.args.name)).toEqual(["Harrow gap depot"]);
    expect((await serverSites(server.baseUrl, "admin")).map((s) => s.name)).not.toContain(
      "Harrow gap depot",
    );
  } finally {
    await setRole(demoEmail("field"), "field");
  }
  await context.close();
  current = undefined;
});
