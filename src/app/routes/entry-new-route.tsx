import { useNavigate, useParams, useSearchParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import type { EntryFlags } from "../../../shared/schemas/field-entries";
import { DewPointForm } from "../../features/field-entries/components/dew-point-form";
import { ObservationForm } from "../../features/field-entries/components/observation-form";
import { ShockEventForm } from "../../features/field-entries/components/shock-event-form";
import { ShockIndicatorForm } from "../../features/field-entries/components/shock-indicator-form";
import { useLocalSite } from "../../features/sites/hooks/use-local-sites";
import { LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { NotAllowed } from "../not-allowed";
import { NotFoundHere } from "../not-found-here";
import { paths } from "../paths";

/** Set by the entry forms once the entry committed on this device. */
export interface EntrySavedState {
  flags: EntryFlags;
}

const titles: Record<string, { title: string; lead: string }> = {
  "shock-indicator": {
    title: "Shock indicator",
    lead: "Read the label on the crate before it is moved again.",
  },
  "shock-log": { title: "Shock logger event", lead: "One event as the logger shows it." },
  "dew-point": {
    title: "Dew-point check",
    lead: "Before opening a crate that travelled cold: warm optics stay clear.",
  },
  observation: { title: "Observation", lead: "Anything worth keeping: damage, weather, delays." },
};

export function EntryNewRoute() {
  const { campaignId, role } = useCampaign();
  const { siteId = "", kind = "" } = useParams();
  const [search] = useSearchParams();
  const runId = search.get("run");
  const navigate = useNavigate();
  const site = useLocalSite(campaignId, siteId);
  const back = paths.siteBoard(campaignId, siteId);
  if (!can(role, "entry.record"))
    return <NotAllowed what="Your role can read field entries but not add them." backHref={back} />;
  if (site === undefined) return <Loading label="Reading the site on this device…" />;
  const heading = titles[kind];
  if (site === null || heading === undefined)
    return (
      <NotFoundHere title="Nothing to record here" backHref={paths.sites(campaignId)}>
        {site === null ? "This site is not on this device." : "This kind of entry does not exist."}
      </NotFoundHere>
    );
  const onSaved = (id: string, flags: EntryFlags) => {
    const state: EntrySavedState = { flags };
    navigate(paths.entry(campaignId, id), { state });
  };
  const props = { campaignId, siteId, onSaved };
  return (
    <>
      <PageHeader title={heading.title} lead={`${site.name} · ${heading.lead}`} />
      <div className="mb-4">
        <LinkButton tone="quiet" className="px-0" to={back}>
          Back to {site.name}
        </LinkButton>
      </div>
      {kind === "shock-indicator" && <ShockIndicatorForm {...props} />}
      {kind === "shock-log" && <ShockEventForm {...props} />}
      {kind === "observation" && <ObservationForm {...props} />}
      {kind === "dew-point" && <DewPointForm {...props} runId={runId} />}
    </>
  );
}
