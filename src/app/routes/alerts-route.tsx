import { can } from "../../../shared/permissions";
import { AlertList } from "../../features/logistics/components/alert-list";
import { useLogistics } from "../../features/logistics/hooks/use-logistics";
import { Loading } from "../../components/loading";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";

export function AlertsRoute() {
  const { campaignId, role } = useCampaign();
  const data = useLogistics(campaignId);
  if (data === undefined) return <Loading label="Reading the alerts on this device…" />;
  const open = data.alerts.filter((a) => a.acknowledgedAt === null).length;
  return (
    <>
      <PageHeader
        title="Alerts"
        lead={open === 0 ? "None open" : `${open} not yet acknowledged · newest first`}
      />
      <AlertList
        campaignId={campaignId}
        alerts={data.alerts}
        crates={data.crates}
        canAcknowledge={can(role, "alert.acknowledge")}
      />
    </>
  );
}
