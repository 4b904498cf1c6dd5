// The coordinator's view: crates by state, open alerts, overdue legs, handovers still owed after
// an arrival, and every leg in a sortable table.
import { Link } from "react-router-dom";
import type { CrateView } from "../../../../shared/schemas/crates";
import { crateStates } from "../../../../shared/schemas/logistics";
import type { LocalAlert, LocalHandover, LocalLeg, LocalSite } from "../../../db/database";
import { countByState, overdueLegs, pendingHandovers } from "../../../db/logistics-queries";
import { StatusShape } from "../../../components/status-shape";
import { useLegRows } from "./leg-columns";
import { LegsTable } from "./legs-table";
import { CrateStateWord } from "./status-word";
import { TimeText } from "../../../components/local-time-field";

interface Props {
  crates: readonly CrateView[];
  legs: readonly LocalLeg[];
  handovers: readonly LocalHandover[];
  alerts: readonly LocalAlert[];
  sites: readonly LocalSite[];
  now: number;
  crateHref: (crateId: string) => string;
  alertsHref: string;
  handoverHref: (crateId: string) => string;
}

export function LogisticsDashboard(props: Props) {
  const { crates, legs, handovers, alerts, sites, now, crateHref, alertsHref, handoverHref } =
    props;
  const counts = countByState(crates, crateStates);
  const open = alerts.filter((a) => a.acknowledgedAt === null);
  const overdue = overdueLegs(legs, now);
  const owed = pendingHandovers(legs, handovers);
  const crateLabel = (id: string) =>
    crates.find((c) => c.id === id)?.label ?? "Crate not on this device";
  const siteName = (id: string) =>
    sites.find((s) => s.id === id)?.name ?? "Site not on this device";
  const rows = useLegRows(legs, crates, sites, overdue.map((l) => l.id).join(" "));
  const legLine = (l: LocalLeg) =>
    `${crateLabel(l.crateId)}: ${siteName(l.fromSiteId)} → ${siteName(l.toSiteId)}`;
  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="by-state">
        <h2 id="by-state" className="mb-3 text-xl font-semibold">
          Crates by state
        </h2>
        <ul className="grid gap-2 md:grid-cols-3">
          {crateStates.map((s) => (
            <li
              key={s}
              className="flex items-center justify-between gap-3 rounded-lg border-2 border-line bg-surface p-3"
            >
              <CrateStateWord state={s} />
              <span className="text-2xl font-semibold tabular-nums">{counts[s]}</span>
            </li>
          ))}
        </ul>
      </section>
      <section aria-labelledby="open-alerts">
        <h2 id="open-alerts" className="mb-3 text-xl font-semibold">
          Open alerts
        </h2>
        {open.length === 0 ? (
          <p className="flex items-center gap-2">
            <StatusShape shape="disc" className="text-primary" /> None open
          </p>
        ) : (
          <p className="flex items-center gap-2 font-semibold text-danger-ink">
            <StatusShape shape="octagon" className="text-danger" />
            {open.length === 1
              ? "1 alert not yet acknowledged"
              : `${open.length} alerts not yet acknowledged`}
          </p>
        )}
        <Link
          to={alertsHref}
          className="inline-flex min-h-touch items-center font-semibold underline underline-offset-4"
        >
          All alerts
        </Link>
      </section>
      <section aria-labelledby="overdue">
        <h2 id="overdue" className="mb-3 text-xl font-semibold">
          Overdue legs
        </h2>
        {overdue.length === 0 ? (
          <p className="flex items-center gap-2">
            <StatusShape shape="disc" className="text-primary" /> None overdue
          </p>
        ) : (
          <ul className="flex flex-col gap-2">
            {overdue.map((l) => (
              <li key={l.id} className="flex flex-wrap items-center gap-x-3">
                <StatusShape shape="triangle" className="text-attention" />
                <Link
                  to={crateHref(l.crateId)}
                  className="inline-flex min-h-touch items-center font-semibold"
                >
                  {legLine(l)}
                </Link>
                <span>
                  planned arrival <TimeText iso={l.plannedArriveAt} />
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>
      <section aria-labelledby="owed">
        <h2 id="owed" className="mb-3 text-xl font-semibold">
          Handovers still to record
        </h2>
        {owed.length === 0 ? (
          <p className="flex items-center gap-2">
            <StatusShape shape="disc" className="text-primary" /> Every arrival has its handover
          </p>
        ) : (
          <ul className="flex flex-col gap-2">
            {owed.map((l) => (
              <li key={l.id} className="flex flex-wrap items-center gap-x-3">
                <StatusShape shape="triangle" className="text-attention" />
                <span className="font-semibold">{legLine(l)}</span>
                {l.arrivedAt !== null && (
                  <span>
                    arrived <TimeText iso={l.arrivedAt} />
                  </span>
                )}
                <Link to={handoverHref(l.crateId)} className="inline-flex min-h-touch items-center">
                  Record the handover of {crateLabel(l.crateId)}
                </Link>
              </li>
            ))}
          </ul>
        )}
      </section>
      <section aria-labelledby="all-legs">
        <h2 id="all-legs" className="mb-3 text-xl font-semibold">
          All legs
        </h2>
        <LegsTable rows={rows} crateHref={crateHref} />
      </section>
    </div>
  );
}
