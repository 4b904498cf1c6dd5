// Steps shared by the end-to-end tests, written as a person would use the app.
import { expect } from "vitest";
import { AxeBuilder } from "@axe-core/playwright";
import type { Page } from "playwright-core";
import { protocolVersion, type PullResponse } from "../../shared/sync/protocol";

export const demoPassword = "equipot-demo";
export const demoCampaignName = "Kestrel Ridge height link 2027";
export const demoSiteNames = [
  "Brennmoor reference laboratory",
  "Kestrel Ridge hut",
  "Saltmere tide station",
] as const;
export const demoRoles = ["field", "logistics", "geodesist", "reviewer", "admin"] as const;
export type DemoRole = (typeof demoRoles)[number];

export const demoEmail = (role: DemoRole) => `${role}@demo.equipot.test`;

export async function signIn(page: Page, baseUrl: string, email: string, password = demoPassword) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

/** Signs in, picks the demo campaign and waits for its site list. */
export async function openDemoSites(page: Page, baseUrl: string, role: DemoRole) {
  await signIn(page, baseUrl, demoEmail(role));
  await page.getByRole("heading", { name: "Choose a campaign" }).waitFor();
  await page.getByRole("link", { name: new RegExp(demoCampaignName) }).click();
  // The crew's campaign opens on the site board; the sites are one tab away.
  await page
    .getByRole("navigation", { name: "Campaign" })
    .getByRole("link", { name: "Sites", exact: true })
    .click();
  await page.getByRole("heading", { name: "Sites", exact: true }).waitFor();
  await page.getByRole("rowheader", { name: new RegExp(demoSiteNames[0]) }).waitFor();
}

/** The names in the site table, in the order shown. */
export async function listedSiteNames(page: Page): Promise<string[]> {
  const cells = page.locator("tbody th[scope=row] > a:first-child");
  return cells.allInnerTexts();
}

export async function expectSitesListed(page: Page, names: readonly string[]) {
  await page
    .getByRole("rowheader", { name: new RegExp(names[0] ?? "") })
    .waitFor({ timeout: 10_000 });
  const listed = await listedSiteNames(page);
  for (const name of names) expect(listed).toContain(name);
}

/** The error message tied to a field through aria-describedby. */
export async function fieldError(page: Page, label: string): Promise<string | null> {
  const input = page.getByLabel(label, { exact: false }).first();
  const describedBy = (await input.getAttribute("aria-describedby")) ?? "";
  const errorId = describedBy.split(" ").find((id) => id.endsWith("-error"));
  if (errorId === undefined) return null;
  return page.locator(`[id="${errorId}"]`).innerText();
}

interface ApiSession {
  accessToken: string;
  memberships: { campaignId: string; campaignName: string; role: string }[];
}

/** Signs in through the API from the test process, as a second person working elsewhere. */
export async function apiSignIn(baseUrl: string, role: DemoRole): Promise<ApiSession> {
  const response = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json", "x-equipot-request": "1" },
    body: JSON.stringify({ email: demoEmail(role), password: demoPassword }),
  });
  expect(response.status).toBe(200);
  return (await response.json()) as ApiSession;
}

export async function apiCall(
  baseUrl: string,
  token: string,
  method: string,
  path: string,
  body?: unknown,
): Promise<{ status: number; json: unknown }> {
  const response = await fetch(`${baseUrl}/api${path}`, {
    method,
    headers: {
      authorization: `Bearer ${token}`,
      "content-type": "application/json",
      "x-equipot-request": "1",
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await response.text();
  return { status: response.status, json: text === "" ? null : (JSON.parse(text) as unknown) };
}

/** Waits until the sync bar's status says `text` (e.g. "All changes sent"). */
export async function waitForSyncStatus(page: Page, text: string | RegExp, timeout = 20_000) {
  await page
    .getByRole("region", { name: "Sync" })
    .getByRole("status")
    .filter({ hasText: text })
    .waitFor({ timeout });
}

export async function syncStatusText(page: Page): Promise<string> {
  return page.getByRole("region", { name: "Sync" }).getByRole("status").innerText();
}

export interface NewSiteFields {
  name: string;
  kind: string;
  latitude: string;
  longitude: string;
  height: string;
  notes?: string;
}

/** Fills the add-site form and saves; waits for the list with the new site. */
export async function addSite(page: Page, site: NewSiteFields) {
  await page.getByRole("link", { name: "Add site" }).click();
  await page.getByLabel("Name").fill(site.name);
  await page.getByLabel("Kind of site").selectOption(site.kind);
  await page.getByLabel("Latitude").fill(site.latitude);
  await page.getByLabel("Longitude").fill(site.longitude);
  await page.getByLabel("Approximate height").fill(site.height);
  if (site.notes !== undefined) await page.getByLabel("Notes").fill(site.notes);
  await page.getByRole("button", { name: "Add site" }).click();
  await page.getByRole("rowheader", { name: new RegExp(site.name) }).waitFor();
}

/** Opens a site's edit form, replaces its notes and saves. */
export async function editNotes(page: Page, siteName: string, notes: string) {
  await page.getByRole("link", { name: `Edit ${siteName}` }).click();
  await page.getByRole("heading", { name: `Edit ${siteName}` }).waitFor();
  await page.getByLabel("Notes").fill(notes);
  await page.getByRole("button", { name: "Save changes" }).click();
  await page.getByRole("heading", { name: "Sites", exact: true }).waitFor();
}

export interface ApiSite {
  id: string;
  name: string;
  notes: string;
  version: number;
}

/** The campaign's sites as the server has them, read with another person's token. */
export async function serverSites(baseUrl: string, role: DemoRole): Promise<ApiSite[]> {
  const session = await apiSignIn(baseUrl, role);
  const campaign = session.memberships.find((m) => m.campaignName === demoCampaignName);
  expect(campaign).toBeDefined();
  const list = await apiCall(
    baseUrl,
    session.accessToken,
    "GET",
    `/campaigns/${campaign?.campaignId ?? ""}/sites`,
  );
  expect(list.status).toBe(200);
  return (list.json as { sites: ApiSite[] }).sites;
}

/** axe's serious and critical findings on the page as it is now (WCAG 2.2 AA and best practice). */
export async function seriousViolations(target: Page): Promise<string[]> {
  const results = await new AxeBuilder({ page: target })
    .withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa", "best-practice"])
    .analyze();
  return results.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id} (${v.impact}): ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

/** Opens the demo sites, waits for the first sync and for the service worker: ready to go offline. */
export async function readyForOffline(page: Page, baseUrl: string, role: DemoRole) {
  await openDemoSites(page, baseUrl, role);
  await waitForSyncStatus(page, "All changes sent");
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
}

/** Everything the server holds for the demo campaign, pulled with another person's token. */
export async function pullDemoCampaign(baseUrl: string, role: DemoRole) {
  const session = await apiSignIn(baseUrl, role);
  const campaignId =
    session.memberships.find((m) => m.campaignName === demoCampaignName)?.campaignId ?? "";
  const query = `protocolVersion=${protocolVersion}&campaign=${campaignId}&limit=1000`;
  const response = await fetch(`${baseUrl}/api/sync/pull?${query}`, {
    headers: { authorization: `Bearer ${session.accessToken}` },
  });
  expect(response.status).toBe(200);
  const page = (await response.json()) as PullResponse;
  expect(page.hasMore).toBe(false);
  return { campaignId, token: session.accessToken, changes: page.changes };
}
