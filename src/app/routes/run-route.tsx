// One comparison run: its facts, files, the upload with local preview, and the results.
import { useParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { officialHeightsCaution } from "../../../shared/schemas/comparison";
import { useAnalysis } from "../../features/comparison/api/get-analysis";
import { useResult } from "../../features/comparison/api/get-result";
import { useRun } from "../../features/comparison/api/get-run";
import { useDeleteFile } from "../../features/comparison/api/delete-file";
import { FilesList } from "../../features/comparison/components/files-list";
import { HeightResultPanel } from "../../features/comparison/components/height-result-panel";
import { SeriesChart } from "../../features/comparison/components/series-chart";
import { StabilityChart } from "../../features/comparison/components/stability-chart";
import { UploadPanel } from "../../features/comparison/components/upload-panel";
import { formatMm } from "../../features/comparison/lib/durations";
import { useLocalSites } from "../../features/sites/hooks/use-local-sites";
import { LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { messageOf } from "../../lib/api-error";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";

function Results({
  campaignId,
  runId,
  runName,
}: {
  campaignId: string;
  runId: string;
  runName: string;
}) {
  const analysis = useAnalysis(campaignId, runId);
  const result = useResult(campaignId, runId);
  const state = analysis.data?.state;
  return (
    <section aria-labelledby="results-heading" className="flex flex-col gap-4">
      <h2 id="results-heading" className="text-xl font-semibold">
        Results
      </h2>
      {state === "running" && (
        <p role="status" className="font-semibold" data-testid="analysing">
          Analysing…
        </p>
      )}
      {analysis.data?.analysis != null && (
        <>
          <StabilityChart analysis={analysis.data.analysis} testId="adev-chart" />
          <SeriesChart display={analysis.data.analysis.display} />
        </>
      )}
      {state === "none" && <p className="text-muted">No data yet: upload a series file.</p>}
      {result.data !== undefined ? (
        <HeightResultPanel result={result.data} runName={runName} />
      ) : result.isPending ? (
        <Loading label="Reading the height result…" />
      ) : (
        <Notice tone="danger" title="Height result not available">
          {messageOf(result.error)}
        </Notice>
      )}
    </section>
  );
}

export function RunRoute() {
  const { campaignId, role } = useCampaign();
  const { runId = "" } = useParams();
  const run = useRun(campaignId, runId);
  const { sites } = useLocalSites(campaignId);
  const removeFile = useDeleteFile(campaignId, runId);
  if (run.isPending) return <Loading label="Reading the run…" />;
  if (run.data === undefined)
    return (
      <Notice tone="danger" title="Run not available">
        {messageOf(run.error)}
      </Notice>
    );
  const { run: r, files } = run.data;
  const manage = can(role, "comparison.manage");
  const site = sites?.find((s) => s.id === r.remoteSiteId)?.name ?? "Site not on this device";
  return (
    <>
      <PageHeader
        title={r.name}
        lead={`Remote site: ${site}`}
        actions={
          manage ? (
            <LinkButton to={paths.editRun(campaignId, r.id)}>Edit run</LinkButton>
          ) : undefined
        }
      />
      <div className="flex flex-col gap-6">
        <Notice tone="attention" title="Campaign results">
          {officialHeightsCaution}
        </Notice>
        <dl className="grid gap-3 rounded-xl border-2 border-line bg-surface p-4 tabular-nums sm:grid-cols-3">
          <div>
            <dt className="text-sm text-muted">Target height uncertainty</dt>
            <dd className="font-semibold">{formatMm(r.targetHeightUncertaintyM)}</dd>
          </div>
          <div>
            <dt className="text-sm text-muted">Planned uptime</dt>
            <dd className="font-semibold">{Math.round(r.plannedUptime * 100)} %</dd>
          </div>
          <div>
            <dt className="text-sm text-muted">Remote mark</dt>
            <dd className="font-semibold">{r.remoteMark === "" ? "—" : r.remoteMark}</dd>
          </div>
          <div>
            <dt className="text-sm text-muted">Reference height</dt>
            <dd className="font-semibold">
              {r.referenceHeightM === null
                ? "—"
                : `${r.referenceHeightM.toFixed(3)} m ± ${formatMm(r.referenceHeightSigmaM ?? Number.NaN)}`}
            </dd>
          </div>
          <div>
            <dt className="text-sm text-muted">Link</dt>
            <dd className="font-semibold">{r.linkName === "" ? "—" : r.linkName}</dd>
          </div>
          {r.notes !== "" && (
            <div className="sm:col-span-3">
              <dt className="text-sm text-muted">Notes</dt>
              <dd>{r.notes}</dd>
            </div>
          )}
        </dl>
        <section aria-labelledby="files-heading" className="flex flex-col gap-3">
          <h2 id="files-heading" className="text-xl font-semibold">
            Files
          </h2>
          <FilesList
            files={files}
            canRemove={manage}
            removing={removeFile.isPending}
            onRemove={(id) => removeFile.mutate(id)}
          />
          {removeFile.error !== null && (
            <Notice tone="danger" title="Not removed">
              {messageOf(removeFile.error)}
            </Notice>
          )}
        </section>
        {manage && <UploadPanel campaignId={campaignId} runId={r.id} />}
        <Results campaignId={campaignId} runId={r.id} runName={r.name} />
      </div>
    </>
  );
}
