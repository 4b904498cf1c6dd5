// What each crate went through, from plain records: the legs it travelled, the shocks and
// temperatures beyond its limits, how often it changed hands, and the alerts still open.
// Pure, so the report and its tests share one reading of the records.
import type { CrateView } from "../../../../shared/schemas/crates";
import type { FieldEntryView } from "../../../../shared/schemas/field-entries";
import {
  legState,
  type AlertView,
  type HandoverView,
  type LegState,
  type LegView,
} from "../../../../shared/schemas/logistics";

export interface TravelledLeg {
  id: string;
  fromName: string;
  toName: string;
  departedAt: string | null;
  arrivedAt: string | null;
  state: LegState;
}

export interface Excursion {
  id: string;
  kind: "shock" | "temperature";
  observedAt: string;
  siteName: string;
  /** The verdict's own words, units included ("2 peaks above 15 g; highest 22.5 g on z"). */
  summary: string;
}

export interface CrateTransport {
  crate: Pick<
    CrateView,
    "id" | "label" | "contents" | "maxShockG" | "temperatureMinC" | "temperatureMaxC"
  >;
  legs: TravelledLeg[];
  /** Legs planned but not yet under way. */
  plannedLegs: number;
  excursions: Excursion[];
  handovers: number;
  openAlerts: Pick<AlertView, "id" | "summary" | "createdAt">[];
}

export interface TransportRecords {
  crates: readonly CrateView[];
  legs: readonly LegView[];
  handovers: readonly Pick<HandoverView, "crateId">[];
  alerts: readonly AlertView[];
  entries: readonly Pick<
    FieldEntryView,
    "id" | "crateId" | "siteId" | "kind" | "observedAt" | "flags"
  >[];
  sites: readonly { id: string; name: string }[];
}

const excursionKinds: Partial<Record<FieldEntryView["kind"], Excursion["kind"]>> = {
  "shock-indicator": "shock",
  "shock-log": "shock",
  temperatures: "temperature",
};

const byTime = (a: string | null, b: string | null) => (a ?? "").localeCompare(b ?? "");

function travelledLegs(
  legs: readonly LegView[],
  nameOf: (siteId: string) => string,
): TravelledLeg[] {
  return legs
    .filter((l) => l.departedAt !== null && l.cancelledAt === null)
    .sort((a, b) => byTime(a.departedAt, b.departedAt) || a.id.localeCompare(b.id))
    .map((l) => ({
      id: l.id,
      fromName: nameOf(l.fromSiteId),
      toName: nameOf(l.toSiteId),
      departedAt: l.departedAt,
      arrivedAt: l.arrivedAt,
      state: legState(l),
    }));
}

function excursionsOf(
  entries: TransportRecords["entries"],
  nameOf: (siteId: string) => string,
): Excursion[] {
  return entries
    .flatMap((e) => {
      const kind = excursionKinds[e.kind];
      if (kind === undefined || !e.flags.exceeded) return [];
      const excursion: Excursion = {
        id: e.id,
        kind,
        observedAt: e.observedAt,
        siteName: nameOf(e.siteId),
        summary: e.flags.summary,
      };
      return [excursion];
    })
    .sort((a, b) => byTime(a.observedAt, b.observedAt) || a.id.localeCompare(b.id));
}

/** One summary per crate, in the order the crates are given. */
export function summariseTransport(records: TransportRecords): CrateTransport[] {
  const names = new Map(records.sites.map((s) => [s.id, s.name]));
  const nameOf = (siteId: string) => names.get(siteId) ?? "a site not on this device";
  return records.crates.map((crate) => {
    const legs = records.legs.filter((l) => l.crateId === crate.id);
    return {
      crate,
      legs: travelledLegs(legs, nameOf),
      plannedLegs: legs.filter((l) => legState(l) === "planned").length,
      excursions: excursionsOf(
        records.entries.filter((e) => e.crateId === crate.id),
        nameOf,
      ),
      handovers: records.handovers.filter((h) => h.crateId === crate.id).length,
      openAlerts: records.alerts
        .filter((a) => a.crateId === crate.id && a.acknowledgedAt === null)
        .map(({ id, summary, createdAt }) => ({ id, summary, createdAt })),
    };
  });
}
