// Steps shared by the end-to-end tests, written as a person would use the app.
import { expect } from "vitest";
import type { Page } from "playwright-core";

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
  await page.getByRole("heading", { name: "Sites", exact: true }).waitFor();
  await page.getByRole("rowheader", { name: new RegExp(demoSiteNames[0]) }).waitFor();
}

/** The names in the site table, in the order shown. */
export async function listedSiteNames(page: Page): Promise<string[]> {
  const cells = page.locator("tbody th[scope=row] > span:first-child");
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
