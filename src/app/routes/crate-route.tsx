import { useState } from "react";
import { useParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { cratePlace, currentHolder, shownCrateState } from "../../db/logistics-queries";
import { AlertList } from "../../features/logistics/components/alert-list";
import { CrateCautions } from "../../features/logistics/components/crate-cautions";
import { CrateForm } from "../../features/logistics/components/crate-form";
import { CrateLegs } from "../../features/logistics/components/crate-legs";
import { CrateLimits } from "../../features/logistics/components/crate-limits";
import { describePlace } from "../../features/logistics/components/crate-place";
import { CustodyChain } from "../../features/logistics/components/custody-chain";
import { PlanLegForm } from "../../features/logistics/components/plan-leg-form";
import { CrateStateWord } from "../../features/logistics/components/status-word";
import { useCrateRecord, useLogistics } from "../../features/logistics/hooks/use-logistics";
import { Button, LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { useApprovedIds } from "../../features/review/hooks/use-local-reviews";
import { RecordHistory } from "../../features/review/components/record-history";
import { NotFoundHere } from "../not-found-here";
import { paths } from "../paths";

export function CrateRoute() {
  const { campaignId, role } = useCampaign();
  const { crateId = "" } = useParams();
  const record = useCrateRecord(campaignId, crateId);
  const all = useLogistics(campaignId);
  const approvedIds = useApprovedIds(campaignId);
  const [editing, setEditing] = useState(false);
  if (record === undefined || all === undefined)
    return <Loading label="Reading the crate on this device…" />;
  if (record === null)
    return (
      <NotFoundHere title="Crate not found" backHref={paths.crates(campaignId)}>
        It is not on this device yet, or it was removed.
      </NotFoundHere>
    );
  const { crate, legs, chain, alerts, sites, photos } = record;
  const siteName = (id: string) =>
    sites.find((s) => s.id === id)?.name ?? "a site not on this device";
  const holder = currentHolder(chain);
  return (
    <>
      <PageHeader
        title={crate.label}
        lead={crate.contents}
        actions={
          <>
            {can(role, "handover.record") && (
              <LinkButton tone="primary" to={paths.handover(campaignId, crate.id)}>
                Hand over
              </LinkButton>
            )}
            {can(role, "crate.manage") && !editing && (
              <Button onClick={() => setEditing(true)}>Edit crate</Button>
            )}
          </>
        }
      />
      <div className="mb-4">
        <LinkButton tone="quiet" className="px-0" to={paths.crates(campaignId)}>
          All crates
        </LinkButton>
      </div>
      <div className="flex flex-col gap-8">
        {editing && (
          <CrateForm
            campaignId={campaignId}
            crate={crate}
            onDone={() => setEditing(false)}
            onCancel={() => setEditing(false)}
          />
        )}
        <section aria-labelledby="crate-details" className="flex flex-col gap-2">
          <h2 id="crate-details" className="text-xl font-semibold">
            Details
          </h2>
          <CrateStateWord state={shownCrateState(crate, legs)} />
          <p>{describePlace(cratePlace(legs), siteName)}</p>
          <p>{holder === null ? "No handover recorded yet" : `With ${holder}`}</p>
          <p>
            Limits: <CrateLimits crate={crate} />
          </p>
          {crate.instrument !== "" && <p>Instrument: {crate.instrument}</p>}
          {crate.notes !== "" && <p className="whitespace-pre-line">{crate.notes}</p>}
          <CrateCautions crate={crate} />
        </section>
        <section aria-labelledby="crate-custody" className="flex flex-col gap-3">
          <h2 id="crate-custody" className="text-xl font-semibold">
            Chain of custody
          </h2>
          <CustodyChain
            chain={chain}
            sites={sites}
            photos={photos}
            handoverHref={(id) => paths.handoverRecord(campaignId, id)}
          />
        </section>
        <section aria-labelledby="crate-legs" className="flex flex-col gap-3">
          <h2 id="crate-legs" className="text-xl font-semibold">
            Legs
          </h2>
          <CrateLegs
            campaignId={campaignId}
            legs={legs}
            sites={sites}
            canRecord={can(role, "leg.record")}
            canPlan={can(role, "leg.plan")}
            approvedIds={approvedIds}
          />
          {can(role, "leg.plan") && (
            <PlanLegForm
              campaignId={campaignId}
              crates={all.crates}
              sites={sites}
              crateId={crate.id}
            />
          )}
        </section>
        <section aria-labelledby="crate-alerts" className="flex flex-col gap-3">
          <h2 id="crate-alerts" className="text-xl font-semibold">
            Alerts for {crate.label}
          </h2>
          <AlertList
            campaignId={campaignId}
            alerts={alerts}
            crates={[crate]}
            canAcknowledge={can(role, "alert.acknowledge")}
            label={`Alerts for ${crate.label}`}
          />
        </section>
        {crate.state === "held" && (
          <Notice tone="danger" title="Held for inspection">
            Do not move or open this crate until logistics releases it.
          </Notice>
        )}
        {can(role, "audit.read") && (
          <RecordHistory campaignId={campaignId} entity="crate" id={crate.id} />
        )}
      </div>
    </>
  );
}
