// The geodesist's comparison run: create it, preview and upload a series file, see the analysis
// and the height result, then a second file continuing in time changes the time left. A malformed
// file is refused with its line numbers.
import { mkdtemp, readFile, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { randomUUID } from "node:crypto";
import { expect, test } from "vitest";
import { screenshot, viewports, watchConsole } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import { apiCall, apiSignIn, demoCampaignName, openDemoSites, seriousViolations } from "./flows";

const tablet = tabletForFile(viewports.tabletLandscape);

/** mulberry32, a small seeded PRNG, so the series is the same on every run. */
function prng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** White FM at 1 s: σ_y(1 s) = 1e-15 around a mean of 1e-16 (≈ 1 mm of height); Box–Muller. */
function whiteFmCsv(startUnixS: number, count: number, seed: number): string {
  const next = prng(seed);
  const lines = ["time,value"];
  for (let i = 0; i < count; i++) {
    const g = Math.sqrt(-2 * Math.log(1 - next())) * Math.cos(2 * Math.PI * next());
    lines.push(
      `${new Date((startUnixS + i) * 1000).toISOString()},${(1e-16 + 1e-15 * g).toExponential(6)}`,
    );
  }
  return lines.join("\n") + "\n";
}

test("a run is created, a series previewed and uploaded, and a second file moves the date", async () => {
  const { page, server } = tablet;
  const problems = watchConsole(page);
  const session = await apiSignIn(server.baseUrl, "geodesist");
  const campaignId =
    session.memberships.find((m) => m.campaignName === demoCampaignName)?.campaignId ?? "";
  // The test's seed may hold no instruments yet: two clocks through the API.
  for (const name of ["Strontium lattice clock S1", "Transportable ytterbium clock Y2"]) {
    const made = await apiCall(
      server.baseUrl,
      session.accessToken,
      "POST",
      `/campaigns/${campaignId}/instruments`,
      {
        id: randomUUID(),
        instrument: {
          kind: "clock",
          name,
          instabilityAt1s: 1e-15,
          // 2e-19 ≈ 1.8 mm of height per clock: the 5 mm target is reachable with time.
          systematic: [{ name: "total", value: 2e-19 }],
        },
      },
    );
    expect(made.status).toBe(201);
  }
  const dir = await mkdtemp(join(tmpdir(), "equipot-h4-"));
  const first = join(dir, "kestrel-week1.csv");
  const second = join(dir, "kestrel-week2.csv");
  const broken = join(dir, "kestrel-broken.csv");
  const start = Date.UTC(2027, 6, 1) / 1000;
  await writeFile(first, whiteFmCsv(start, 20_000, 7));
  await writeFile(second, whiteFmCsv(start + 20_000, 20_000, 11));
  await writeFile(
    broken,
    "time,value\n2027-07-01T00:00:00Z,1e-16\nnot a time,2e-16\n2027-07-01T00:00:02Z,abc\n",
  );

  await openDemoSites(page, server.baseUrl, "geodesist");
  await page.goto(`${server.baseUrl}/campaigns/${campaignId}/heights`);
  await page.getByRole("heading", { name: "Heights", level: 1 }).waitFor();
  expect(await seriousViolations(page)).toEqual([]);
  await page.getByRole("link", { name: "New run" }).click();
  await page.getByLabel("Name", { exact: true }).fill("Kestrel Ridge against Brennmoor");
  await page.getByLabel("Link name").fill("Fibre link through the valley");
  await page.getByLabel("Remote site").selectOption({ label: "Kestrel Ridge hut" });
  await page.getByLabel("Remote clock").selectOption({ label: "Transportable ytterbium clock Y2" });
  await page.getByLabel("Reference clock").selectOption({ label: "Strontium lattice clock S1" });
  await page.getByLabel("Target height uncertainty").fill("5");
  await page.getByLabel("Planned uptime").fill("80");
  await page.getByRole("button", { name: "Save run" }).click();
  await page.getByRole("heading", { name: "Kestrel Ridge against Brennmoor", level: 1 }).waitFor();

  // Preview before sending, then upload with progress, then the analysis.
  await page.getByLabel("Series file", { exact: true }).setInputFiles(first);
  const preview = page.getByTestId("preview");
  await preview.getByText("20,000 rows, 20,000 valid").waitFor({ timeout: 30_000 });
  await preview.getByTestId("preview-adev-chart").locator("canvas").waitFor();
  await page.getByRole("button", { name: "Upload" }).click();
  await page.getByText("Uploaded").waitFor({ timeout: 60_000 });
  await page.getByTestId("adev-chart").locator("canvas").waitFor({ timeout: 60_000 });
  await page.getByTestId("height-difference").waitFor();
  const eta = page.getByTestId("expected-date");
  await eta.waitFor();
  const firstEta = await eta.textContent();
  expect(problems).toEqual([]);
  // The result leaves Equipot with the caution on its first line.
  const download = page.waitForEvent("download");
  await page.getByRole("button", { name: "Download result (CSV)" }).click();
  const saved = await (await download).path();
  const exported = await readFile(saved, "utf8");
  expect(exported.split("\n")[0]).toBe(
    "# These are campaign results, not official heights. Official heights come from the national survey authority.",
  );
  expect(exported).toContain("height difference (clocks)");
  await screenshot(page, "h4-run-page");
  expect(await seriousViolations(page)).toEqual([]);

  // The second week continues in time: more averaging, so less left and an earlier date.
  await page.getByLabel("Series file", { exact: true }).setInputFiles(second);
  await preview.getByText("20,000 rows, 20,000 valid").waitFor({ timeout: 30_000 });
  await page.getByRole("button", { name: "Upload" }).click();
  await page.getByText("Uploaded").waitFor({ timeout: 60_000 });
  await expect.poll(() => eta.textContent(), { timeout: 60_000 }).not.toBe(firstEta);

  // A malformed file: its bad lines by number, nothing stored.
  await page.getByLabel("Series file", { exact: true }).setInputFiles(broken);
  await preview.getByText(/Line 3/).waitFor({ timeout: 30_000 });
  await page.getByRole("button", { name: "Upload" }).click();
  await page.getByText("File refused; nothing was stored").waitFor();
  await page
    .getByRole("list", { name: "Bad rows" })
    .last()
    .getByText(/Line 4/)
    .waitFor();
  expect(await page.getByRole("list", { name: "Series files" }).getByRole("listitem").count()).toBe(
    2,
  );

  // The field crew's site board shows the time left, and still does offline after a reload.
  const sites = await apiCall(
    server.baseUrl,
    session.accessToken,
    "GET",
    `/campaigns/${campaignId}/sites`,
  );
  const hut = (sites.json as { sites: { id: string; name: string }[] }).sites.find(
    (x) => x.name === "Kestrel Ridge hut",
  );
  const boardEta = (await eta.textContent()) ?? "";
  await page.goto(`${server.baseUrl}/campaigns/${campaignId}/sites/${hut?.id ?? ""}`);
  const card = page.getByTestId("time-left-card");
  await card.getByText("Kestrel Ridge against Brennmoor · target 5.0 mm").waitFor();
  await card.getByText(boardEta.split(" (")[0] ?? "").waitFor();
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
  // No waiting for the throttled cache save: leaving the page must write what was just read.
  await tablet.profile.context.setOffline(true);
  await page.reload();
  await card.getByText(/Offline: last seen online at/).waitFor();
  await card.getByText("Kestrel Ridge against Brennmoor · target 5.0 mm").waitFor();
  await screenshot(page, "h4-site-board-offline");
  await tablet.profile.context.setOffline(false);
});
