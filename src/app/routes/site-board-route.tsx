// The crew's home at a site: what to record, the open checklists, the crates here and any limit
// exceeded, the latest entries, what waits to be sent and how long the comparison still has to run.
import { useState, type ReactNode } from "react";
import { Navigate, useParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { SiteTimeLeft } from "../../features/comparison/components/site-time-left";
import { SiteChecklists } from "../../features/checklists/components/site-checklists";
import { CratesOnSite } from "../../features/field-entries/components/crates-on-site";
import { EntryList } from "../../features/field-entries/components/entry-list";
import { useCrates, useSiteEntries } from "../../features/field-entries/hooks/use-field-entries";
import { SiteSections } from "../../features/levelling/components/site-sections";
import { useLogistics } from "../../features/logistics/hooks/use-logistics";
import { cratePlace } from "../../db/logistics-queries";
import { useLocalSite, useLocalSites } from "../../features/sites/hooks/use-local-sites";
import { SyncCard } from "../../features/sync/components/sync-card";
import { SentBackList } from "../../features/review/components/sent-back-list";
import { useSentBack } from "../../features/review/hooks/use-local-reviews";
import { Button, LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { StatusShape } from "../../components/status-shape";
import { readCurrentSite, writeCurrentSite } from "../../lib/current-site";
import { useCampaign } from "../layouts/campaign-layout";
import { NotFoundHere } from "../not-found-here";
import { paths } from "../paths";
import type { LocalLeg } from "../../db/database";

function Section({ title, children }: { title: string; children: ReactNode }) {
  const id = `board-${title.toLowerCase().replace(/\W+/g, "-")}`;
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3">
      <h2 id={id} className="text-xl font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** Where each crate's legs put it, seen from this site. */
function placedBy(legs: readonly LocalLeg[], siteId: string): Map<string, "here" | "elsewhere"> {
  const byCrate = new Map<string, LocalLeg[]>();
  for (const leg of legs) byCrate.set(leg.crateId, [...(byCrate.get(leg.crateId) ?? []), leg]);
  const placed = new Map<string, "here" | "elsewhere">();
  for (const [crateId, crateLegs] of byCrate) {
    const place = cratePlace(crateLegs);
    if (place.kind === "at") placed.set(crateId, place.siteId === siteId ? "here" : "elsewhere");
    if (place.kind === "moving") placed.set(crateId, "elsewhere");
  }
  return placed;
}

function TimeLeftCard() {
  const { campaignId } = useCampaign();
  const { siteId = "" } = useParams();
  return <SiteTimeLeft campaignId={campaignId} siteId={siteId} />;
}

function AlertsCard({ count }: { count: number }) {
  return (
    <section
      aria-label="Limit alerts"
      className={`flex flex-col gap-2 rounded-xl border-2 p-4 ${count > 0 ? "border-danger bg-danger-soft text-danger-ink" : "border-line bg-surface"}`}
    >
      <h2 className="text-sm font-semibold tracking-wide uppercase">Limit alerts</h2>
      <p className="flex items-center gap-2 text-lg font-semibold">
        <StatusShape
          shape={count > 0 ? "octagon" : "disc"}
          className={count > 0 ? "text-danger" : "text-primary"}
        />
        {count === 0
          ? "None"
          : count === 1
            ? "1 entry beyond limits"
            : `${count} entries beyond limits`}
      </p>
    </section>
  );
}

export function SiteBoardRoute() {
  const { campaignId, role } = useCampaign();
  const { siteId = "" } = useParams();
  const site = useLocalSite(campaignId, siteId);
  const entries = useSiteEntries(campaignId, siteId);
  const crates = useCrates(campaignId);
  const logistics = useLogistics(campaignId);
  const sentBack = useSentBack(campaignId);
  const [current, setCurrent] = useState(() => readCurrentSite(campaignId));

  if (site === undefined || entries === undefined || crates === undefined)
    return <Loading label="Reading the site on this device…" />;
  if (site === null)
    return (
      <NotFoundHere title="Site not found" backHref={paths.sites(campaignId)}>
        It may have been deleted, or it is not on this device yet.
      </NotFoundHere>
    );
  const mine = current === site.id;
  const choose = (id: string | null) => {
    writeCurrentSite(campaignId, id);
    setCurrent(id);
  };
  const alerts = entries.filter((e) => e.flags.exceeded);
  const canRecord = can(role, "entry.record");
  const record = (kind: string, label: string) => (
    <LinkButton key={kind} to={paths.newEntry(campaignId, site.id, kind)} className="justify-start">
      {label}
    </LinkButton>
  );
  const entryHref = (id: string) => paths.entry(campaignId, id);
  return (
    <>
      <PageHeader
        title={site.name}
        lead={
          mine ? (
            <span className="flex items-center gap-2">
              <StatusShape shape="disc" className="text-primary" /> This tablet's site
            </span>
          ) : (
            "Site board"
          )
        }
        actions={
          <>
            {mine ? (
              <Button tone="quiet" onClick={() => choose(null)}>
                Not at this site any more
              </Button>
            ) : (
              <Button onClick={() => choose(site.id)}>I am at this site</Button>
            )}
            {can(role, "site.write") && (
              <LinkButton to={paths.editSite(campaignId, site.id)}>Site details</LinkButton>
            )}
          </>
        }
      />
      <div className="flex flex-col gap-8">
        <div className="grid gap-4 md:grid-cols-3">
          <SyncCard />
          <AlertsCard count={alerts.length} />
          <TimeLeftCard />
        </div>
        <SentBackList
          reviews={sentBack ?? []}
          recordHref={(r) => paths.reviewSubject(campaignId, r.subjectKind, r.subjectId)}
        />
        {canRecord && (
          <Section title="Record">
            <div className="grid grid-cols-2 gap-3 lg:grid-cols-4">
              {record("shock-indicator", "Shock indicator")}
              {record("shock-log", "Shock logger event")}
              {record("dew-point", "Dew-point check")}
              {record("observation", "Observation")}
              <LinkButton
                to={paths.entryImport(campaignId, site.id, "shock-log")}
                className="justify-start"
              >
                Import shock logger file
              </LinkButton>
              <LinkButton
                to={paths.entryImport(campaignId, site.id, "temperatures")}
                className="justify-start"
              >
                Import temperature file
              </LinkButton>
            </div>
          </Section>
        )}
        <div className="flex flex-wrap gap-3">
          <LinkButton to={paths.temperatures(campaignId, site.id)}>Temperatures</LinkButton>
          <LinkButton to={paths.levelling(campaignId, site.id)}>Levelling field books</LinkButton>
          {can(role, "handover.record") && (
            <LinkButton to={paths.handover(campaignId)}>Hand over a crate</LinkButton>
          )}
        </div>
        <SiteChecklists
          campaignId={campaignId}
          siteId={site.id}
          canRecord={can(role, "checklist.record")}
          runHref={(runId) => paths.checklistRun(campaignId, runId)}
        />
        {alerts.length > 0 && (
          <Section title="Beyond limits">
            <EntryList
              label="Entries beyond limits"
              entries={alerts}
              crates={crates}
              entryHref={entryHref}
              empty=""
            />
          </Section>
        )}
        <div className="grid gap-8 lg:grid-cols-2">
          <Section title="Crates here">
            <CratesOnSite
              entries={entries}
              crates={crates}
              placed={placedBy(logistics?.legs ?? [], site.id)}
            />
          </Section>
          <Section title="Levelling">
            <SiteSections
              campaignId={campaignId}
              siteId={site.id}
              sectionHref={(id) => paths.levellingSection(campaignId, id)}
            />
          </Section>
          <Section title="Latest entries">
            <EntryList
              label="Latest entries"
              entries={entries.slice(0, 8)}
              crates={crates}
              entryHref={entryHref}
              empty="Nothing recorded at this site yet."
            />
          </Section>
        </div>
      </div>
    </>
  );
}

/** The board of the site chosen on this tablet, or the choice of one. */
export function BoardRoute() {
  const { campaignId } = useCampaign();
  const { sites } = useLocalSites(campaignId);
  const current = readCurrentSite(campaignId);
  if (sites === undefined) return <Loading label="Reading the sites on this device…" />;
  if (current !== null && sites.some((s) => s.id === current))
    return <Navigate to={paths.siteBoard(campaignId, current)} replace />;
  return (
    <>
      <PageHeader
        title="Which site are you at?"
        lead="The board of that site opens here from now on."
      />
      {sites.length === 0 ? (
        <Notice tone="attention" title="No sites on this device yet">
          Sync once with a connection to bring the campaign's sites here.
        </Notice>
      ) : (
        <ul aria-label="Sites" className="grid gap-3 md:grid-cols-2">
          {sites.map((site) => (
            <li key={site.id}>
              <LinkButton
                to={paths.siteBoard(campaignId, site.id)}
                onClick={() => writeCurrentSite(campaignId, site.id)}
                className="w-full justify-start"
              >
                {site.name}
              </LinkButton>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
