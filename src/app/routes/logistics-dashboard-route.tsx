import { useEffect, useState } from "react";
import { can } from "../../../shared/permissions";
import { LogisticsDashboard } from "../../features/logistics/components/logistics-dashboard";
import { PlanLegForm } from "../../features/logistics/components/plan-leg-form";
import { useLogistics } from "../../features/logistics/hooks/use-logistics";
import { Loading } from "../../components/loading";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { NotAllowed } from "../not-allowed";
import { paths } from "../paths";

/** A clock for "overdue": once a minute is enough for planned arrivals. */
function useNow(everyMs = 60_000) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), everyMs);
    return () => clearInterval(timer);
  }, [everyMs]);
  return now;
}

export function LogisticsDashboardRoute() {
  const { campaignId, role } = useCampaign();
  const data = useLogistics(campaignId);
  const now = useNow();
  if (!can(role, "leg.plan"))
    return (
      <NotAllowed
        what="The logistics dashboard is for logistics and admins."
        backHref={paths.crates(campaignId)}
      />
    );
  if (data === undefined) return <Loading label="Reading logistics on this device…" />;
  return (
    <>
      <PageHeader title="Logistics" lead="Crates, legs, custody and alerts across the campaign" />
      <div className="flex flex-col gap-8">
        {/* What needs attention first; planning below it. */}
        <LogisticsDashboard
          {...data}
          now={now}
          crateHref={(id) => paths.crate(campaignId, id)}
          alertsHref={paths.alerts(campaignId)}
          handoverHref={(id) => paths.handover(campaignId, id)}
        />
        <PlanLegForm campaignId={campaignId} crates={data.crates} sites={data.sites} />
      </div>
    </>
  );
}
