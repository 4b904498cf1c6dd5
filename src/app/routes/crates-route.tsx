import { useState } from "react";
import { useNavigate } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { CrateForm } from "../../features/logistics/components/crate-form";
import { CrateList } from "../../features/logistics/components/crate-list";
import { useLogistics } from "../../features/logistics/hooks/use-logistics";
import { Button, LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";

export function CratesRoute() {
  const { campaignId, role } = useCampaign();
  const data = useLogistics(campaignId);
  const navigate = useNavigate();
  const [adding, setAdding] = useState(false);
  if (data === undefined) return <Loading label="Reading the crates on this device…" />;
  const open = data.alerts.filter((a) => a.acknowledgedAt === null).length;
  return (
    <>
      <PageHeader
        title="Crates"
        lead="Where each crate is, who holds it, and its limits"
        actions={
          <>
            {can(role, "handover.record") && (
              <LinkButton tone="primary" to={paths.handover(campaignId)}>
                Hand over a crate
              </LinkButton>
            )}
            <LinkButton to={paths.alerts(campaignId)}>
              {open === 0 ? "Alerts" : `Alerts (${open} open)`}
            </LinkButton>
            {can(role, "crate.manage") && !adding && (
              <Button onClick={() => setAdding(true)}>New crate</Button>
            )}
          </>
        }
      />
      {adding && (
        <div className="mb-6">
          <CrateForm
            campaignId={campaignId}
            crate={null}
            onDone={(crate) => void navigate(paths.crate(campaignId, crate.id))}
            onCancel={() => setAdding(false)}
          />
        </div>
      )}
      <CrateList
        crates={data.crates}
        legs={data.legs}
        sites={data.sites}
        crateHref={(id) => paths.crate(campaignId, id)}
      />
    </>
  );
}
