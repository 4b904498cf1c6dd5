import type { ComponentType } from "react";
import { createBrowserRouter, Navigate, useParams } from "react-router-dom";
import { CampaignLayout } from "./layouts/campaign-layout";
import { PublicLayout } from "./layouts/public-layout";
import { SignedInLayout } from "./layouts/signed-in-layout";
import { paths } from "./paths";
import { useSession } from "../lib/use-session";
import { RouteError } from "./routes/route-error";
import { FirstPageLoading, RouteShell } from "./routes/route-loading";
import { BoardRoute, SiteBoardRoute } from "./routes/site-board-route";

// The site board (the crew's home, opened at every start) is in the initial bundle; every other
// page, sign-in included (its form library is not needed once signed in), is loaded when first
// opened, with the libraries only it uses. Offline, a page's code comes from the service worker,
// which precaches every chunk; before the worker controls the tab (a first visit), the tab fetches
// every page itself once the first page is shown (warmPagesWithoutWorker), so work can go on if
// the network goes before the worker has installed.

const pageLoaders: (() => Promise<unknown>)[] = [];

/** A route's `lazy`: the page component named `name` of the module `load` imports. */
function page<K extends string, M extends Record<K, ComponentType>>(
  load: () => Promise<M>,
  name: K,
): () => Promise<{ Component: ComponentType }> {
  pageLoaders.push(load);
  return async () => ({ Component: (await load())[name] });
}

/** Loads every page's code into this tab unless a service worker already serves it. */
function warmPagesWithoutWorker(): void {
  // The dev server has no service worker, and compiling every page at each load would slow it.
  if (import.meta.env.DEV) return;
  const controlled = "serviceWorker" in navigator && navigator.serviceWorker.controller !== null;
  if (controlled) return;
  // After the first page has loaded, so its own code goes first; a failure (offline) is harmless.
  const warm = () => void Promise.allSettled(pageLoaders.map((load) => load()));
  if (document.readyState === "complete") setTimeout(warm, 0);
  else window.addEventListener("load", () => setTimeout(warm, 0), { once: true });
}

/** The crew starts at their site's board; everyone else at the sites. */
function CampaignIndex() {
  const { campaignId = "" } = useParams();
  const session = useSession();
  const role =
    session.status === "signed-in"
      ? session.memberships.find((m) => m.campaignId === campaignId)?.role
      : undefined;
  return (
    <Navigate to={role === "field" ? paths.board(campaignId) : paths.sites(campaignId)} replace />
  );
}

export const router = createBrowserRouter([
  {
    element: <RouteShell />,
    errorElement: <RouteError />,
    hydrateFallbackElement: <FirstPageLoading />,
    children: [
      {
        element: <PublicLayout />,
        children: [
          { path: "sign-in", lazy: page(() => import("./routes/sign-in-route"), "SignInRoute") },
          {
            path: "invite/:token",
            lazy: page(() => import("./routes/invite-route"), "InviteRoute"),
          },
        ],
      },
      {
        element: <SignedInLayout />,
        children: [
          { index: true, element: <Navigate to={paths.campaigns} replace /> },
          {
            path: "campaigns",
            lazy: page(() => import("./routes/campaigns-route"), "CampaignsRoute"),
          },
          { path: "device", lazy: page(() => import("./routes/device-route"), "DeviceRoute") },
          {
            path: "campaigns/:campaignId",
            element: <CampaignLayout />,
            children: [
              { index: true, element: <CampaignIndex /> },
              { path: "sites", lazy: page(() => import("./routes/sites-route"), "SitesRoute") },
              {
                path: "sites/new",
                lazy: page(() => import("./routes/site-new-route"), "SiteNewRoute"),
              },
              {
                path: "sites/:siteId/edit",
                lazy: page(() => import("./routes/site-edit-route"), "SiteEditRoute"),
              },
              { path: "board", element: <BoardRoute /> },
              { path: "sites/:siteId", element: <SiteBoardRoute /> },
              {
                path: "sites/:siteId/entries/new/:kind",
                lazy: page(() => import("./routes/entry-new-route"), "EntryNewRoute"),
              },
              {
                path: "entries/:entryId",
                lazy: page(() => import("./routes/entry-route"), "EntryRoute"),
              },
              {
                path: "sites/:siteId/import",
                lazy: page(() => import("./routes/entry-import-route"), "EntryImportRoute"),
              },
              {
                path: "sites/:siteId/temperatures",
                lazy: page(() => import("./routes/temperatures-route"), "TemperaturesRoute"),
              },
              {
                path: "checklists/:runId",
                lazy: page(() => import("./routes/checklist-run-route"), "ChecklistRunRoute"),
              },
              {
                path: "sites/:siteId/levelling",
                lazy: page(() => import("./routes/levelling-route"), "LevellingRoute"),
              },
              {
                path: "levelling/:sectionId",
                lazy: page(
                  () => import("./routes/levelling-section-route"),
                  "LevellingSectionRoute",
                ),
              },
              {
                path: "members",
                lazy: page(() => import("./routes/members-route"), "MembersRoute"),
              },
              {
                path: "checklist-templates",
                lazy: page(
                  () => import("./routes/checklist-templates-route"),
                  "ChecklistTemplatesRoute",
                ),
              },
              {
                path: "conflicts",
                lazy: page(() => import("./routes/conflicts-route"), "ConflictsRoute"),
              },
              { path: "map", lazy: page(() => import("./routes/map-route"), "MapRoute") },
              {
                path: "crates/:crateId/label",
                lazy: page(() => import("./routes/crate-label-route"), "CrateLabelRoute"),
              },
              { path: "crates", lazy: page(() => import("./routes/crates-route"), "CratesRoute") },
              {
                path: "crates/hand-over",
                lazy: page(() => import("./routes/handover-route"), "HandoverRoute"),
              },
              {
                path: "crates/handovers/:handoverId",
                lazy: page(() => import("./routes/handover-route"), "HandoverRecordRoute"),
              },
              {
                path: "crates/alerts",
                lazy: page(() => import("./routes/alerts-route"), "AlertsRoute"),
              },
              {
                path: "crates/:crateId",
                lazy: page(() => import("./routes/crate-route"), "CrateRoute"),
              },
              {
                path: "logistics",
                lazy: page(
                  () => import("./routes/logistics-dashboard-route"),
                  "LogisticsDashboardRoute",
                ),
              },
              {
                path: "heights",
                lazy: page(() => import("./routes/heights-route"), "HeightsRoute"),
              },
              {
                path: "heights/benchmarks",
                lazy: page(() => import("./routes/benchmarks-route"), "BenchmarksRoute"),
              },
              {
                path: "heights/instruments",
                lazy: page(() => import("./routes/instruments-route"), "InstrumentsRoute"),
              },
              {
                path: "heights/instruments/:instrumentId",
                lazy: page(() => import("./routes/instruments-route"), "InstrumentRoute"),
              },
              {
                path: "heights/network",
                lazy: page(() => import("./routes/height-network-route"), "HeightNetworkRoute"),
              },
              {
                path: "heights/runs/new",
                lazy: page(() => import("./routes/run-form-route"), "RunNewRoute"),
              },
              {
                path: "heights/runs/:runId",
                lazy: page(() => import("./routes/run-route"), "RunRoute"),
              },
              {
                path: "heights/runs/:runId/edit",
                lazy: page(() => import("./routes/run-form-route"), "RunEditRoute"),
              },
              { path: "review", lazy: page(() => import("./routes/review-route"), "ReviewRoute") },
              {
                path: "review/:kind/:recordId",
                lazy: page(() => import("./routes/review-route"), "ReviewRecordRoute"),
              },
              {
                path: "exports",
                lazy: page(() => import("./routes/exports-route"), "ExportsRoute"),
              },
              { path: "report", lazy: page(() => import("./routes/report-route"), "ReportRoute") },
            ],
          },
          {
            path: "*",
            lazy: page(() => import("./routes/not-found-route"), "NotFoundRoute"),
          },
        ],
      },
    ],
  },
]);

warmPagesWithoutWorker();
