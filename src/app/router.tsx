import { createBrowserRouter, Navigate, useParams } from "react-router-dom";
import { CampaignLayout } from "./layouts/campaign-layout";
import { PublicLayout } from "./layouts/public-layout";
import { SignedInLayout } from "./layouts/signed-in-layout";
import { paths } from "./paths";
import { CampaignsRoute } from "./routes/campaigns-route";
import { ConflictsRoute } from "./routes/conflicts-route";
import { DeviceRoute } from "./routes/device-route";
import { InviteRoute } from "./routes/invite-route";
import { MembersRoute } from "./routes/members-route";
import { NotFoundRoute } from "./routes/not-found-route";
import { RouteError } from "./routes/route-error";
import { SignInRoute } from "./routes/sign-in-route";
import { SiteEditRoute } from "./routes/site-edit-route";
import { ChecklistRunRoute } from "./routes/checklist-run-route";
import { SiteNewRoute } from "./routes/site-new-route";
import { SitesRoute } from "./routes/sites-route";

function CampaignIndex() {
  const { campaignId = "" } = useParams();
  return <Navigate to={paths.sites(campaignId)} replace />;
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
              { path: "checklists/:runId", element: <ChecklistRunRoute /> },
              { path: "members", element: <MembersRoute /> },
              { path: "conflicts", element: <ConflictsRoute /> },
            ],
          },
          { path: "*", element: <NotFoundRoute /> },
        ],
      },
    ],
  },
]);
