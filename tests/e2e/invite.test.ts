// An administrator invites a new crew member; the invite link from the e-mail lets them join.
import { afterAll, beforeAll, expect, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import {
  launchBrowser,
  screenshot,
  screenshotOnFailure,
  viewports,
  watchConsole,
} from "../helpers/browser";
import { startTestServer, type TestServer } from "../helpers/server";
import {
  demoCampaignName,
  demoSiteNames,
  expectSitesListed,
  fieldError,
  openDemoSites,
} from "./flows";

let server: TestServer;
let browser: Browser;
let page: Page | undefined;

beforeAll(async () => {
  server = await startTestServer();
  browser = await launchBrowser();
});

screenshotOnFailure(() => page);

afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const newcomer = "ada.brightwater@demo.equipot.test";

test("an invite sent from the members page is accepted at /invite/:token", async () => {
  const adminContext = await browser.newContext({ viewport: viewports.tabletLandscape });
  page = await adminContext.newPage();
  await openDemoSites(page, server.baseUrl, "admin");
  await page.getByRole("link", { name: "Members" }).click();
  await page.getByLabel("E-mail").fill(newcomer);
  await page.getByLabel("Role").selectOption("logistics");
  await page.getByRole("button", { name: "Send invite" }).click();
  const sent = page.getByRole("alert").filter({ hasText: "Invite sent" });
  await sent.waitFor();
  expect(await sent.innerText()).toContain(`${newcomer} is invited as Logistics`);

  const mail = await server.mail.waitFor((m) => m.to.includes(newcomer), 10_000);
  const token = /\/invite\/([\w-]+)/.exec(mail.text)?.[1];
  expect(token, "the e-mail carries an invite link").toBeDefined();
  await adminContext.close();

  const guestContext = await browser.newContext({ viewport: viewports.tabletPortrait });
  page = await guestContext.newPage();
  const problems = watchConsole(page);
  await page.goto(`${server.baseUrl}/invite/${token ?? ""}`);
  await page.getByRole("heading", { name: "Join a campaign" }).waitFor();
  await page.getByLabel("Your name").fill("Ada Brightwater");
  await page.getByLabel("New password").fill("short");
  await page.getByLabel("Repeat the password").fill("different");
  await page.getByRole("button", { name: "Join the campaign" }).click();
  await page.locator('[aria-invalid="true"]').first().waitFor();
  expect(await fieldError(page, "New password")).toBe("Password must be at least 10 characters");
  expect(await fieldError(page, "Repeat the password")).toBe("The two passwords differ");
  await screenshot(page, "invite-errors-800x1280");

  await page.getByLabel("New password").fill("saltmere-tide-2027");
  await page.getByLabel("Repeat the password").fill("saltmere-tide-2027");
  await page.getByRole("button", { name: "Join the campaign" }).click();
  await page.getByRole("heading", { name: "Choose a campaign" }).waitFor();
  const card = page.getByRole("link", { name: new RegExp(demoCampaignName) });
  expect(await card.innerText()).toContain("Logistics");
  await card.click();
  await expectSitesListed(page, demoSiteNames);
  expect(await page.getByText("Ada Brightwater").count()).toBeGreaterThan(0);
  expect(problems).toEqual([]);
  await guestContext.close();
  page = undefined;
});
