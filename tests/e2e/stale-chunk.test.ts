// A page's code that the server no longer has (as after an update removed the old version's
// files): Chromium's failed import makes the tab reload once, and when the file is still missing
// the error page says so instead of reloading again. Service workers are blocked here, so the
// request reaches the server (with a worker, the old files would still be served from its cache).
import { readdirSync, rmSync } from "node:fs";
import { join } from "node:path";
import { afterAll, beforeAll, expect, test } from "vitest";
import { launchProfile, screenshotOnFailure, viewports, type Profile } from "../helpers/browser";
import { copyOfBuiltClient, startTestServer, type TestServer } from "../helpers/server";
import { openDemoSites } from "./flows";

let server: TestServer;
let profile: Profile;
let staticDir: string;

beforeAll(async () => {
  staticDir = copyOfBuiltClient();
  // The map page's chunk is gone, as if a newer version had replaced it.
  const assets = join(staticDir, "assets");
  const mapChunk = readdirSync(assets).find((f) => /^map-route-.*\.js$/.test(f));
  if (!mapChunk) throw new Error("the build has no map-route chunk");
  rmSync(join(assets, mapChunk));
  server = await startTestServer({ staticDir });
  profile = await launchProfile({ viewport: viewports.tabletLandscape, serviceWorkers: "block" });
});
screenshotOnFailure(() => profile?.context.pages()[0]);
afterAll(async () => {
  await profile?.close();
  await server?.stop();
  rmSync(staticDir, { recursive: true, force: true });
});

test("a missing page chunk reloads the tab once, then shows the error", async () => {
  const page = profile.context.pages()[0] ?? (await profile.context.newPage());
  await openDemoSites(page, server.baseUrl, "field");
  let loads = 0;
  page.on("load", () => loads++);
  await page
    .getByRole("navigation", { name: "Campaign" })
    .getByRole("link", { name: "Map" })
    .click();
  await page.getByRole("heading", { name: "Something went wrong" }).waitFor({ timeout: 20_000 });
  await page.getByText(/Failed to fetch dynamically imported module/).waitFor();
  // Exactly one reload: the second failure is shown, not reloaded.
  await page.waitForTimeout(1500);
  expect(loads).toBe(1);
});
