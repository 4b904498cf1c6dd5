// Height results for the report: per comparison run its facts, the stability plot and the run
// page's own result panel (ΔC, ΔH, budget, against levelling, time to target).
import type { ComparisonRunView } from "../../../../shared/schemas/comparison";
import { Loading } from "../../../components/loading";
import { Notice } from "../../../components/notice";
import { useAnalysis } from "../../../features/comparison/api/get-analysis";
import { useResult } from "../../../features/comparison/api/get-result";
import { useRuns } from "../../../features/comparison/api/list-runs";
import { HeightResultPanel } from "../../../features/comparison/components/height-result-panel";
import { StabilityChart } from "../../../features/comparison/components/stability-chart";
import { formatMm } from "../../../features/comparison/lib/durations";
import { ReportBlock } from "../../../features/report/components/report-section";
import { useLocalSites } from "../../../features/sites/hooks/use-local-sites";
import { messageOf } from "../../../lib/api-error";

function RunFacts({ run, siteName }: { run: ComparisonRunView; siteName: string }) {
  const facts: [string, string][] = [
    ["Remote site", siteName],
    ["Remote mark", run.remoteMark === "" ? "—" : run.remoteMark],
    ["Link", run.linkName === "" ? "—" : run.linkName],
    ["Target height uncertainty", formatMm(run.targetHeightUncertaintyM)],
    ["Planned uptime", `${Math.round(run.plannedUptime * 100)} %`],
    [
      "Reference height",
      run.referenceHeightM === null
        ? "—"
        : `${run.referenceHeightM.toFixed(3)} m ± ${formatMm(run.referenceHeightSigmaM ?? Number.NaN)}`,
    ],
  ];
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1 text-sm tabular-nums">
      {facts.map(([term, value]) => (
        <div key={term} className="contents">
          <dt className="text-muted">{term}</dt>
          <dd className="font-semibold">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

function RunReport({
  campaignId,
  run,
  siteName,
}: {
  campaignId: string;
  run: ComparisonRunView;
  siteName: string;
}) {
  const analysis = useAnalysis(campaignId, run.id);
  const result = useResult(campaignId, run.id);
  const stability = analysis.data?.analysis ?? null;
  return (
    <div data-testid="report-run" className="flex flex-col gap-4">
      <h3 className="text-xl font-semibold">{run.name}</h3>
      <RunFacts run={run} siteName={siteName} />
      {analysis.data?.state === "running" && <Loading label="Analysing the series…" />}
      {analysis.data?.state === "none" && <p className="text-muted">No series uploaded yet.</p>}
      {stability !== null && (
        <ReportBlock>
          <StabilityChart analysis={stability} testId="report-adev-chart" />
        </ReportBlock>
      )}
      {result.data !== undefined ? (
        <HeightResultPanel result={result.data} runName={run.name} />
      ) : result.isPending ? (
        <Loading label="Reading the height result…" />
      ) : (
        <Notice tone="danger" title="Height result not available">
          {messageOf(result.error)}
        </Notice>
      )}
    </div>
  );
}

export function RunsReport({ campaignId }: { campaignId: string }) {
  const runs = useRuns(campaignId);
  const { sites } = useLocalSites(campaignId);
  if (runs.isPending) return <Loading label="Reading the comparison runs…" />;
  if (runs.data === undefined)
    return (
      <Notice tone="danger" title="Comparison runs not available">
        {messageOf(runs.error)}
      </Notice>
    );
  if (runs.data.length === 0) return <p className="text-muted">No comparison runs yet.</p>;
  const siteName = (id: string) =>
    sites?.find((s) => s.id === id)?.name ?? "Site not on this device";
  return (
    <div className="flex flex-col gap-10">
      {runs.data.map((run) => (
        <RunReport
          key={run.id}
          campaignId={campaignId}
          run={run}
          siteName={siteName(run.remoteSiteId)}
        />
      ))}
    </div>
  );
}
