// The geodesist's benchmarks and instruments on a tablet: a bad benchmark file is refused by line
// with nothing added, a good one imported; a clock with two systematic terms is added, edited,
// and its history shows both revisions. The field crew reads the same pages without edit controls.
import { randomUUID } from "node:crypto";
import { fileURLToPath } from "node:url";
import { expect, test } from "vitest";
import type { Page } from "playwright-core";
import { launchProfile, screenshot, viewports, watchConsole } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import {
  apiCall,
  apiSignIn,
  demoCampaignName,
  fieldError,
  openDemoSites,
  seriousViolations,
} from "./flows";

const tablet = tabletForFile(viewports.tabletLandscape);
const fixture = (name: string) =>
  fileURLToPath(new URL(`../fixtures/geodesy/${name}`, import.meta.url));

async function demoCampaignId(baseUrl: string): Promise<string> {
  const session = await apiSignIn(baseUrl, "geodesist");
  return session.memberships.find((m) => m.campaignName === demoCampaignName)?.campaignId ?? "";
}

const benchmarkRows = (page: Page) =>
  page.getByRole("table", { name: "Benchmarks of this campaign" }).locator("tbody tr");

async function importBenchmarks(page: Page, baseUrl: string) {
  const before = await benchmarkRows(page).count();
  await page.getByLabel("Benchmark file").setInputFiles(fixture("benchmarks-bad.csv"));
  await page.getByRole("button", { name: "Import", exact: true }).click();
  await page.getByText("File refused").waitFor();
  const problems = page.getByRole("list", { name: "Problems by line" });
  expect(await problems.getByRole("listitem").allInnerTexts()).toEqual([
    "Line 3, latitude_deg: Latitude must be between -90 and 90 °",
    "Line 4, height_m: Height must be a number",
  ]);
  // Nothing from the refused file: its good first row is not there either.
  expect(await benchmarkRows(page).count()).toBe(before);
  expect(await page.getByRole("rowheader", { name: /KR-BM-201/ }).count()).toBe(0);

  await page.getByLabel("Benchmark file").setInputFiles(fixture("benchmarks-good.csv"));
  await page.getByRole("button", { name: "Import", exact: true }).click();
  await page.getByText("3 benchmarks added.").waitFor();
  await page.getByRole("rowheader", { name: /KR-BM-203/ }).waitFor();
  expect(await benchmarkRows(page).count()).toBe(before + 3);
  const row = benchmarkRows(page).filter({ hasText: "KR-BM-203" });
  expect(await row.innerText()).toMatch(/2862\.0735 m\s+± 3\.0 mm/);
  expect(await row.innerText()).toContain("47.08301° N");
  // The same list the server has.
  const session = await apiSignIn(baseUrl, "geodesist");
  const campaignId = await demoCampaignId(baseUrl);
  const listed = await apiCall(
    baseUrl,
    session.accessToken,
    "GET",
    `/campaigns/${campaignId}/benchmarks`,
  );
  expect((listed.json as { benchmarks: unknown[] }).benchmarks).toHaveLength(before + 3);
}

async function addAndDeleteBenchmark(page: Page) {
  await page.getByRole("button", { name: "Add benchmark" }).click();
  const form = page.getByRole("form", { name: "New benchmark" });
  await form.getByLabel("Code").fill("KR-BM-299");
  await form.getByLabel("Latitude").fill("95");
  await form.getByLabel("Longitude").fill("11,2301");
  await form.getByLabel("Published height").fill("2870,5");
  await form.getByLabel("Height uncertainty (1σ)").fill("1,5");
  // The height system and datum come from the campaign's other benchmarks.
  expect(await form.getByLabel("Height system").inputValue()).toBe("Normal heights");
  await form.getByRole("button", { name: "Add benchmark" }).click();
  await form.getByText("Latitude must be between -90 and 90 °").waitFor();
  expect(await fieldError(page, "Latitude")).toBe("Latitude must be between -90 and 90 °");
  await screenshot(page, "benchmark-form");
  await form.getByLabel("Latitude").fill("47,0851");
  await form.getByRole("button", { name: "Add benchmark" }).click();
  await page.getByText("Benchmark KR-BM-299 saved.").waitFor();
  const row = benchmarkRows(page).filter({ hasText: "KR-BM-299" });
  expect(await row.innerText()).toMatch(/2870\.500 m\s+± 1\.5 mm/);

  await page.getByRole("button", { name: "Edit KR-BM-299" }).click();
  await page.getByRole("button", { name: "Delete benchmark…" }).click();
  await page.getByRole("button", { name: "Yes, delete" }).click();
  await page.getByText("Benchmark KR-BM-299 deleted.").waitFor();
  expect(await benchmarkRows(page).filter({ hasText: "KR-BM-299" }).count()).toBe(0);
}

async function addClock(page: Page) {
  await page.getByRole("button", { name: "Add instrument" }).click();
  const form = page.getByRole("form", { name: "New clock or link" });
  await form.getByLabel("Kind").selectOption("clock");
  await form.getByLabel("Name", { exact: true }).fill("Kestrel transportable clock");
  await form.getByLabel("Instability at 1 s").fill("1e15");
  await form.getByLabel("Term 1 name").fill("blackbody radiation");
  await form.getByLabel("Term 1 value").fill("1,2e-18");
  await form.getByRole("button", { name: "Add term" }).click();
  await form.getByLabel("Term 2 name").fill("lattice light shift");
  await form.getByLabel("Term 2 value").fill("5e-19");
  await form.getByText("Combined in quadrature: 1.3 × 10⁻¹⁸").waitFor();
  await screenshot(page, "instrument-form");
  await form.getByRole("button", { name: "Add instrument" }).click();
  await form.getByText("Instability at 1 s must be between 1e-19 and 1e-11").waitFor();
  // Accepted but unusual: a warning, not a refusal.
  await form.getByLabel("Instability at 1 s").fill("1e-12");
  await form.getByText("Unusual values").waitFor();
  await form.getByLabel("Instability at 1 s").fill("1e-15");
  expect(await form.getByText("Unusual values").count()).toBe(0);
  await form.getByRole("button", { name: "Add instrument" }).click();
  await page.getByRole("heading", { name: "Kestrel transportable clock", level: 1 }).waitFor();
  const terms = page.getByRole("table", { name: "Systematic uncertainty terms" });
  expect(await terms.getByRole("row").allInnerTexts()).toEqual([
    expect.stringContaining("Term"),
    "blackbody radiation\t1.2 × 10⁻¹⁸",
    "lattice light shift\t5 × 10⁻¹⁹",
    "Total in quadrature\t1.3 × 10⁻¹⁸",
  ]);
}

async function editClock(page: Page) {
  await page.getByRole("button", { name: "Edit instrument" }).click();
  const form = page.getByRole("form", { name: "Edit Kestrel transportable clock" });
  expect(await form.getByLabel("Term 2 value").inputValue()).toBe("5e-19");
  await form.getByLabel("Instability at 1 s").fill("8e-16");
  await form.getByRole("button", { name: "Save changes" }).click();
  await page.getByText("Kestrel transportable clock saved as version 2.").waitFor();
  const revisions = page.getByRole("list", { name: "Revisions" });
  await revisions.getByText("Changed · version 2").waitFor();
  expect(await revisions.locator(":scope > li").count()).toBe(2);
  const changed = revisions.getByRole("list", { name: "What changed" });
  expect(await changed.getByRole("listitem").allInnerTexts()).toEqual([
    "Instability at 1 s: 1 × 10⁻¹⁵ → 8 × 10⁻¹⁶",
  ]);
  await revisions.getByText("Created · version 1").waitFor();
  expect(await revisions.innerText()).toContain("by Ines Varodi");
}

/** Someone else saves while the form is open: the edit is refused and restarts from their version. */
async function editStale(page: Page, baseUrl: string, campaignId: string) {
  const instrumentId = new URL(page.url()).pathname.split("/").pop() ?? "";
  await page.getByRole("button", { name: "Edit instrument" }).click();
  const form = page.getByRole("form", { name: "Edit Kestrel transportable clock" });
  const other = await apiSignIn(baseUrl, "admin");
  const path = `/campaigns/${campaignId}/instruments/${instrumentId}`;
  const current = (await apiCall(baseUrl, other.accessToken, "GET", path)).json as {
    instrument: { version: number; kind: string; name: string; instabilityAt1s: number };
  };
  const put = await apiCall(baseUrl, other.accessToken, "PUT", path, {
    baseVersion: current.instrument.version,
    instrument: {
      kind: current.instrument.kind,
      name: current.instrument.name,
      instabilityAt1s: current.instrument.instabilityAt1s,
      notes: "Moved to optical table 3",
    },
  });
  expect(put.status).toBe(200);
  await form.getByLabel("Instability at 1 s").fill("7e-16");
  await form.getByRole("button", { name: "Save changes" }).click();
  await form.getByText(/was changed by someone else/).waitFor();
  await form.getByRole("button", { name: "Load the current version" }).click();
  // The form opens again on the stored version, with the other person's change in it.
  await expect
    .poll(() => form.getByLabel("Notes (optional)").inputValue())
    .toBe("Moved to optical table 3");
  expect(await form.getByLabel("Instability at 1 s").inputValue()).toBe("8e-16");
  // Their edit removed the systematic terms; the form shows that too.
  expect(await form.getByLabel("Term 1 name").count()).toBe(0);
  await form.getByRole("button", { name: "Cancel" }).click();
  await page.getByRole("list", { name: "Revisions" }).getByText("Changed · version 3").waitFor();
}

test("benchmarks are imported and edited, a clock added and edited with its history", async () => {
  const { page, server } = tablet;
  const problems = watchConsole(page);
  const campaignId = await demoCampaignId(server.baseUrl);
  await openDemoSites(page, server.baseUrl, "geodesist");
  await page.goto(`${server.baseUrl}/campaigns/${campaignId}/heights`);
  await page
    .getByRole("navigation", { name: "Height links" })
    .getByRole("link", { name: "Benchmarks" })
    .click();
  await page.getByRole("heading", { name: "Benchmarks", level: 1 }).waitFor();
  await page.getByText("These are campaign results, not official heights.").waitFor();
  await page.getByRole("rowheader", { name: /KR-BM-117/ }).waitFor();

  await importBenchmarks(page, server.baseUrl);
  await addAndDeleteBenchmark(page);
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "benchmarks");

  await page.goto(`${server.baseUrl}/campaigns/${campaignId}/heights`);
  await page
    .getByRole("navigation", { name: "Height links" })
    .getByRole("link", { name: "Instruments" })
    .click();
  await page.getByRole("heading", { name: "Instruments", level: 1 }).waitFor();
  await addClock(page);
  await editClock(page);
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "instrument");
  await editStale(page, server.baseUrl, campaignId);

  await page.getByRole("link", { name: "All instruments" }).click();
  const row = page
    .getByRole("table", { name: "Clocks and links of this campaign" })
    .getByRole("row")
    .filter({ hasText: "Kestrel transportable clock" });
  // The other person's version 3 (no terms) arrives with the list's refetch.
  await expect.poll(() => row.innerText()).toMatch(/Clock\s+8 × 10⁻¹⁶\s+0\s+0 terms/);
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "instruments");
  // The refused file and the stale edit are the errors the browser may log.
  expect(problems.filter((p) => !/status of (422|409)/.test(p))).toEqual([]);
});

test("the field crew reads benchmarks and instruments without edit controls", async () => {
  const { server } = tablet;
  const session = await apiSignIn(server.baseUrl, "geodesist");
  const campaignId = await demoCampaignId(server.baseUrl);
  const id = randomUUID();
  const made = await apiCall(
    server.baseUrl,
    session.accessToken,
    "POST",
    `/campaigns/${campaignId}/instruments`,
    {
      id,
      instrument: { kind: "link", name: "Ridge fibre link", instabilityAt1s: 3e-17 },
    },
  );
  expect(made.status).toBe(201);

  const crew = await launchProfile({ viewport: viewports.tabletPortrait });
  try {
    const page = crew.context.pages()[0] ?? (await crew.context.newPage());
    const problems = watchConsole(page);
    await openDemoSites(page, server.baseUrl, "field");
    await page.goto(`${server.baseUrl}/campaigns/${campaignId}/heights/benchmarks`);
    await page.getByRole("heading", { name: "Benchmarks", level: 1 }).waitFor();
    await page.getByRole("rowheader", { name: /KR-BM-117/ }).waitFor();
    expect(await page.getByRole("button", { name: "Add benchmark" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: /^Edit / }).count()).toBe(0);
    expect(await page.getByLabel("Benchmark file").count()).toBe(0);
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, "benchmarks-field-crew");

    await page.goto(`${server.baseUrl}/campaigns/${campaignId}/heights/instruments`);
    await page.getByRole("heading", { name: "Instruments", level: 1 }).waitFor();
    await page.getByRole("link", { name: "Ridge fibre link" }).waitFor();
    expect(await page.getByRole("button", { name: "Add instrument" }).count()).toBe(0);
    await page.getByRole("link", { name: "Ridge fibre link" }).click();
    await page.getByRole("heading", { name: "Ridge fibre link", level: 1 }).waitFor();
    await page.getByRole("list", { name: "Revisions" }).getByText("Created · version 1").waitFor();
    expect(await page.getByRole("button", { name: "Edit instrument" }).count()).toBe(0);
    expect(await page.getByRole("button", { name: "Delete instrument…" }).count()).toBe(0);
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, "instrument-field-crew");
    expect(problems).toEqual([]);
  } finally {
    await crew.close();
  }
});
