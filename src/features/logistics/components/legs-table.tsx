// Every leg of the campaign, sortable and filterable, with only the visible rows in the DOM so
// thousands of legs stay smooth. Rows are divs with table roles; headers stay real column headers.
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from "@tanstack/react-table";
import { useVirtualizer } from "@tanstack/react-virtual";
import { useMemo, useRef, useState } from "react";
import { Link } from "react-router-dom";
import { legState, legStates, type LegState } from "../../../../shared/schemas/logistics";
import type { LocalLeg } from "../../../db/database";
import { SelectField, TextField } from "../../../components/form-field";
import { formatUtc } from "../../../lib/format";
import { legStateWords } from "../format";
import { LegStateWord } from "./status-word";

export interface LegRow {
  leg: LocalLeg;
  crate: string;
  from: string;
  to: string;
  state: LegState;
  overdue: boolean;
}

interface Props {
  rows: readonly LegRow[];
  crateHref: (crateId: string) => string;
}

const time = (iso: string | null) => (iso === null ? "—" : formatUtc(iso));
const grid = "grid grid-cols-[7rem_1fr_1fr_9rem_11rem_11rem_11rem] gap-2 px-3";
const rowHeight = 56;

export function LegsTable({ rows, crateHref }: Props) {
  const [sorting, setSorting] = useState<SortingState>([{ id: "plannedArriveAt", desc: false }]);
  const [text, setText] = useState("");
  const [stateFilter, setStateFilter] = useState<LegState | "">("");
  const data = useMemo(
    () => rows.filter((r) => stateFilter === "" || r.state === stateFilter),
    [rows, stateFilter],
  );
  const columns = useMemo<ColumnDef<LegRow>[]>(
    () => [
      {
        id: "crate",
        header: "Crate",
        accessorFn: (r) => r.crate,
        cell: ({ row }) => (
          <Link to={crateHref(row.original.leg.crateId)} className="font-semibold">
            {row.original.crate}
          </Link>
        ),
      },
      { id: "from", header: "From", accessorFn: (r) => r.from },
      { id: "to", header: "To", accessorFn: (r) => r.to },
      {
        id: "state",
        header: "State",
        accessorFn: (r) => legStates.indexOf(r.state),
        cell: ({ row }) => (
          <span className="flex flex-col">
            <LegStateWord state={row.original.state} />
            {row.original.overdue && (
              <span className="text-sm font-semibold text-danger-ink">Overdue</span>
            )}
          </span>
        ),
      },
      {
        id: "plannedDepartAt",
        header: "Planned departure",
        accessorFn: (r) => r.leg.plannedDepartAt,
        cell: ({ row }) => time(row.original.leg.plannedDepartAt),
      },
      {
        id: "plannedArriveAt",
        header: "Planned arrival",
        accessorFn: (r) => r.leg.plannedArriveAt,
        cell: ({ row }) => time(row.original.leg.plannedArriveAt),
      },
      {
        id: "arrivedAt",
        header: "Arrived",
        accessorFn: (r) => r.leg.arrivedAt ?? "",
        cell: ({ row }) => time(row.original.leg.arrivedAt),
      },
    ],
    [crateHref],
  );
  // TanStack Table hands back fresh functions each render: this component is not memoised, on purpose.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: data as LegRow[],
    columns,
    state: { sorting, globalFilter: text },
    onSortingChange: setSorting,
    onGlobalFilterChange: setText,
    globalFilterFn: (row, _id, value: string) => {
      const q = value.trim().toLowerCase();
      if (q === "") return true;
      const r = row.original;
      return [r.crate, r.from, r.to, r.leg.vehicle, legStateWords[r.state].word].some((v) =>
        v.toLowerCase().includes(q),
      );
    },
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const shown = table.getRowModel().rows;
  const scroller = useRef<HTMLDivElement>(null);
  const virtual = useVirtualizer({
    count: shown.length,
    getScrollElement: () => scroller.current,
    estimateSize: () => rowHeight,
    overscan: 10,
  });

  return (
    <div className="flex flex-col gap-3">
      <div className="grid gap-4 md:grid-cols-2">
        <TextField
          label="Filter legs"
          hint="Crate, site, vehicle or state"
          value={text}
          onChange={(e) => setText(e.target.value)}
        />
        <SelectField
          label="State"
          value={stateFilter}
          onChange={(e) => setStateFilter(e.target.value as LegState | "")}
        >
          <option value="">All states</option>
          {legStates.map((s) => (
            <option key={s} value={s}>
              {legStateWords[s].word}
            </option>
          ))}
        </SelectField>
      </div>
      <p className="text-sm text-muted" aria-live="polite">
        {shown.length} of {rows.length} legs
      </p>
      <div
        role="table"
        aria-label="All legs"
        aria-rowcount={shown.length + 1}
        className="overflow-x-auto rounded-lg border-2 border-line bg-surface"
      >
        <div role="rowgroup" className="min-w-[64rem] border-b-2 border-line">
          {table.getHeaderGroups().map((group) => (
            <div role="row" aria-rowindex={1} key={group.id} className={grid}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                return (
                  <div
                    role="columnheader"
                    key={header.id}
                    aria-sort={
                      sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"
                    }
                  >
                    <button
                      type="button"
                      className="flex min-h-touch w-full items-center gap-1 text-left font-semibold"
                      onClick={header.column.getToggleSortingHandler()}
                    >
                      {flexRender(header.column.columnDef.header, header.getContext())}
                      <span aria-hidden="true">
                        {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : ""}
                      </span>
                    </button>
                  </div>
                );
              })}
            </div>
          ))}
        </div>
        <div
          ref={scroller}
          role="rowgroup"
          className="relative max-h-[32rem] min-w-[64rem] overflow-y-auto"
          tabIndex={0}
          aria-label="Legs, scrollable"
        >
          <div style={{ height: virtual.getTotalSize() }} className="relative">
            {virtual.getVirtualItems().map((item) => {
              const row = shown[item.index];
              if (row === undefined) return null;
              return (
                <div
                  role="row"
                  aria-rowindex={item.index + 2}
                  key={row.id}
                  className={`${grid} absolute left-0 right-0 items-center border-b border-line tabular-nums`}
                  style={{ top: item.start, height: rowHeight }}
                >
                  {row.getVisibleCells().map((cell) => (
                    <div role="cell" key={cell.id} className="truncate">
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </div>
                  ))}
                </div>
              );
            })}
          </div>
        </div>
      </div>
    </div>
  );
}

export function legRows(
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
  }));
}
