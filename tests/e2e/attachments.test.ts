// A photo taken offline on the tablet: kept, shown, made smaller, sent with the next sync with its
// upload progress, and seen on another device. A shared tablet's data can be removed.
import { createHash } from "node:crypto";
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
import { openDemoSites, pullDemoCampaign, readyForOffline, waitForSyncStatus } from "./flows";

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

const caption = "Plinth bolt B after the night frost";

/** A 3000 × 2000 PNG drawn by Chromium itself, like a camera's large picture. */
async function largePicture(page: Page): Promise<Buffer> {
  const dataUrl = await page.evaluate(() => {
    const canvas = document.createElement("canvas");
    canvas.width = 3000;
    canvas.height = 2000;
    const g = canvas.getContext("2d");
    if (!g) throw new Error("no canvas");
    const gradient = g.createLinearGradient(0, 0, 3000, 2000);
    gradient.addColorStop(0, "#2b5d7d");
    gradient.addColorStop(1, "#d9c27a");
    g.fillStyle = gradient;
    g.fillRect(0, 0, 3000, 2000);
    g.fillStyle = "#ffffff";
    g.font = "200px sans-serif";
    g.fillText("B-07", 1100, 1100);
    return canvas.toDataURL("image/png");
  });
  return Buffer.from(dataUrl.split(",")[1] ?? "", "base64");
}

async function openSite(page: Page, name: string) {
  await page.getByRole("link", { name: `Edit ${name}` }).click();
  await page.getByRole("heading", { name: `Edit ${name}` }).waitFor();
}

const photoList = (page: Page, site: string) =>
  page.getByRole("list", { name: `Photos and files of ${site}` });

test("a photo taken offline is kept, sent with progress when online, and seen on another device", async () => {
  const page = profile.context.pages()[0] ?? (await profile.context.newPage());
  current = page;
  await readyForOffline(page, server.baseUrl, "field");
  const picture = await largePicture(page);

  await profile.context.setOffline(true);
  await openSite(page, "Kestrel Ridge hut");
  await page.getByLabel("Caption for the next photo or file").fill(caption);
  const camera = page.locator('input[type="file"][capture="environment"]');
  expect(await camera.getAttribute("accept")).toBe("image/*");
  await camera.setInputFiles({ name: "IMG_2207.png", mimeType: "image/png", buffer: picture });
  await page.getByText("on this device now").waitFor();
  const item = photoList(page, "Kestrel Ridge hut").getByRole("listitem");
  await item.getByText(caption).waitFor();
  await item.getByText("Not yet sent").waitFor();
  await waitForSyncStatus(page, "1 change and 1 photo or file not yet sent");
  // Made smaller on the tablet: the longest side is 2048 px, kept as JPEG.
  const image = item.getByRole("img", { name: caption });
  await expect
    .poll(() => image.evaluate((img: HTMLImageElement) => [img.naturalWidth, img.naturalHeight]))
    .toEqual([2048, 1365]);
  expect(await item.innerText()).toContain("IMG_2207.jpg");
  await screenshot(page, "attachments-offline-1024x768");

  // A reload while offline shows the photo from this device's store.
  await page.reload();
  await page.getByRole("heading", { name: "Edit Kestrel Ridge hut" }).waitFor();
  await photoList(page, "Kestrel Ridge hut").getByRole("img", { name: caption }).waitFor();
  await waitForSyncStatus(page, "1 change and 1 photo or file not yet sent");

  // Online again: the upload shows its progress, then the photo is on the server.
  const progressSeen = page
    .getByRole("region", { name: "Sync" })
    .getByText(/Sending photos and files/)
    .waitFor({ timeout: 30_000 })
    .then(() => true);
  await page.route("**/attachments/*", async (route) => {
    // Slow the PUT a little so the progress can be seen.
    if (route.request().method() === "PUT") await new Promise((r) => setTimeout(r, 800));
    await route.continue();
  });
  await profile.context.setOffline(false);
  expect(await progressSeen).toBe(true);
  await waitForSyncStatus(page, "All changes sent", 30_000);
  await photoList(page, "Kestrel Ridge hut").getByText("On the server").waitFor();
  await page.unroute("**/attachments/*");

  // The server has the link and the same bytes, decided to be a JPEG from the content.
  const pulled = await pullDemoCampaign(server.baseUrl, "logistics");
  const { campaignId } = pulled;
  const auth = { authorization: `Bearer ${pulled.token}` };
  const link = pulled.changes.find((c) => c.entity === "attachment");
  expect(link?.data).toMatchObject({ caption, contentType: "image/jpeg", name: "IMG_2207.jpg" });
  const sha = link?.entity === "attachment" ? link.data.sha256 : "";
  const bytes = await fetch(`${server.baseUrl}/api/campaigns/${campaignId}/attachments/${sha}`, {
    headers: auth,
  });
  expect(bytes.headers.get("content-type")).toBe("image/jpeg");
  expect(bytes.headers.get("x-content-type-options")).toBe("nosniff");
  const body = Buffer.from(await bytes.arrayBuffer());
  expect(createHash("sha256").update(body).digest("hex")).toBe(sha);
  expect(body.length).toBeLessThan(picture.length);

  // A colleague's tablet fetches the photo from the server and shows it.
  const other = await browser.newContext({ viewport: viewports.tabletLandscape });
  const otherPage = await other.newPage();
  current = otherPage;
  await openDemoSites(otherPage, server.baseUrl, "geodesist");
  await openSite(otherPage, "Kestrel Ridge hut");
  const seen = photoList(otherPage, "Kestrel Ridge hut").getByRole("img", { name: caption });
  await expect.poll(() => seen.evaluate((img: HTMLImageElement) => img.naturalWidth)).toBe(2048);
  await screenshot(otherPage, "attachments-other-device-1024x768");
  await other.close();
  current = undefined;
});

test("a person removes their data from a shared tablet and is signed out", async () => {
  const context = await browser.newContext({ viewport: viewports.tabletLandscape });
  const page = await context.newPage();
  current = page;
  await openDemoSites(page, server.baseUrl, "reviewer");
  await waitForSyncStatus(page, "All changes sent");
  const names = () =>
    page.evaluate(async () => (await indexedDB.databases()).map((d) => d.name ?? ""));
  expect((await names()).some((n) => n.startsWith("equipot-"))).toBe(true);

  await page.getByRole("link", { name: "This device" }).click();
  await page.getByRole("button", { name: "Remove my data…" }).click();
  await screenshot(page, "device-remove-data-1024x768");
  await page.getByRole("button", { name: "Yes, remove and sign out" }).click();
  await page.getByRole("heading", { name: "Sign in" }).waitFor();
  expect((await names()).some((n) => n.startsWith("equipot-"))).toBe(false);
  await context.close();
  current = undefined;
});
