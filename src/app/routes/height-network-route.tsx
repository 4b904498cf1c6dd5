// The levelling network: its observations, the tie import, the adjustment's options and the
// latest kept result (heights, residuals, global test), read from the persisted query cache offline.
import { useState, type ReactNode } from "react";
import { can } from "../../../shared/permissions";
import { officialHeightsCaution } from "../../../shared/schemas/comparison";
import type { AdjustmentOptions } from "../../../shared/schemas/height-network";
import { useLatestAdjustment } from "../../features/height-network/api/get-latest-adjustment";
import { useNetworkObservations } from "../../features/height-network/api/get-observations";
import { useRunAdjustment } from "../../features/height-network/api/run-adjustment";
import { AdjustForm, readOptions } from "../../features/height-network/components/adjust-form";
import { AdjustedHeights } from "../../features/height-network/components/adjusted-heights";
import { AdjustmentSummary } from "../../features/height-network/components/adjustment-summary";
import { ImportPanel } from "../../features/height-network/components/import-panel";
import { ObservationsTable } from "../../features/height-network/components/observations-table";
import { ResidualsTable } from "../../features/height-network/components/residuals-table";
import { Button, LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { messageOf } from "../../lib/api-error";
import { parseDecimal } from "../../lib/format";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3">
      <h2 id={id} className="text-xl font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

export function HeightNetworkRoute() {
  const { campaignId, role } = useCampaign();
  const mayAdjust = can(role, "levelling.adjust");
  const observations = useNetworkObservations(campaignId);
  const latest = useLatestAdjustment(campaignId);
  const adjusting = useRunAdjustment(campaignId);
  const view = latest.data ?? null;
  // Until the person edits them, the options are those the latest adjustment used.
  const [sigmaDraft, setSigmaText] = useState<string | null>(null);
  const [significanceDraft, setSignificanceText] = useState<string | null>(null);
  const [excluded, setExcluded] = useState<string[] | null>(null);
  const sigmaText = sigmaDraft ?? String(view?.options.sigmaPerSqrtKmMm ?? 1);
  const significanceText = significanceDraft ?? String(view?.options.significance ?? 0.05);
  const leftOut = excluded ?? view?.options.excluded ?? [];
  const run = (options: AdjustmentOptions) => {
    setExcluded(options.excluded);
    adjusting.mutate(options);
  };
  const leaveOut = (sourceId: string) => {
    const read = readOptions(sigmaText, significanceText, [...leftOut, sourceId]);
    if ("options" in read) run(read.options);
  };
  const putBack = (sourceId: string) => setExcluded(leftOut.filter((id) => id !== sourceId));
  const current = observations.data;
  const outOfDate =
    view !== null && current !== undefined && current.length !== view.observationCount;
  const sigmaForTable = parseDecimal(sigmaText) > 0 ? parseDecimal(sigmaText) : 1;
  const markOf = (id: string) => {
    const o = current?.find((x) => x.sourceId === id);
    return o === undefined
      ? "an observation no longer in the network"
      : `${o.fromMark} → ${o.toMark}`;
  };
  return (
    <>
      <PageHeader
        title="Levelling network"
        lead="Field-book sections and imported ties, adjusted by least squares on the benchmarks"
        actions={<LinkButton to={paths.heights(campaignId)}>Heights</LinkButton>}
      />
      <div className="flex flex-col gap-8">
        <Notice tone="attention" title="Campaign results">
          {officialHeightsCaution}
        </Notice>
        <Section id="observations-heading" title="Observations">
          {observations.isPending ? (
            <Loading label="Reading the network…" />
          ) : current === undefined ? (
            <Notice tone="danger" title="Network not available">
              {messageOf(observations.error)}
            </Notice>
          ) : (
            <ObservationsTable observations={current} sigmaPerSqrtKmMm={sigmaForTable} />
          )}
        </Section>
        {mayAdjust && <ImportPanel campaignId={campaignId} />}
        {mayAdjust && (
          <div className="flex flex-col gap-3">
            <AdjustForm
              sigmaText={sigmaText}
              significanceText={significanceText}
              onSigmaText={setSigmaText}
              onSignificanceText={setSignificanceText}
              excluded={leftOut}
              pending={adjusting.isPending}
              onAdjust={run}
            />
            {leftOut.length > 0 && (
              <ul aria-label="Left out of the adjustment" className="flex flex-col gap-2">
                {leftOut.map((id) => (
                  <li key={id} className="flex flex-wrap items-center gap-3">
                    <span>Left out: {markOf(id)}</span>
                    <Button tone="quiet" onClick={() => putBack(id)}>
                      Put back
                    </Button>
                  </li>
                ))}
              </ul>
            )}
            {adjusting.isError && (
              <Notice tone="danger" title="Not adjusted" live>
                {messageOf(adjusting.error)}
              </Notice>
            )}
          </div>
        )}
        <Section id="result-heading" title="Latest result">
          {latest.isPending ? (
            <Loading label="Reading the latest adjustment…" />
          ) : latest.isError && view === null ? (
            <Notice tone="danger" title="Result not available">
              {messageOf(latest.error)}
            </Notice>
          ) : view === null ? (
            <p className="text-muted">The network has not been adjusted yet.</p>
          ) : (
            <>
              {outOfDate && (
                <Notice tone="attention" title="Network changed since">
                  This result used {view.observationCount} observations; the network now has{" "}
                  {current.length}. Adjust again to include the changes.
                </Notice>
              )}
              <AdjustmentSummary view={view} />
              <h3 className="text-lg font-semibold">Adjusted heights</h3>
              <AdjustedHeights points={view.points} />
              <h3 className="text-lg font-semibold">Residuals</h3>
              <ResidualsTable
                observations={view.observations}
                onLeaveOut={mayAdjust ? leaveOut : null}
                pending={adjusting.isPending}
              />
            </>
          )}
        </Section>
      </div>
    </>
  );
}
