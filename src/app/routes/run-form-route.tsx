// New and edit pages of a comparison run: the sites come from this device's store, the clocks and
// links from the server (runs are edited online).
import { useNavigate, useParams } from "react-router-dom";
import { useInstruments } from "../../features/comparison/api/list-instruments";
import { useRun } from "../../features/comparison/api/get-run";
import { RunForm } from "../../features/comparison/components/run-form";
import { useLocalSites } from "../../features/sites/hooks/use-local-sites";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { messageOf } from "../../lib/api-error";
import { useConnectivity } from "../../lib/use-connectivity";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";
import type { ComparisonRunView } from "../../../shared/schemas/comparison";

function RunFormPage({ title, run }: { title: string; run: ComparisonRunView | null }) {
  const { campaignId } = useCampaign();
  const navigate = useNavigate();
  const online = useConnectivity() === "online";
  const { sites } = useLocalSites(campaignId);
  const instruments = useInstruments(campaignId);
  const back = run === null ? paths.heights(campaignId) : paths.run(campaignId, run.id);
  let body;
  if (!online)
    body = (
      <Notice tone="attention" title="Needs a connection">
        Comparison runs are edited online. Try again when this device has a network.
      </Notice>
    );
  else if (sites === undefined || instruments.isPending)
    body = <Loading label="Reading the sites and instruments…" />;
  else if (instruments.data === undefined)
    body = (
      <Notice tone="danger" title="Instruments not available">
        {messageOf(instruments.error)}
      </Notice>
    );
  else
    body = (
      <RunForm
        campaignId={campaignId}
        run={run}
        sites={sites.map((s) => ({ id: s.id, name: s.name }))}
        instruments={instruments.data}
        onSaved={(saved) => void navigate(paths.run(campaignId, saved.id))}
        onCancel={() => void navigate(back)}
      />
    );
  return (
    <>
      <PageHeader title={title} />
      {body}
    </>
  );
}

export function RunNewRoute() {
  return <RunFormPage title="New run" run={null} />;
}

export function RunEditRoute() {
  const { campaignId } = useCampaign();
  const { runId = "" } = useParams();
  const run = useRun(campaignId, runId);
  if (run.isPending) return <Loading label="Reading the run…" />;
  if (run.data === undefined)
    return (
      <Notice tone="danger" title="Run not available">
        {messageOf(run.error)}
      </Notice>
    );
  return <RunFormPage title="Edit run" run={run.data.run} />;
}
