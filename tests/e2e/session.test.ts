// Two tabs of one person open at the same moment: each renews its access token with the shared
// refresh cookie. The server rotates that cookie strictly (a reused one ends the session), so the
// tabs must take turns; both stay signed in.
import { afterAll, beforeAll, expect, test } from "vitest";
import type { Browser, BrowserContext } from "playwright-core";
import { launchBrowser, screenshotOnFailure, viewports } from "../helpers/browser";
import { startTestServer, type TestServer } from "../helpers/server";
import { openDemoSites, waitForSyncStatus } from "./flows";

let server: TestServer;
let browser: Browser;
let context: BrowserContext | undefined;

beforeAll(async () => {
  server = await startTestServer();
  browser = await launchBrowser();
});

screenshotOnFailure(() => context?.pages()[1]);

afterAll(async () => {
  await context?.close();
  await browser?.close();
  await server?.stop();
});

test("two tabs renewing the session at once both stay signed in", async () => {
  context = await browser.newContext({ viewport: viewports.tabletLandscape });
  const first = await context.newPage();
  await openDemoSites(first, server.baseUrl, "field");
  const second = await context.newPage();
  await second.goto(first.url());
  await second.getByRole("heading", { name: "Sites", exact: true }).waitFor();

  let refreshes = 0;
  await context.route("**/api/auth/refresh", async (route) => {
    refreshes += 1;
    await route.continue();
  });
  for (let round = 0; round < 3; round += 1) {
    // A reload forgets the in-memory access token: both tabs renew it at the same moment. Each
    // round waits for both renewals (pages load lazily, so a heading can show before the renewal).
    const renewed = (page: typeof first) =>
      page.waitForResponse((r) => r.url().endsWith("/api/auth/refresh"), { timeout: 20_000 });
    await Promise.all([renewed(first), renewed(second), first.reload(), second.reload()]);
    for (const page of [first, second]) {
      await page.getByRole("heading", { name: "Sites", exact: true }).waitFor();
      await waitForSyncStatus(page, "All changes sent");
    }
  }
  expect(refreshes).toBeGreaterThanOrEqual(6);
  for (const page of [first, second]) {
    expect(await page.getByRole("button", { name: "Sign out" }).count()).toBe(1);
    const me = await page.evaluate(async () => {
      const res = await fetch("/api/auth/refresh", {
        method: "POST",
        headers: { "x-equipot-request": "1" },
      });
      return res.status;
    });
    expect(me).toBe(200);
  }
});
