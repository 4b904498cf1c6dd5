// The geodesist's side: the campaign's comparison runs with their state, and the ways to the
// benchmarks, instruments and the levelling network.
import { can } from "../../../shared/permissions";
import { officialHeightsCaution } from "../../../shared/schemas/comparison";
import { useRuns } from "../../features/comparison/api/list-runs";
import { RunList } from "../../features/comparison/components/run-list";
import { useRunResults } from "../../features/comparison/hooks/use-run-results";
import { useLocalSites } from "../../features/sites/hooks/use-local-sites";
import { LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { messageOf } from "../../lib/api-error";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";

export function HeightsRoute() {
  const { campaignId, role } = useCampaign();
  const runs = useRuns(campaignId);
  const withResults = useRunResults(campaignId, runs.data ?? []);
  const { sites } = useLocalSites(campaignId);
  const siteName = (id: string) =>
    sites?.find((s) => s.id === id)?.name ?? "Site not on this device";
  return (
    <>
      <PageHeader
        title="Heights"
        lead="Comparison runs and the height result of each"
        actions={
          can(role, "comparison.manage") ? (
            <LinkButton tone="primary" to={paths.newRun(campaignId)}>
              New run
            </LinkButton>
          ) : undefined
        }
      />
      <div className="flex flex-col gap-6">
        <Notice tone="attention" title="Campaign results">
          {officialHeightsCaution}
        </Notice>
        <section aria-labelledby="runs-heading" className="flex flex-col gap-3">
          <h2 id="runs-heading" className="text-xl font-semibold">
            Comparison runs
          </h2>
          {runs.isPending ? (
            <Loading label="Reading the runs…" />
          ) : runs.data === undefined ? (
            <Notice tone="danger" title="Runs not available">
              {messageOf(runs.error)}
            </Notice>
          ) : (
            <RunList
              runs={withResults}
              siteName={siteName}
              runHref={(id) => paths.run(campaignId, id)}
            />
          )}
        </section>
        <nav aria-label="Height links" className="flex flex-wrap gap-3">
          <LinkButton to={paths.benchmarks(campaignId)}>Benchmarks</LinkButton>
          <LinkButton to={paths.instruments(campaignId)}>Instruments</LinkButton>
          <LinkButton to={paths.heightNetwork(campaignId)}>Levelling network</LinkButton>
        </nav>
      </div>
    </>
  );
}
