// A crew levels from the clock's reference point to a benchmark and back, offline: one misread
// foresight puts the section out of tolerance (warned before closing), a correction brings it
// back, the section is closed, and everything reaches the server when the network returns.
import { expect, test } from "vitest";
import type { Page } from "playwright-core";
import { screenshot, viewports } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import { pullDemoCampaign, readyForOffline, seriousViolations, waitForSyncStatus } from "./flows";

const tablet = tabletForFile(viewports.tabletPortrait);

const from = "Clock reference";
const to = "BM K-7";
const forwardName = `Forward run, ${from} → ${to}`;
const backwardName = `Backward run, ${to} → ${from}`;

/** Types one setup as at the instrument: BS, Enter, FS, Enter, distances, Enter saves. */
async function typeSetup(page: Page, runName: string, number: number, values: string[]) {
  const form = page.getByRole("form", { name: `New setup, ${runName}` });
  await form.getByLabel("BS (m)", { exact: true }).click();
  for (const value of values) {
    await page.keyboard.type(value);
    await page.keyboard.press("Enter");
  }
  await page
    .getByRole("region", { name: runName })
    .getByRole("rowheader", { name: String(number), exact: true })
    .waitFor();
}

// Hand-computed book (see tests/unit/shared/levelling-book.test.ts): forward ΔH +0.3666 m over
// 173 m, backward −0.3660 m over 181 m; K = 0.177 km, second-order I allows 6·√0.177 = 2.5 mm
// (FGCC 1984, REFERENCES.md §4). FS 0.9460 read for 0.9560 gives +10.6 mm instead of +0.6 mm.
test("a section levelled offline, out of tolerance until corrected, closed and synced", async () => {
  const { page, server, profile } = tablet;
  await readyForOffline(page, server.baseUrl, "field");
  const demo = await pullDemoCampaign(server.baseUrl, "reviewer");
  const site = demo.changes.find((c) => c.entity === "site" && c.data.name === "Kestrel Ridge hut");
  expect(site).toBeDefined();

  await profile.context.setOffline(true);
  await page.goto(`${server.baseUrl}/campaigns/${demo.campaignId}/sites/${site?.id}/levelling`);
  await page.getByRole("heading", { name: "Levelling at Kestrel Ridge hut" }).waitFor();
  await page.getByText("Caution: roads, slopes and mountain weather").waitFor();
  await page.getByLabel("From mark").fill(from);
  await page.getByLabel("To mark").fill(to);
  await page
    .getByLabel("Levelling class")
    .selectOption({ label: "Second-order, Class I (±6 mm·√K)" });
  await page.getByLabel("Instrument (optional)").fill("Digital level DL-2");
  await page.getByRole("button", { name: "Open section" }).click();
  await page.getByRole("heading", { name: `${from} → ${to}`, level: 1 }).waitFor();

  await typeSetup(page, forwardName, 1, ["1,5234", "0,8123", "30", "24"]);
  await typeSetup(page, forwardName, 2, ["0.9876", "1.4321", "35", "34"]);
  await typeSetup(page, forwardName, 3, ["1.2000", "1.1000", "25", "26"]);
  const forward = page.getByRole("region", { name: forwardName });
  // Setup 1's sights differ by 6 m: warned beside it (limit 5 m, memory).
  await forward
    .getByText("Warning: Backsight and foresight distances differ by 6.0 m (more than 5 m)")
    .waitFor();
  expect(await forward.getByRole("row").last().innerText()).toContain("+0.3666");

  await typeSetup(page, backwardName, 1, ["1.3000", "1.4000", "27", "28"]);
  await typeSetup(page, backwardName, 2, ["1.4000", "0,9460", "33", "33"]);
  await typeSetup(page, backwardName, 3, ["0.8000", "1.5100", "30", "30"]);
  const panel = page.getByRole("region", { name: "Misclosure" });
  await panel.getByText("Out of tolerance — re-level before closing").waitFor();
  expect(await panel.innerText()).toContain(
    "Misclosure 10.6 mm of ±2.5 mm allowed (Second-order, Class I, K = 0.18 km)",
  );
  await page.getByRole("button", { name: "Close section" }).click();
  await page.getByLabel("Reason for closing out of tolerance").waitFor();
  await page.getByRole("button", { name: "Cancel" }).click();
  await screenshot(page, "levelling-out-of-tolerance");

  await page
    .getByRole("region", { name: backwardName })
    .getByRole("button", { name: "Correct setup 2" })
    .click();
  const entry = page.getByRole("form", { name: `New setup, ${backwardName}` });
  expect(await entry.getByLabel("FS (m)", { exact: true }).inputValue()).toBe("0.9460");
  await entry.getByLabel("FS (m)", { exact: true }).fill("0,9560");
  // Live, before saving: the typed correction already brings it within tolerance.
  await panel.getByText("with the setup being typed").waitFor();
  await panel.getByText("Within tolerance", { exact: true }).waitFor();
  await entry.getByRole("button", { name: "Save correction of setup 2" }).click();
  // Saved: the correction is marked, and the panel no longer counts a typed setup.
  await page.getByRole("region", { name: backwardName }).getByText("corrected").waitFor();
  await panel.getByText("with the setup being typed").waitFor({ state: "detached" });
  expect(await panel.innerText()).toContain(
    "Misclosure 0.6 mm of ±2.5 mm allowed (Second-order, Class I, K = 0.18 km)",
  );
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "levelling-field-book");

  await page.getByRole("button", { name: "Close section" }).click();
  await page.getByRole("button", { name: "Close now" }).click();
  await page.getByText("Closed", { exact: true }).waitFor();

  await profile.context.setOffline(false);
  await waitForSyncStatus(page, "All changes sent", 30_000);

  const pulled = await pullDemoCampaign(server.baseUrl, "reviewer");
  const section = pulled.changes.find(
    (c) => c.entity === "levellingSection" && c.data.fromMark === from,
  );
  expect(section?.data).toMatchObject({
    toMark: to,
    classId: "fgcc-1984-second-order-class-i",
    closedAt: expect.any(String),
    closure: { withinTolerance: true, misclosureM: expect.closeTo(0.0006, 9) },
  });
  const setups = pulled.changes.flatMap((c) =>
    c.entity === "levellingSetup" && c.data.sectionId === section?.id ? [c.data] : [],
  );
  // Three forward, three backward and the correction, which is kept beside the setup it replaces.
  expect(setups).toHaveLength(7);
  expect(
    setups
      .filter((s) => s.run === "backward" && s.number === 2)
      .map((s) => s.foresightM)
      .sort(),
  ).toEqual([0.946, 0.956]);
});
