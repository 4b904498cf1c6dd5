// Adding, checking, editing (merged with a colleague's change) and deleting sites, all on the
// device's working copy and sent by the sync engine.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, screenshot, viewports, watchConsole } from "../helpers/browser";
import { startTestServer, type TestServer } from "../helpers/server";
import {
  addSite,
  apiCall,
  apiSignIn,
  demoCampaignName,
  editNotes,
  fieldError,
  listedSiteNames,
  openDemoSites,
  serverSites,
  waitForSyncStatus,
  type DemoRole,
} from "./flows";

let server: TestServer;
let browser: Browser;

beforeAll(async () => {
  server = await startTestServer();
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

async function sitesPage(
  role: DemoRole,
  viewport: { width: number; height: number } = viewports.tabletLandscape,
): Promise<Page> {
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  await openDemoSites(page, server.baseUrl, role);
  return page;
}

async function openEdit(page: Page, siteName: string) {
  await page.getByRole("link", { name: `Edit ${siteName}` }).click();
  await page.getByRole("heading", { name: `Edit ${siteName}` }).waitFor();
}

describe("adding a site", () => {
  test("a field crew member adds a site and sees it listed", async () => {
    const page = await sitesPage("field");
    const problems = watchConsole(page);
    await page.getByRole("link", { name: "Add site" }).click();
    await page.getByLabel("Name").fill("Dunmarrow tunnel lab");
    await page.getByLabel("Kind of site").selectOption("tunnel");
    await page.getByLabel("Latitude").fill("46.91234");
    await page.getByLabel("Longitude").fill("-1.25");
    // A decimal comma is accepted, as typed on many field tablets.
    await page.getByLabel("Approximate height").fill("812,5");
    await page.getByLabel("Notes").fill("Gallery 3, left side. Ask the warden for the key.");
    await page.getByRole("button", { name: "Add site" }).click();

    await page.getByRole("rowheader", { name: /Dunmarrow tunnel lab/ }).waitFor();
    expect(new URL(page.url()).pathname).toMatch(/\/sites$/);
    const row = page.getByRole("row", { name: /Dunmarrow tunnel lab/ });
    const text = await row.innerText();
    expect(text).toContain("46.91234° N");
    expect(text).toContain("1.25000° W");
    expect(text).toContain("812.5 m");
    expect(await listedSiteNames(page)).toHaveLength(4);
    expect(problems).toEqual([]);
    await page.context().close();
  });

  test("bad input shows the error at the field and sends nothing", async () => {
    const page = await sitesPage("geodesist", viewports.tabletPortrait);
    let posted = 0;
    page.on("request", (request) => {
      if (request.method() === "POST" && request.url().includes("/sites")) posted += 1;
    });
    await page.getByRole("link", { name: "Add site" }).click();
    await page.getByLabel("Latitude").fill("123");
    await page.getByLabel("Longitude").fill("east-ish");
    await page.getByLabel("Approximate height").fill("9500");
    await page.getByRole("button", { name: "Add site" }).click();

    await page.locator('[aria-invalid="true"]').first().waitFor();
    expect(await fieldError(page, "Name")).toBe("Name is required");
    expect(await fieldError(page, "Kind of site")).toBe("Choose the kind of site");
    expect(await fieldError(page, "Latitude")).toBe("Latitude must be between −90° and 90°");
    expect(await fieldError(page, "Longitude")).toBe("Longitude must be a number");
    expect(await fieldError(page, "Approximate height")).toBe(
      "Approximate height must be between -500 m and 9000 m",
    );
    expect(posted).toBe(0);
    expect(new URL(page.url()).pathname).toMatch(/\/sites\/new$/);
    await screenshot(page, "site-form-errors-800x1280");
    await page.context().close();
  });

  test("adding and editing never call the sites REST endpoints: they go through sync", async () => {
    const page = await sitesPage("logistics");
    const restWrites: string[] = [];
    const pushes: string[] = [];
    page.on("request", (request) => {
      const url = request.url();
      if (request.method() !== "GET" && url.includes("/api/campaigns/")) restWrites.push(url);
      if (url.includes("/api/sync/push")) pushes.push(url);
    });
    await addSite(page, {
      name: "Windgap depot",
      kind: "depot",
      latitude: "47.1",
      longitude: "11.3",
      height: "1040",
    });
    await editNotes(page, "Windgap depot", "Forklift in bay 2.");
    await waitForSyncStatus(page, "All changes sent");
    expect(restWrites).toEqual([]);
    expect(pushes.length).toBeGreaterThan(0);
    const onServer = await serverSites(server.baseUrl, "admin");
    expect(onServer.find((s) => s.name === "Windgap depot")?.notes).toBe("Forklift in bay 2.");
    await page.context().close();
  });

  test("a reviewer cannot open the form by its address", async () => {
    const page = await sitesPage("reviewer");
    await page.goto(`${page.url()}/new`);
    await page.getByText("Not available for your role").waitFor();
    expect(await page.getByRole("button", { name: "Add site" }).count()).toBe(0);
    await page.context().close();
  });
});

describe("editing and deleting", () => {
  test("an edit merges with a colleague's change of another field on the server", async () => {
    const page = await sitesPage("geodesist");
    await openEdit(page, "Kestrel Ridge hut");

    // Meanwhile a colleague changes the notes of the same site from another device.
    const other = await apiSignIn(server.baseUrl, "logistics");
    const campaign = other.memberships.find((m) => m.campaignName === demoCampaignName);
    const campaignId = campaign?.campaignId ?? "";
    const sites = await serverSites(server.baseUrl, "logistics");
    const hut = sites.find((s) => s.name === "Kestrel Ridge hut");
    expect(hut).toBeDefined();
    const patched = await apiCall(
      server.baseUrl,
      other.accessToken,
      "PATCH",
      `/campaigns/${campaignId}/sites/${hut?.id ?? ""}`,
      { baseVersion: hut?.version, notes: "Cable car closed for repairs until Friday." },
    );
    expect(patched.status).toBe(200);

    await page.getByLabel("Name").fill("Kestrel Ridge summit hut");
    await page.getByRole("button", { name: "Save changes" }).click();
    await page.getByRole("rowheader", { name: /Kestrel Ridge summit hut/ }).waitFor();
    await waitForSyncStatus(page, "All changes sent");
    // Only the name was sent, so the colleague's notes arrive and stay.
    await page.waitForFunction(() => document.body.innerText.includes("Cable car closed"));
    const row = await page.getByRole("row", { name: /Kestrel Ridge summit hut/ }).innerText();
    expect(row).toContain("Cable car closed for repairs");
    expect(await page.getByRole("link", { name: /Conflicts/ }).innerText()).toBe("Conflicts");
    const after = (await serverSites(server.baseUrl, "admin")).find((s) => s.id === hut?.id);
    expect(after).toMatchObject({
      name: "Kestrel Ridge summit hut",
      notes: "Cable car closed for repairs until Friday.",
    });
    await screenshot(page, "site-merged-1024x768");
    await page.context().close();
  });

  test("logistics deletes a site after confirming; it leaves the list", async () => {
    const page = await sitesPage("logistics");
    const before = await listedSiteNames(page);
    expect(before).toContain("Saltmere tide station");
    await openEdit(page, "Saltmere tide station");
    await page.getByRole("button", { name: "Delete site…" }).click();
    await page.getByRole("button", { name: "Yes, delete" }).click();
    await page.getByRole("heading", { name: "Sites", exact: true }).waitFor();
    await page.waitForFunction(() => !document.body.innerText.includes("Saltmere tide station"));
    const after = await listedSiteNames(page);
    expect(after).not.toContain("Saltmere tide station");
    expect(after).toHaveLength(before.length - 1);
    await page.context().close();
  });

  test("a field crew member may edit but is not offered delete", async () => {
    const page = await sitesPage("field");
    await openEdit(page, "Brennmoor reference laboratory");
    expect(await page.getByRole("button", { name: "Save changes" }).count()).toBe(1);
    expect(await page.getByRole("button", { name: "Delete site…" }).count()).toBe(0);
    await page.context().close();
  });
});
