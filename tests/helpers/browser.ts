// Debian's Chromium driven by playwright-core for the end-to-end tests (no browser is downloaded).
import { afterEach } from "vitest";
import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import {
  chromium,
  type Browser,
  type BrowserContext,
  type BrowserContextOptions,
  type Page,
} from "playwright-core";

export const chromiumPath = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

// Without the background-networking flags Chromium keeps calling hosts the closed network refuses.
export const chromiumArgs = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--enable-unsafe-swiftshader",
];

export const viewports = {
  tabletLandscape: { width: 1024, height: 768 },
  tabletPortrait: { width: 800, height: 1280 },
  phone: { width: 390, height: 844 },
} as const;

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: chromiumPath, headless: true, args: chromiumArgs });
}

export interface Profile {
  context: BrowserContext;
  close: () => Promise<void>;
}

/** A browser with its own on-disk profile, so service workers and storage behave as installed. */
export async function launchProfile(options: BrowserContextOptions = {}): Promise<Profile> {
  const dir = mkdtempSync(join(tmpdir(), "equipot-e2e-"));
  const context = await chromium.launchPersistentContext(dir, {
    executablePath: chromiumPath,
    headless: true,
    args: chromiumArgs,
    viewport: viewports.tabletLandscape,
    ...options,
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(dir, { recursive: true, force: true, maxRetries: 10 });
    },
  };
}

const artifactDir = resolve("test-artifacts", "e2e");

/** Saves a full-page screenshot under test-artifacts/e2e/ and returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(artifactDir, { recursive: true });
  const path = join(artifactDir, `${name}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}

/** Collects console errors and uncaught page errors, to assert that there were none. */
export function watchConsole(page: Page): string[] {
  const problems: string[] = [];
  page.on("console", (message) => {
    if (message.type() === "error") problems.push(`console: ${message.text()}`);
  });
  page.on("pageerror", (error) => problems.push(`page: ${error.message}`));
  return problems;
}

/** After a failed test, keeps a screenshot of the page it was on (named after the test). */
export function screenshotOnFailure(currentPage: () => Page | undefined): void {
  afterEach(async (context) => {
    const page = currentPage();
    if (context.task.result?.state !== "fail" || page === undefined || page.isClosed()) return;
    const name = context.task.name.replace(/[^\w-]+/g, "-").slice(0, 80);
    await screenshot(page, `failed-${name}`).catch(() => undefined);
  });
}
