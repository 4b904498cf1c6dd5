// The geodesist's levelling network on a tablet: a bad tie file is refused by line, a good one
// imported, the network adjusted on the server, and the heights and the global test shown.
import { fileURLToPath } from "node:url";
import { expect, test } from "vitest";
import { screenshot, viewports, watchConsole } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import { apiSignIn, demoCampaignName, openDemoSites, seriousViolations } from "./flows";

const tablet = tabletForFile(viewports.tabletLandscape);
const fixture = (name: string) =>
  fileURLToPath(new URL(`../fixtures/geodesy/${name}`, import.meta.url));

test("imports ties, adjusts the network and shows heights and the global test", async () => {
  const { page, server } = tablet;
  const problems = watchConsole(page);
  const session = await apiSignIn(server.baseUrl, "geodesist");
  const campaignId =
    session.memberships.find((m) => m.campaignName === demoCampaignName)?.campaignId ?? "";
  await openDemoSites(page, server.baseUrl, "geodesist");
  await page.goto(`${server.baseUrl}/campaigns/${campaignId}/heights/network`);
  await page.getByRole("heading", { name: "Levelling network", level: 1 }).waitFor();
  await page.getByText("These are campaign results, not official heights.").waitFor();

  // A bad file: every problem by line, nothing stored.
  await page.getByLabel("Tie file").setInputFiles(fixture("ties-bad.csv"));
  await page.getByRole("button", { name: "Import", exact: true }).click();
  await page.getByText("File refused").waitFor();
  const problemsList = page.getByRole("list", { name: "Problems by line" });
  await problemsList.getByText("Line 3, to: From and to marks must differ").waitFor();
  expect(await problemsList.getByRole("listitem").count()).toBe(4);
  const before = await page
    .getByRole("table", { name: "Observations of the network" })
    .getByRole("row")
    .count();

  await page.getByLabel("Tie file").setInputFiles(fixture("ties-kestrel.csv"));
  await page.getByRole("button", { name: "Import", exact: true }).click();
  await page.getByText("3 height ties added to the network.").waitFor();
  const observations = page.getByRole("table", { name: "Observations of the network" });
  await observations.getByRole("rowheader", { name: "KR-BM-117 → KR-CRP" }).first().waitFor();
  expect(await observations.getByRole("row").count()).toBe(before === 2 ? 4 : before + 3);

  // A wrong option is refused at its field before anything is sent.
  await page.getByLabel("σ per √km").fill("0");
  await page.getByRole("button", { name: "Adjust", exact: true }).click();
  await page.getByText("σ per √km must be between 0.01 and 100 mm").waitFor();
  await page.getByLabel("σ per √km").fill("1,5");
  await page.getByRole("button", { name: "Adjust", exact: true }).click();

  const heights = page.getByRole("table", { name: "Adjusted heights" });
  const crp = heights.getByRole("row").filter({ hasText: "KR-CRP" });
  await crp.waitFor();
  // By hand: KR-BM-117 2869.412 m + 0.7743 m ≈ 2870.186 m; the loop moves it by under a mm.
  expect(await crp.textContent()).toMatch(/2870\.18\d\d m/);
  await heights
    .getByRole("row")
    .filter({ hasText: "KR-BM-117" })
    .getByText("Benchmark (fixed)")
    .waitFor();
  await page.getByTestId("global-test").getByText("Global test passed").waitFor();
  await page.getByRole("table", { name: "Residuals" }).getByRole("rowheader").first().waitFor();
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "height-network");
  // The refused file is the one error the browser may log.
  expect(problems.filter((p) => !p.includes("status of 422"))).toEqual([]);
});
