// The map and the crate labels work offline: the map draws the bundled outlines and the demo
// campaign's points (and lists them beside it), and a printed label's QR code scans back to its
// crate — read from a screenshot of the label by jsqr here, and by the app's own photo scanner.
import jsQR from "jsqr";
import { expect, test } from "vitest";
import type { Page } from "playwright-core";
import { screenshot, viewports } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import { demoSiteNames, pullDemoCampaign, readyForOffline, seriousViolations } from "./flows";

const tablet = tabletForFile(viewports.tabletLandscape);

/** RGBA of a PNG, decoded by the browser (no PNG decoder in the test process). */
async function pngToRgba(page: Page, png: Buffer) {
  const base64 = png.toString("base64");
  return page.evaluate(async (b64) => {
    const image = new Image();
    image.src = `data:image/png;base64,${b64}`;
    await image.decode();
    const canvas = document.createElement("canvas");
    canvas.width = image.naturalWidth;
    canvas.height = image.naturalHeight;
    const context = canvas.getContext("2d");
    if (context === null) throw new Error("no 2d context");
    context.drawImage(image, 0, 0);
    const data = context.getImageData(0, 0, canvas.width, canvas.height).data;
    return { width: canvas.width, height: canvas.height, data: Array.from(data) };
  }, base64);
}

test("the map draws offline from bundled data and lists the same points", async () => {
  const { page, server, profile } = tablet;
  await readyForOffline(page, server.baseUrl, "field");
  await page
    .getByRole("navigation", { name: "Campaign" })
    .getByRole("link", { name: "Map", exact: true })
    .click();
  // Online once, so the benchmarks are in the persisted query cache.
  await page.getByRole("list", { name: "Benchmarks" }).getByText("KR-BM-117").waitFor();

  await profile.context.setOffline(true);
  await page.reload();
  await page.getByRole("heading", { name: "Map", exact: true }).waitFor();
  const sites = page.getByRole("list", { name: "Sites" });
  await sites.getByText(demoSiteNames[0]).waitFor();
  const listed = await sites.getByRole("listitem").allInnerTexts();
  for (const name of demoSiteNames) expect(listed.join("\n")).toContain(name);
  await page.getByRole("list", { name: "Benchmarks" }).getByText("KR-BM-117").waitFor();
  await page.getByRole("list", { name: "Legend" }).getByText("Benchmark").waitFor();

  const map = page.getByTestId("campaign-map");
  await map.locator("canvas").waitFor();
  await page.locator('[data-testid="campaign-map"][data-map-loaded="true"]').waitFor();
  // Let the first frames render, then read the drawn pixels (the map keeps its drawing buffer).
  await page.waitForTimeout(500);
  const drawn = await page.evaluate(() => {
    const source = document.querySelector<HTMLCanvasElement>('[data-testid="campaign-map"] canvas');
    if (source === null) return null;
    const copy = document.createElement("canvas");
    copy.width = source.width;
    copy.height = source.height;
    const context = copy.getContext("2d");
    if (context === null) return null;
    context.drawImage(source, 0, 0);
    const { data } = context.getImageData(0, 0, copy.width, copy.height);
    const colours = new Set<number>();
    let sitePixels = 0;
    for (let i = 0; i < data.length; i += 4) {
      const r = data[i] ?? 0;
      const g = data[i + 1] ?? 0;
      const b = data[i + 2] ?? 0;
      colours.add((r << 16) | (g << 8) | b);
      // The site mark's colour, #12524E (map-legend.tsx), within antialiasing slack.
      if (Math.abs(r - 0x12) < 12 && Math.abs(g - 0x52) < 12 && Math.abs(b - 0x4e) < 12)
        sitePixels++;
    }
    return { distinct: colours.size, sitePixels, width: copy.width };
  });
  expect(drawn).not.toBeNull();
  expect(drawn?.width).toBeGreaterThan(0);
  // Water, land, coast and marks: a blank or single-colour canvas fails here.
  expect(drawn?.distinct).toBeGreaterThan(3);
  // Three sites, each a disc of radius 8 px: well over 100 pixels of the site colour.
  expect(drawn?.sitePixels).toBeGreaterThan(100);
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "map-offline");
});

test("a crate label's QR code scans back to KR-03, from a photo too", async () => {
  const { page, server } = tablet;
  // Still offline from the test above: the label page is built from the local store.
  const demo = await pullDemoCampaign(server.baseUrl, "reviewer");
  const crate = demo.changes.find((c) => c.entity === "crate" && c.data.label === "KR-03");
  expect(crate).toBeDefined();
  await page.goto(`${server.baseUrl}/campaigns/${demo.campaignId}/crates/${crate?.id}/label`);
  await page.getByRole("heading", { name: "Label for KR-03" }).waitFor();
  const label = page.getByRole("article", { name: "Label for crate KR-03" });
  await label.getByText("Ultra-stable optical cavity").waitFor();
  // 35 kg is above the 25 kg team-lift line (common practice), and the limits are printed.
  await label.getByText(/Team lift — 35 kg/).waitFor();
  expect(await label.innerText()).toMatch(/15 g[\s\S]*18 … 25 °C/);

  const png = await page.getByTestId("crate-qr").screenshot();
  const { width, height, data } = await pngToRgba(page, png);
  const decoded = jsQR(Uint8ClampedArray.from(data), width, height);
  expect(decoded?.data).toBe("equipot:crate:KR-03");

  // The page header holds no code: the scanner says so rather than guessing.
  const scanInput = page.getByLabel("Scan from a photo");
  await scanInput.setInputFiles({
    name: "header.png",
    mimeType: "image/png",
    buffer: await page.getByRole("heading", { name: "Label for KR-03" }).screenshot(),
  });
  await page.getByRole("alert").filter({ hasText: "No code found" }).waitFor();

  await scanInput.setInputFiles({ name: "label.png", mimeType: "image/png", buffer: png });
  await page.getByRole("status").filter({ hasText: "Read KR-03: this crate." }).waitFor();

  // Typed: another scheme is refused at the field, a bare label is accepted.
  const typed = page.getByLabel("Type the label");
  await typed.fill("equipot:site:KR-03");
  await page.getByRole("button", { name: "Use this label" }).click();
  await page.getByText("Label: this code is not an Equipot crate label").waitFor();
  await typed.fill("KR-01");
  await page.getByRole("button", { name: "Use this label" }).click();
  await page.getByRole("status").filter({ hasText: "Read KR-01: another crate" }).waitFor();

  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "crate-label");
});
