// Sign-in as each demo role, the campaign picker, the site list, and what each role may see.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import type { Browser } from "playwright-core";
import { launchBrowser, screenshot, viewports, watchConsole } from "../helpers/browser";
import { startTestServer, type TestServer } from "../helpers/server";
import {
  demoCampaignName,
  demoEmail,
  demoRoles,
  demoSiteNames,
  expectSitesListed,
  openDemoSites,
  signIn,
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

describe("signing in", () => {
  test("a wrong password shows the server's message and stays on the sign-in page", async () => {
    const context = await browser.newContext({ viewport: viewports.tabletLandscape });
    const page = await context.newPage();
    await signIn(page, server.baseUrl, demoEmail("field"), "not-the-password");
    const alert = page.getByRole("alert");
    await alert.waitFor();
    expect(await alert.innerText()).toContain("E-mail or password is wrong");
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await screenshot(page, "sign-in-error-1024x768");
    await context.close();
  });

  test("the demo accounts note is shown because the server runs the demo", async () => {
    const context = await browser.newContext({ viewport: viewports.tabletPortrait });
    const page = await context.newPage();
    const problems = watchConsole(page);
    await page.goto(`${server.baseUrl}/sign-in`);
    const note = page.getByRole("region", { name: "Demo accounts" });
    await note.waitFor();
    expect(await note.innerText()).toContain("admin@demo.equipot.test");
    await screenshot(page, "sign-in-800x1280");
    expect(problems).toEqual([]);
    await context.close();
  });
});

describe.each(demoRoles)("as the %s demo account", (role) => {
  test("signs in, picks the demo campaign and sees its sites", async () => {
    const context = await browser.newContext({ viewport: viewports.tabletLandscape });
    const page = await context.newPage();
    const problems = watchConsole(page);
    await openDemoSites(page, server.baseUrl, role);
    await expectSitesListed(page, demoSiteNames);

    const addSite = page.getByRole("link", { name: "Add site" });
    expect(await addSite.count()).toBe(role === "reviewer" ? 0 : 1);
    const membersTab = page.getByRole("navigation", { name: "Campaign" }).getByRole("link", {
      name: "Members",
    });
    expect(await membersTab.count()).toBe(role === "admin" ? 1 : 0);
    await screenshot(page, `sites-${role}-1024x768`);
    expect(problems).toEqual([]);
    await context.close();
  });
});

describe("the campaign picker", () => {
  test("lists each of the person's campaigns with their role in it", async () => {
    const context = await browser.newContext({ viewport: viewports.tabletPortrait });
    const page = await context.newPage();
    await signIn(page, server.baseUrl, demoEmail("admin"));
    const list = page.getByRole("list", { name: "Your campaigns" });
    await list.getByRole("link", { name: new RegExp(demoCampaignName) }).waitFor();
    const cards = await list.getByRole("link").allInnerTexts();
    expect(cards.length).toBeGreaterThanOrEqual(2);
    for (const card of cards) expect(card).toContain("Your role: Administrator");
    await screenshot(page, "campaigns-admin-800x1280");
    await context.close();
  });
});

describe("on a phone", () => {
  test("the site list stacks to fit the width, edit buttons in reach", async () => {
    const context = await browser.newContext({ viewport: viewports.phone, hasTouch: true });
    const page = await context.newPage();
    await openDemoSites(page, server.baseUrl, "field");
    const overflow = await page.evaluate(
      () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
    );
    expect(overflow).toBeLessThanOrEqual(0);
    // Each site's edit button is on screen without scrolling sideways.
    const edit = await page.getByRole("link", { name: "Edit Kestrel Ridge hut" }).boundingBox();
    expect((edit?.x ?? Infinity) + (edit?.width ?? 0)).toBeLessThanOrEqual(viewports.phone.width);
    await screenshot(page, "sites-field-390x844");
    await context.close();
  });
});

describe("the members page", () => {
  test("an administrator sees the members and the invite form", async () => {
    const context = await browser.newContext({ viewport: viewports.tabletPortrait });
    const page = await context.newPage();
    await openDemoSites(page, server.baseUrl, "admin");
    await page.getByRole("link", { name: "Members" }).click();
    await page.getByRole("heading", { name: "Members", exact: true }).waitFor();
    const table = page.getByRole("table", { name: "Members of this campaign" });
    await table.getByRole("rowheader").first().waitFor();
    const text = await table.innerText();
    for (const role of demoRoles) expect(text).toContain(demoEmail(role));
    expect(await page.getByRole("button", { name: "Send invite" }).count()).toBe(1);
    await screenshot(page, "members-admin-800x1280");
    await context.close();
  });

  test("a field crew member does not get it, even by its address", async () => {
    const context = await browser.newContext({ viewport: viewports.tabletLandscape });
    const page = await context.newPage();
    await openDemoSites(page, server.baseUrl, "field");
    const membersUrl = page.url().replace(/\/sites$/, "/members");
    await page.goto(membersUrl);
    await page.getByText("Not available for your role").waitFor();
    expect(await page.getByRole("table", { name: "Members of this campaign" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Send invite" }).count()).toBe(0);
    await screenshot(page, "members-field-refused-1024x768");
    await context.close();
  });
});
