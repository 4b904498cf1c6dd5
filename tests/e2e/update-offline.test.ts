// A new version is deployed while a tablet is offline with a change not yet sent. The tablet
// still opens (its service worker serves the version it has), the change goes out once the
// connection is back, and the new version is offered, never forced, and runs after "Reload now".
// The deploy: the served folder's index.html changes and with it the worker's precache list.
import { readFileSync, rmSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { afterAll, beforeAll, expect, test } from "vitest";
import {
  launchProfile,
  screenshot,
  screenshotOnFailure,
  viewports,
  type Profile,
} from "../helpers/browser";
import { copyOfBuiltClient, startTestServer, type TestServer } from "../helpers/server";
import { editNotes, readyForOffline, serverSites, waitForSyncStatus } from "./flows";

let server: TestServer;
let profile: Profile;
let staticDir: string;

beforeAll(async () => {
  staticDir = copyOfBuiltClient();
  server = await startTestServer({ staticDir });
  profile = await launchProfile({ viewport: viewports.tabletPortrait });
});
screenshotOnFailure(() => profile?.context.pages()[0]);
afterAll(async () => {
  await profile?.close();
  await server?.stop();
  rmSync(staticDir, { recursive: true, force: true });
});

/** What a deploy changes: the page, and the worker that precaches it. */
function deployNewVersion(): void {
  const index = join(staticDir, "index.html");
  writeFileSync(index, readFileSync(index, "utf8").replace("</body>", "<!-- next --></body>"));
  const sw = join(staticDir, "sw.js");
  const text = readFileSync(sw, "utf8");
  const changed = text.replace(/(\{url:"index\.html",revision:")[0-9a-f]+"/, '$1next-version"');
  if (changed === text) throw new Error("sw.js has no index.html entry to change");
  writeFileSync(sw, changed);
}

test("deployed while offline with a change waiting: opens, sends it, then offers the new version", async () => {
  const page = profile.context.pages()[0] ?? (await profile.context.newPage());
  await readyForOffline(page, server.baseUrl, "field");

  await profile.context.setOffline(true);
  const notes = "Generator refuelled (across an update)";
  await editNotes(page, "Kestrel Ridge hut", notes);
  deployNewVersion();

  // Still offline: the app reopens from its worker, with the change kept on the device.
  await page.reload();
  await page.getByRole("heading", { name: "Sites", exact: true }).waitFor();
  await page.getByText(notes).first().waitFor();
  expect(await page.getByText("A new version of Equipot is ready.").count()).toBe(0);

  // Back online: the change is sent; the server has it.
  await profile.context.setOffline(false);
  await page.getByRole("button", { name: "Sync now" }).click();
  await waitForSyncStatus(page, "All changes sent", 30_000);
  const hut = (await serverSites(server.baseUrl, "geodesist")).find(
    (s) => s.name === "Kestrel Ridge hut",
  );
  expect(hut?.notes).toBe(notes);

  // The next visit finds the new worker, which waits until the person chooses to reload.
  await page.reload();
  const offer = page.getByText("A new version of Equipot is ready.");
  await offer.waitFor({ timeout: 30_000 });
  await screenshot(page, "update-offered");
  await page.getByRole("button", { name: "Reload now" }).click();
  await page.getByRole("heading", { name: "Sites", exact: true }).waitFor();
  await page.waitForFunction(() => document.documentElement.outerHTML.includes("<!-- next -->"));
  await page.getByText(notes).first().waitFor();
});
