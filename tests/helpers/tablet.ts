// One server and one tablet-sized browser profile for an e2e test file, closed afterwards; a failed
// test leaves a screenshot of the tablet's page. Read the fields inside tests, after beforeAll.
import { afterAll, beforeAll } from "vitest";
import type { Page, ViewportSize } from "playwright-core";
import { launchProfile, screenshotOnFailure, type Profile } from "./browser";
import { startTestServer, type TestServer } from "./server";

export interface Tablet {
  server: TestServer;
  profile: Profile;
  /** The profile's first page. */
  page: Page;
}

export function tabletForFile(viewport: ViewportSize): Tablet {
  const tablet = {} as Tablet;
  beforeAll(async () => {
    tablet.server = await startTestServer();
    tablet.profile = await launchProfile({ viewport });
    tablet.page = tablet.profile.context.pages()[0] ?? (await tablet.profile.context.newPage());
  });
  screenshotOnFailure(() => tablet.page);
  afterAll(async () => {
    await tablet.profile?.close();
    await tablet.server?.stop();
  });
  return tablet;
}
