// The printable campaign report: a reviewer opens it, every part is drawn from what the device
// holds (sites, the run's result, the adjustment, the crates' transport), only the report shows
// in print, and Chromium makes an A4 PDF of it. The field crew is told the page is not theirs.
import { mkdirSync, writeFileSync } from "node:fs";
import { randomUUID } from "node:crypto";
import { join, resolve } from "node:path";
import { and, eq } from "drizzle-orm";
import { expect, test } from "vitest";
import type { Page } from "playwright-core";
import { officialHeightsCaution } from "../../shared/schemas/comparison";
import { protocolVersion, type PushResponse } from "../../shared/sync/protocol";
import { campaigns, sites, users } from "../../server/db/schema";
import { seedDemoGeodesy } from "../../server/seed/demo-geodesy";
import { launchProfile, screenshot, viewports, watchConsole } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import {
  apiCall,
  apiSignIn,
  demoCampaignName,
  demoEmail,
  demoSiteNames,
  openDemoSites,
  pullDemoCampaign,
  signIn,
  type DemoRole,
} from "./flows";

const tablet = tabletForFile(viewports.tabletLandscape);

async function push(
  baseUrl: string,
  role: DemoRole,
  campaignId: string,
  mutations: { name: string; args: unknown }[],
) {
  const session = await apiSignIn(baseUrl, role);
  const pushed = await apiCall(baseUrl, session.accessToken, "POST", "/sync/push", {
    protocolVersion,
    clientId: randomUUID(),
    campaignId,
    mutations: mutations.map((m, i) => ({
      mutationId: i + 1,
      name: m.name,
      args: m.args,
      createdAt: new Date().toISOString(),
    })),
  });
  expect(pushed.status).toBe(200);
  const { results } = pushed.json as PushResponse;
  expect(results.map((r) => `${r.status} ${r.message ?? ""}`.trim())).toEqual(
    mutations.map(() => "applied"),
  );
}

/** The demo's comparison run and adjusted network (the test seed leaves them out). */
async function seedGeodesy(): Promise<string> {
  const { db } = tablet.server.database;
  const [campaign] = await db.select().from(campaigns).where(eq(campaigns.name, demoCampaignName));
  const campaignId = campaign?.id ?? "";
  const [hut] = await db
    .select()
    .from(sites)
    .where(and(eq(sites.campaignId, campaignId), eq(sites.name, demoSiteNames[1])));
  const [geodesist] = await db
    .select()
    .from(users)
    .where(eq(users.email, demoEmail("geodesist")));
  expect(hut && geodesist).toBeTruthy();
  await seedDemoGeodesy(
    db,
    campaignId,
    { id: hut?.id ?? "", latitudeDeg: hut?.latitudeDeg ?? 0 },
    geodesist?.id ?? "",
  );
  return campaignId;
}

/** KR-03 travels to Saltmere: the leg, one handover, a hard shock and a cold spell on the way. */
async function seedTransport() {
  const demo = await pullDemoCampaign(tablet.server.baseUrl, "reviewer");
  const crate = demo.changes.flatMap((c) =>
    c.entity === "crate" && c.data.label === "KR-03" ? [c.data] : [],
  )[0];
  const leg = demo.changes.flatMap((c) =>
    c.entity === "leg" && c.data.crateId === crate?.id ? [c.data] : [],
  )[0];
  expect(crate && leg).toBeTruthy();
  const crateId = crate?.id ?? "";
  const legId = leg?.id ?? "";
  const siteId = leg?.toSiteId ?? "";
  await push(tablet.server.baseUrl, "logistics", demo.campaignId, [
    { name: "leg.depart", args: { id: legId, at: "2027-06-21T05:41:00Z" } },
    { name: "leg.arrive", args: { id: legId, at: "2027-06-21T12:52:00Z" } },
    {
      name: "handover.record",
      args: {
        id: randomUUID(),
        crateId,
        legId,
        fromName: "Van driver",
        toName: "Tide station keeper",
        at: "2027-06-21T13:05:00Z",
        siteId,
        condition: "intact",
      },
    },
  ]);
  const entry = (observedAt: string, data: unknown) => ({
    name: "entry.add",
    args: { id: randomUUID(), siteId, crateId, observedAt, recordedAt: observedAt, data },
  });
  await push(tablet.server.baseUrl, "field", demo.campaignId, [
    entry("2027-06-21T09:14:00Z", {
      kind: "shock-log",
      source: "manual",
      events: [{ at: "2027-06-21T09:14:00Z", xG: null, yG: null, zG: 22.5, durationMs: 6 }],
    }),
    entry("2027-06-21T12:55:00Z", {
      kind: "temperatures",
      source: "manual",
      samples: [
        { at: "2027-06-21T12:55:00Z", celsius: 17.1, humidityPct: null },
        { at: "2027-06-21T13:25:00Z", celsius: 16.4, humidityPct: null },
        { at: "2027-06-21T13:55:00Z", celsius: 18.6, humidityPct: null },
      ],
    }),
  ]);
}

/** The PDF's document title from its Info dictionary (Skia writes non-ASCII titles as UTF-16BE). */
function pdfTitle(pdf: Buffer): string {
  const text = pdf.toString("latin1");
  const hex = /\/Title\s*<([0-9A-Fa-f]+)>/.exec(text)?.[1];
  if (hex !== undefined) {
    const bytes = Buffer.from(hex, "hex");
    const body = bytes.subarray(bytes[0] === 0xfe && bytes[1] === 0xff ? 2 : 0);
    return String.fromCharCode(
      ...Array.from({ length: body.length / 2 }, (_, i) => body.readUInt16BE(i * 2)),
    );
  }
  return /\/Title\s*\(([^)]*)\)/.exec(text)?.[1] ?? "";
}

async function waitForFigures(page: Page) {
  const report = page.getByRole("article", { name: "Campaign report" });
  await report.getByTestId("report-map").locator("svg path").waitFor();
  await report.getByTestId("report-adev-chart").locator("canvas").waitFor({ timeout: 60_000 });
  await report.getByTestId("time-to-target-chart").locator("canvas").waitFor();
  await report.getByTestId("height-difference").waitFor();
  await report.getByTestId("global-test").waitFor();
  await report.getByTestId("transport-KR-03").getByText("Shock", { exact: true }).waitFor();
  return report;
}

/** In print media only the report shows: no app header, tabs, sync bar, footer or buttons. */
async function expectPrintLayout(page: Page) {
  const report = page.getByRole("article", { name: "Campaign report" });
  expect(await page.getByRole("banner").isVisible()).toBe(false);
  expect(await page.getByRole("navigation", { name: "Campaign" }).isVisible()).toBe(false);
  expect(await page.getByRole("region", { name: "Sync" }).isVisible()).toBe(false);
  expect(await page.getByRole("button", { name: "Print or save as PDF" }).isVisible()).toBe(false);
  for (const name of ["Sites", "Height results", "Levelling", "Transport"])
    expect(await report.getByRole("heading", { name, level: 2 }).isVisible()).toBe(true);
  expect(await report.getByTestId("report-caution").innerText()).toContain(officialHeightsCaution);
  expect(await report.getByTestId("report-footer").innerText()).toContain(officialHeightsCaution);
  expect(await report.getByTestId("height-difference").isVisible()).toBe(true);
  await screenshot(page, "report-print");
}

/** Chromium's A4 PDF of the page, kept under test-artifacts/e2e/. */
async function savePdf(page: Page) {
  const pdf = await page.pdf({ format: "A4", preferCSSPageSize: true, printBackground: true });
  const dir = resolve("test-artifacts", "e2e");
  mkdirSync(dir, { recursive: true });
  writeFileSync(join(dir, "report.pdf"), pdf);
  expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
  expect(pdf.length).toBeGreaterThan(50_000);
  // Title page with the sites, then heights, levelling and transport each from a new page.
  const pages = pdf.toString("latin1").match(/\/Type\s*\/Page\b(?!s)/g) ?? [];
  expect(pages.length).toBeGreaterThanOrEqual(4);
  expect(pdfTitle(pdf)).toBe(`${demoCampaignName} — campaign report`);
}

test("a reviewer prints the campaign report to an A4 PDF", async () => {
  const { page, server } = tablet;
  const problems = watchConsole(page);
  const campaignId = await seedGeodesy();
  await seedTransport();
  await openDemoSites(page, server.baseUrl, "reviewer");

  // The ΔH as the run page shows it, to find the same on paper.
  const runs = await apiCall(
    server.baseUrl,
    (await apiSignIn(server.baseUrl, "reviewer")).accessToken,
    "GET",
    `/campaigns/${campaignId}/comparison-runs`,
  );
  const runId = (runs.json as { runs: { id: string }[] }).runs[0]?.id ?? "";
  await page.goto(`${server.baseUrl}/campaigns/${campaignId}/heights/runs/${runId}`);
  const runDeltaH = page.getByTestId("height-difference");
  await runDeltaH.waitFor({ timeout: 60_000 });
  const deltaH = await runDeltaH.innerText();
  expect(deltaH).toMatch(/^\d+\.\d{3} m ± \d+\.\d mm$/);

  await page
    .getByRole("navigation", { name: "Campaign" })
    .getByRole("link", { name: "Report", exact: true })
    .click();
  const report = await waitForFigures(page);
  await report.getByRole("heading", { name: demoCampaignName, level: 1 }).waitFor();
  expect(await report.getByTestId("height-difference").innerText()).toBe(deltaH);
  const kr03 = await report.getByTestId("transport-KR-03").innerText();
  expect(kr03).toContain("Brennmoor reference laboratory → Saltmere tide station");
  expect(kr03).toContain("2027-06-21 05:41 UTC");
  expect(kr03).toContain("1 handover");
  expect(kr03).toMatch(/highest 22\.5 g on z/);
  expect(kr03).toMatch(/outside 18 °C … 25 °C/);
  expect(kr03).toMatch(/2 open alerts/);
  expect(await report.getByRole("table", { name: "Sites" }).innerText()).toContain("2871.0 m");
  await screenshot(page, "report-screen");

  await page.emulateMedia({ media: "print" });
  await expectPrintLayout(page);
  await savePdf(page);
  await page.emulateMedia({ media: "screen" });
  expect(problems).toEqual([]);
});

test("the field crew is told the report is not for their role", async () => {
  const { server } = tablet;
  const profile = await launchProfile({ viewport: viewports.tabletLandscape });
  try {
    const page = profile.context.pages()[0] ?? (await profile.context.newPage());
    const session = await apiSignIn(server.baseUrl, "field");
    const campaignId =
      session.memberships.find((m) => m.campaignName === demoCampaignName)?.campaignId ?? "";
    await signIn(page, server.baseUrl, demoEmail("field"));
    await page.getByRole("heading", { name: "Choose a campaign" }).waitFor();
    await page.goto(`${server.baseUrl}/campaigns/${campaignId}/report`);
    await page.getByText("Not available for your role").waitFor();
    await page.getByText("The printable campaign report is for reviewers").waitFor();
    expect(await page.getByRole("article", { name: "Campaign report" }).count()).toBe(0);
    const nav = page.getByRole("navigation", { name: "Campaign" });
    expect(await nav.getByRole("link", { name: "Report", exact: true }).count()).toBe(0);
    await screenshot(page, "report-field-not-allowed");
  } finally {
    await profile.close();
  }
});
