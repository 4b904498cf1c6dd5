// axe checks on the main screens, in each theme: no serious or critical violations. Screenshots of
// each theme are kept to be looked at.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, screenshot, screenshotOnFailure, viewports } from "../helpers/browser";
import { startTestServer, type TestServer } from "../helpers/server";
import { openDemoSites, seriousViolations } from "./flows";

let server: TestServer;
let browser: Browser;
let page: Page;

beforeAll(async () => {
  server = await startTestServer();
  browser = await launchBrowser();
  // axe needs a page from an explicit context.
  const context = await browser.newContext({ viewport: viewports.tabletLandscape });
  page = await context.newPage();
});

screenshotOnFailure(() => page);

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

async function chooseLook(target: Page, label: string) {
  await target.getByRole("button", { name: "Settings" }).click();
  await target.getByRole("radio", { name: new RegExp(label) }).check();
  await target.keyboard.press("Escape");
}

const looks = [
  { label: "Paper", theme: "paper" },
  { label: "Dark", theme: "dark" },
  { label: "High contrast", theme: "contrast" },
] as const;

describe.each(looks)("in the $label look", ({ label, theme }) => {
  test("sign-in, sites, the site form and the field screens pass axe", async () => {
    await page.context().clearCookies();
    await page.goto(`${server.baseUrl}/sign-in`);
    await page.evaluate(() => localStorage.removeItem("equipot.session.v1"));
    await page.reload();
    await chooseLook(page, label);
    expect(await page.evaluate(() => document.documentElement.dataset.theme)).toBe(theme);
    await page.getByRole("region", { name: "Demo accounts" }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, `theme-${theme}-sign-in-1024x768`);

    await openDemoSites(page, server.baseUrl, "admin");
    // The choice is remembered across pages and reloads.
    expect(await page.evaluate(() => document.documentElement.dataset.theme)).toBe(theme);
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, `theme-${theme}-sites-1024x768`);

    await page.getByRole("link", { name: "Add site" }).click();
    await page.getByRole("button", { name: "Add site" }).click();
    await page.locator('[aria-invalid="true"]').first().waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, `theme-${theme}-site-form-1024x768`);

    const campaignUrl = page.url().replace(/\/sites\/new$/, "");
    await page.goto(`${campaignUrl}/conflicts`);
    await page.getByRole("heading", { name: "Kept for recovery" }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole("link", { name: "This device" }).click();
    await page.getByRole("heading", { name: "Storage" }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, `theme-${theme}-device-1024x768`);

    await page.goto(`${campaignUrl}/members`);
    await page.getByRole("table", { name: "Members of this campaign" }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);

    // The field screens, where sunlight makes the high-contrast look matter most.
    await page.goto(`${campaignUrl}/sites`);
    await page.getByRole("link", { name: "Kestrel Ridge hut", exact: true }).click();
    await page.getByRole("heading", { name: "Kestrel Ridge hut", level: 1 }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, `theme-${theme}-site-board-1024x768`);
    const board = page.url();
    await page.getByRole("link", { name: "Dew-point check" }).click();
    await page.getByRole("button", { name: "Save check" }).click();
    await page.locator('[aria-invalid="true"]').first().waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.goto(`${board}/levelling`);
    await page.getByRole("heading", { name: /^Levelling at/ }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.goto(`${board}/temperatures`);
    await page.getByRole("heading", { name: "Temperatures", level: 1 }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.getByRole("heading", { name: "Sign in" }).waitFor();
  });
});

test("every button and link on the sites screen and the site board is at least 48 px tall", async () => {
  await page.setViewportSize(viewports.tabletPortrait);
  await openDemoSites(page, server.baseUrl, "admin");
  expect(await smallTargets(page)).toEqual([]);
  await page.getByRole("link", { name: "Kestrel Ridge hut", exact: true }).click();
  await page.getByRole("heading", { name: "Kestrel Ridge hut", level: 1 }).waitFor();
  expect(await smallTargets(page)).toEqual([]);
});

/** Buttons, links and inputs smaller than 48 × 48 px, by their text and size. */
function smallTargets(page: Page) {
  return page.evaluate(() =>
    [
      ...document.querySelectorAll(
        "main a, main button, header a, header button, section[aria-label=Sync] a, section[aria-label=Sync] button, input, select",
      ),
    ]
      .map((element) => ({
        name: element.textContent?.trim() ?? "",
        box: element.getBoundingClientRect(),
      }))
      .filter(({ box }) => box.height < 47.5 || box.width < 47.5)
      .map(({ name, box }) => `${name} ${Math.round(box.width)}×${Math.round(box.height)}`),
  );
}
