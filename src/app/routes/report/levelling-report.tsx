// The latest adjustment of the levelling network, with the network page's own summary and table.
import { Loading } from "../../../components/loading";
import { Notice } from "../../../components/notice";
import { useLatestAdjustment } from "../../../features/height-network/api/get-latest-adjustment";
import { AdjustedHeights } from "../../../features/height-network/components/adjusted-heights";
import { AdjustmentSummary } from "../../../features/height-network/components/adjustment-summary";
import { ReportBlock } from "../../../features/report/components/report-section";
import { messageOf } from "../../../lib/api-error";

export function LevellingReport({ campaignId }: { campaignId: string }) {
  const latest = useLatestAdjustment(campaignId);
  if (latest.isPending) return <Loading label="Reading the latest adjustment…" />;
  if (latest.isError && latest.data === undefined)
    return (
      <Notice tone="danger" title="Adjustment not available">
        {messageOf(latest.error)}
      </Notice>
    );
  const view = latest.data ?? null;
  if (view === null) return <p className="text-muted">The network has not been adjusted yet.</p>;
  return (
    <div data-testid="report-levelling" className="flex flex-col gap-4">
      <ReportBlock title="Adjustment">
        <AdjustmentSummary view={view} />
      </ReportBlock>
      <ReportBlock title="Adjusted heights">
        <AdjustedHeights points={view.points} />
      </ReportBlock>
    </div>
  );
}
