// The legs table's rows and columns: what each leg shows, and what TanStack sorts and filters by.
import type { ColumnDef, Row } from "@tanstack/react-table";
import { useMemo, type ReactNode } from "react";
import { Link } from "react-router-dom";
import { legState, legStates, type LegState } from "../../../../shared/schemas/logistics";
import type { LocalLeg, LocalSite } from "../../../db/database";
import { formatUtc } from "../../../lib/format";
import { LegStateWord } from "./status-word";

export interface LegRow {
  leg: LocalLeg;
  crate: string;
  from: string;
  to: string;
  state: LegState;
  overdue: boolean;
  /** The leg's times in ms since the epoch, for sorting (arrived: −∞ while under way or planned). */
  departMs: number;
  arriveMs: number;
  arrivedMs: number;
}

const time = (iso: string | null) => (iso === null ? "—" : formatUtc(iso));

interface LegColumn {
  id: string;
  header: string;
  /** The column's value for TanStack (its sort, unless `sortBy` is given). */
  value: (r: LegRow) => string | number;
  cell: (r: LegRow, crateHref: (crateId: string) => string) => ReactNode;
  /**
   * Times sort by instant, parsed once per leg: TanStack's natural comparison of the text took
   * about 100 ms of a profiled re-sort of 10,000 legs.
   */
  sortBy?: "departMs" | "arriveMs" | "arrivedMs";
}

export const legColumns: readonly LegColumn[] = [
  {
    id: "crate",
    header: "Crate",
    value: (r) => r.crate,
    cell: (r, crateHref) => (
      <Link to={crateHref(r.leg.crateId)} className="font-semibold">
        {r.crate}
      </Link>
    ),
  },
  { id: "from", header: "From", value: (r) => r.from, cell: (r) => r.from },
  { id: "to", header: "To", value: (r) => r.to, cell: (r) => r.to },
  {
    id: "state",
    header: "State",
    value: (r) => legStates.indexOf(r.state),
    cell: (r) => (
      <span className="flex flex-col">
        <LegStateWord state={r.state} />
        {r.overdue && <span className="text-sm font-semibold text-danger-ink">Overdue</span>}
      </span>
    ),
  },
  {
    id: "plannedDepartAt",
    sortBy: "departMs",
    header: "Planned departure",
    value: (r) => r.leg.plannedDepartAt,
    cell: (r) => time(r.leg.plannedDepartAt),
  },
  {
    id: "plannedArriveAt",
    sortBy: "arriveMs",
    header: "Planned arrival",
    value: (r) => r.leg.plannedArriveAt,
    cell: (r) => time(r.leg.plannedArriveAt),
  },
  {
    id: "arrivedAt",
    sortBy: "arrivedMs",
    header: "Arrived",
    value: (r) => r.leg.arrivedAt ?? "",
    cell: (r) => time(r.leg.arrivedAt),
  },
];

// TanStack sorts and filters; the body draws cells from the legs themselves, so rows scrolled
// past leave no cell objects behind in the table.
export const columns: ColumnDef<LegRow>[] = legColumns.map(({ id, header, value, sortBy }) => ({
  id,
  header,
  accessorFn: value,
  ...(sortBy && {
    sortingFn: (a: Row<LegRow>, b: Row<LegRow>) => {
      const x = a.original[sortBy];
      const y = b.original[sortBy];
      return x < y ? -1 : x > y ? 1 : 0;
    },
  }),
}));

/**
 * The table's rows, rebuilt only when the data or the overdue set (ids joined by spaces) change:
 * the route re-renders on its clock's tick with the same data, and new rows would make the table
 * sort and filter every leg again.
 */
export function useLegRows(
  legs: readonly LocalLeg[],
  crates: readonly { id: string; label: string }[],
  sites: readonly LocalSite[],
  overdueIds: string,
): LegRow[] {
  return useMemo(() => {
    const labels = new Map(crates.map((c) => [c.id, c.label]));
    const names = new Map(sites.map((s) => [s.id, s.name]));
    return legRows(
      legs,
      (id) => labels.get(id) ?? "Crate not on this device",
      (id) => names.get(id) ?? "Site not on this device",
      new Set(overdueIds.split(" ")),
    );
  }, [legs, crates, sites, overdueIds]);
}

function legRows(
  legs: readonly LocalLeg[],
  crateLabel: (id: string) => string,
  siteName: (id: string) => string,
  overdue: ReadonlySet<string>,
): LegRow[] {
  return legs.map((leg) => ({
    leg,
    crate: crateLabel(leg.crateId),
    from: siteName(leg.fromSiteId),
    to: siteName(leg.toSiteId),
    state: legState(leg),
    overdue: overdue.has(leg.id),
    departMs: Date.parse(leg.plannedDepartAt),
    arriveMs: Date.parse(leg.plannedArriveAt),
    arrivedMs: leg.arrivedAt === null ? -Infinity : Date.parse(leg.arrivedAt),
  }));
}
