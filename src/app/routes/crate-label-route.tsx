import { useParams } from "react-router-dom";
import { Button } from "../../components/button";
import { Loading } from "../../components/loading";
import { PageHeader } from "../../components/page-header";
import { CrateLabel } from "../../features/labels/crate-label";
import { LabelCheck } from "../../features/labels/label-check";
import { PrintOnlyMarked } from "../../features/labels/print-only";
import { useLocalCrates } from "../../features/labels/use-crates";
import { useCampaign } from "../layouts/campaign-layout";
import { NotFoundHere } from "../not-found-here";
import { paths } from "../paths";

export function CrateLabelRoute() {
  const { campaignId } = useCampaign();
  const { crateId = "" } = useParams();
  const crates = useLocalCrates(campaignId);
  if (crates === undefined) return <Loading label="Reading the crates on this device…" />;
  const crate = crates.find((c) => c.id === crateId);
  if (crate === undefined)
    return (
      <NotFoundHere title="Crate not found" backHref={paths.sites(campaignId)}>
        It may have been removed, or it is not on this device yet.
      </NotFoundHere>
    );
  return (
    <>
      <PrintOnlyMarked />
      <PageHeader
        title={`Label for ${crate.label}`}
        lead="Print it and fix it to the crate where a handler sees it first."
        actions={
          <Button tone="primary" onClick={() => window.print()}>
            Print label
          </Button>
        }
      />
      <div data-print-only className="mb-8">
        <CrateLabel crate={crate} />
      </div>
      <div className="print:hidden">
        <LabelCheck
          current={crate}
          crates={crates}
          labelHref={(id) => paths.crateLabel(campaignId, id)}
        />
      </div>
    </>
  );
}
