// A tablet for the benchmark: Debian's Chromium with its own on-disk profile (so the service
// worker installs as on a real device), signed in through the sign-in page as a person would.
import type { CDPSession, Page } from "playwright-core";
import { launchProfile, viewports, type Profile } from "../../tests/helpers/browser";
import { demoEmail, signIn, type DemoRole } from "../../tests/e2e/flows";

export interface Tablet {
  profile: Profile;
  page: Page;
  cdp: CDPSession;
  /** 1 = no throttling; 4 = the CPU four times slower. */
  throttle: (rate: number) => Promise<void>;
}

export async function openTablet(): Promise<Tablet> {
  const profile = await launchProfile({ viewport: viewports.tabletLandscape });
  const page = profile.context.pages()[0] ?? (await profile.context.newPage());
  const cdp = await page.context().newCDPSession(page);
  return {
    profile,
    page,
    cdp,
    throttle: async (rate) => {
      await cdp.send("Emulation.setCPUThrottlingRate", { rate });
    },
  };
}

export async function signInAs(page: Page, baseUrl: string, role: DemoRole): Promise<void> {
  await signIn(page, baseUrl, demoEmail(role));
  await page.getByRole("heading", { name: "Choose a campaign" }).waitFor();
}

export const boardUrl = (baseUrl: string, campaignId: string, siteId: string) =>
  `${baseUrl}/campaigns/${campaignId}/sites/${siteId}`;

export async function waitForBoard(page: Page, siteName: string, timeout = 30_000) {
  await page.getByRole("heading", { name: siteName, level: 1 }).waitFor({ timeout });
}

/** The service worker has installed, precached the shell and controls the page. */
export async function waitForServiceWorker(page: Page): Promise<void> {
  await page.evaluate("navigator.serviceWorker.ready.then(() => true)");
  await page.waitForFunction("navigator.serviceWorker.controller !== null");
}
