import { createBrowserRouter, Navigate, useParams } from "react-router-dom";
import { CampaignLayout } from "./layouts/campaign-layout";
import { PublicLayout } from "./layouts/public-layout";
import { SignedInLayout } from "./layouts/signed-in-layout";
import { paths } from "./paths";
import { useSession } from "../lib/use-session";
import { CampaignsRoute } from "./routes/campaigns-route";
import { ConflictsRoute } from "./routes/conflicts-route";
import { DeviceRoute } from "./routes/device-route";
import { InviteRoute } from "./routes/invite-route";
import { MembersRoute } from "./routes/members-route";
import { ChecklistTemplatesRoute } from "./routes/checklist-templates-route";
import { NotFoundRoute } from "./routes/not-found-route";
import { RouteError } from "./routes/route-error";
import { SignInRoute } from "./routes/sign-in-route";
import { SiteEditRoute } from "./routes/site-edit-route";
import { ChecklistRunRoute } from "./routes/checklist-run-route";
import { SiteNewRoute } from "./routes/site-new-route";
import { SitesRoute } from "./routes/sites-route";
import { LevellingRoute } from "./routes/levelling-route";
import { LevellingSectionRoute } from "./routes/levelling-section-route";
import { BoardRoute, SiteBoardRoute } from "./routes/site-board-route";
import { EntryNewRoute } from "./routes/entry-new-route";
import { EntryRoute } from "./routes/entry-route";
import { EntryImportRoute } from "./routes/entry-import-route";
import { TemperaturesRoute } from "./routes/temperatures-route";
import { MapRoute } from "./routes/map-route";
import { CrateLabelRoute } from "./routes/crate-label-route";
import { CratesRoute } from "./routes/crates-route";
import { CrateRoute } from "./routes/crate-route";
import { HandoverRecordRoute, HandoverRoute } from "./routes/handover-route";
import { AlertsRoute } from "./routes/alerts-route";
import { LogisticsDashboardRoute } from "./routes/logistics-dashboard-route";
import { HeightsRoute } from "./routes/heights-route";
import { BenchmarksRoute } from "./routes/benchmarks-route";
import { InstrumentRoute, InstrumentsRoute } from "./routes/instruments-route";
import { HeightNetworkRoute } from "./routes/height-network-route";
import { RunEditRoute, RunNewRoute } from "./routes/run-form-route";
import { RunRoute } from "./routes/run-route";
import { ReviewRecordRoute, ReviewRoute } from "./routes/review-route";
import { ExportsRoute } from "./routes/exports-route";
import { ReportRoute } from "./routes/report-route";

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
    errorElement: <RouteError />,
    children: [
      {
        element: <PublicLayout />,
        children: [
          { path: "sign-in", element: <SignInRoute /> },
          { path: "invite/:token", element: <InviteRoute /> },
        ],
      },
      {
        element: <SignedInLayout />,
        children: [
          { index: true, element: <Navigate to={paths.campaigns} replace /> },
          { path: "campaigns", element: <CampaignsRoute /> },
          { path: "device", element: <DeviceRoute /> },
          {
            path: "campaigns/:campaignId",
            element: <CampaignLayout />,
            children: [
              { index: true, element: <CampaignIndex /> },
              { path: "sites", element: <SitesRoute /> },
              { path: "sites/new", element: <SiteNewRoute /> },
              { path: "sites/:siteId/edit", element: <SiteEditRoute /> },
              { path: "board", element: <BoardRoute /> },
              { path: "sites/:siteId", element: <SiteBoardRoute /> },
              { path: "sites/:siteId/entries/new/:kind", element: <EntryNewRoute /> },
              { path: "entries/:entryId", element: <EntryRoute /> },
              { path: "sites/:siteId/import", element: <EntryImportRoute /> },
              { path: "sites/:siteId/temperatures", element: <TemperaturesRoute /> },
              { path: "checklists/:runId", element: <ChecklistRunRoute /> },
              { path: "sites/:siteId/levelling", element: <LevellingRoute /> },
              { path: "levelling/:sectionId", element: <LevellingSectionRoute /> },
              { path: "members", element: <MembersRoute /> },
              { path: "checklist-templates", element: <ChecklistTemplatesRoute /> },
              { path: "conflicts", element: <ConflictsRoute /> },
              { path: "map", element: <MapRoute /> },
              { path: "crates/:crateId/label", element: <CrateLabelRoute /> },
              { path: "crates", element: <CratesRoute /> },
              { path: "crates/hand-over", element: <HandoverRoute /> },
              { path: "crates/handovers/:handoverId", element: <HandoverRecordRoute /> },
              { path: "crates/alerts", element: <AlertsRoute /> },
              { path: "crates/:crateId", element: <CrateRoute /> },
              { path: "logistics", element: <LogisticsDashboardRoute /> },
              { path: "heights", element: <HeightsRoute /> },
              { path: "heights/benchmarks", element: <BenchmarksRoute /> },
              { path: "heights/instruments", element: <InstrumentsRoute /> },
              { path: "heights/instruments/:instrumentId", element: <InstrumentRoute /> },
              { path: "heights/network", element: <HeightNetworkRoute /> },
              { path: "heights/runs/new", element: <RunNewRoute /> },
              { path: "heights/runs/:runId", element: <RunRoute /> },
              { path: "heights/runs/:runId/edit", element: <RunEditRoute /> },
              { path: "review", element: <ReviewRoute /> },
              { path: "review/:kind/:recordId", element: <ReviewRecordRoute /> },
              { path: "exports", element: <ExportsRoute /> },
              { path: "report", element: <ReportRoute /> },
            ],
          },
          { path: "*", element: <NotFoundRoute /> },
        ],
      },
    ],
  },
]);
