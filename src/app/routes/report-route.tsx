// The printable campaign report: composed here from the features' own data and components, in
// the browser, from what this device holds (local store and persisted query cache).
import { lazy, Suspense, useState } from "react";
import { can } from "../../../shared/permissions";
import { officialHeightsCaution } from "../../../shared/schemas/comparison";
import { Loading } from "../../components/loading";
import { useCampaigns } from "../../features/campaigns/api/get-campaigns";
import { ReportDocument } from "../../features/report/components/report-document";
import { ReportSection } from "../../features/report/components/report-section";
import {
  ReportFooter,
  ReportTitleBlock,
} from "../../features/report/components/report-title-block";
import { SitesTable } from "../../features/report/components/sites-table";
import { TransportSummaryList } from "../../features/report/components/transport-summary-list";
import { useTransportSummary } from "../../features/report/hooks/use-transport-records";
import { useLocalSites } from "../../features/sites/hooks/use-local-sites";
import { formatUtc } from "../../lib/format";
import { useSession } from "../../lib/use-session";
import { useCampaign } from "../layouts/campaign-layout";
import { NotAllowed } from "../not-allowed";
import { paths } from "../paths";
import { LevellingReport } from "./report/levelling-report";
import { RunsReport } from "./report/runs-report";

// The land outlines are large: load the map part only when the report opens.
const ReportMap = lazy(() => import("./report/report-map"));

function SitesPart({ campaignId }: { campaignId: string }) {
  const { sites } = useLocalSites(campaignId);
  return (
    <ReportSection
      id="report-sites"
      title="Sites"
      lead="Sites, benchmarks and the crates' last known places, from this device's copy."
    >
      <Suspense fallback={<Loading label="Loading the map…" />}>
        <ReportMap campaignId={campaignId} />
      </Suspense>
      {sites === undefined ? <Loading label="Reading the sites…" /> : <SitesTable sites={sites} />}
    </ReportSection>
  );
}

function TransportPart({ campaignId }: { campaignId: string }) {
  const crates = useTransportSummary(campaignId);
  return (
    <ReportSection
      id="report-transport"
      title="Transport"
      lead="Per crate: legs travelled, shocks and temperatures beyond the crate's limits, handovers and open alerts."
    >
      {crates === undefined ? (
        <Loading label="Reading the transport log…" />
      ) : (
        <TransportSummaryList crates={crates} />
      )}
    </ReportSection>
  );
}

function CampaignReport({
  campaignId,
  campaignName,
}: {
  campaignId: string;
  campaignName: string;
}) {
  const session = useSession();
  const campaigns = useCampaigns();
  // Fixed when the page opens: the paper says when its numbers were read.
  const [printedAt] = useState(() => new Date().toISOString());
  const printedBy = session.status === "signed-in" ? session.user.name : "—";
  const description = campaigns.data?.find((c) => c.id === campaignId)?.description;
  return (
    <ReportDocument
      documentTitle={`${campaignName} — campaign report`}
      footerText={`${campaignName} · ${officialHeightsCaution}`}
    >
      <ReportTitleBlock
        campaignName={campaignName}
        description={description}
        printedAtIso={printedAt}
        printedBy={printedBy}
        caution={officialHeightsCaution}
      />
      <SitesPart campaignId={campaignId} />
      <ReportSection
        id="report-heights"
        title="Height results"
        lead="Per comparison run: stability, ΔC and ΔH with the uncertainty budget, the levelled comparison and the time to target."
      >
        <RunsReport campaignId={campaignId} />
      </ReportSection>
      <ReportSection
        id="report-levelling"
        title="Levelling"
        lead="The latest least-squares adjustment of the levelling network."
      >
        <LevellingReport campaignId={campaignId} />
      </ReportSection>
      <TransportPart campaignId={campaignId} />
      <ReportFooter
        caution={officialHeightsCaution}
        generator={`Printed by ${printedBy}, ${formatUtc(printedAt)}, from Equipot.`}
      />
    </ReportDocument>
  );
}

export function ReportRoute() {
  const { campaignId, campaignName, role } = useCampaign();
  if (!can(role, "campaign.export"))
    return (
      <NotAllowed
        what="The printable campaign report is for reviewers, geodesists and administrators."
        backHref={paths.sites(campaignId)}
      />
    );
  return <CampaignReport campaignId={campaignId} campaignName={campaignName} />;
}
