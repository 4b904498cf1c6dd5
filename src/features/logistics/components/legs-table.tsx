// Every leg of the campaign, sortable and filterable, with only the visible rows in the DOM so
// thousands of legs stay smooth. Rows are divs with table roles; headers stay real column headers.
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type Row,
  type SortingState,
} from "@tanstack/react-table";
import { useVirtualizer } from "@tanstack/react-virtual";
import { memo, useMemo, useRef, useState } from "react";
import { legStates, type LegState } from "../../../../shared/schemas/logistics";
import { SelectField, TextField } from "../../../components/form-field";
import { legStateWords } from "../format";
import { columns, legColumns, type LegRow } from "./leg-columns";

interface Props {
  rows: readonly LegRow[];
  crateHref: (crateId: string) => string;
}

const grid = "grid grid-cols-[7rem_1fr_1fr_9rem_11rem_11rem_11rem] gap-2 px-3";
const rowHeight = 56;
// A wheel step jumps about 27 rows, past any overscan: each extra row is only more to build and lay
// out in that frame. A few cover small moves (arrow keys) that the compositor scrolls before the
// page has drawn the rows coming into view.
const overscan = 3;

export function LegsTable({ rows, crateHref }: Props) {
  const [sorting, setSorting] = useState<SortingState>([{ id: "plannedArriveAt", desc: false }]);
  const [text, setText] = useState("");
  const [stateFilter, setStateFilter] = useState<LegState | "">("");
  const data = useMemo(
    () => rows.filter((r) => stateFilter === "" || r.state === stateFilter),
    [rows, stateFilter],
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
        <LegsBody rows={shown} crateHref={crateHref} />
      </div>
    </div>
  );
}

/**
 * The scrolling rows, apart so that a scroll renders only them. The scroller has a definite height
 * and `contain: strict`, so the new rows of a step are laid out and painted within it alone; the
 * rows sit in normal flow under one offset box (fixed height, so no measuring), not one positioned
 * box each.
 */
function LegsBody({ rows, crateHref }: { rows: Row<LegRow>[]; crateHref: Props["crateHref"] }) {
  const scroller = useRef<HTMLDivElement>(null);
  // Its fresh functions stay inside this component; rows get plain values.
  // eslint-disable-next-line react-hooks/incompatible-library
  const virtual = useVirtualizer({
    count: rows.length,
    getScrollElement: () => scroller.current,
    estimateSize: () => rowHeight,
    overscan,
  });
  const items = virtual.getVirtualItems();
  const total = virtual.getTotalSize();
  return (
    <div
      ref={scroller}
      role="rowgroup"
      className="min-w-[64rem] overflow-y-auto contain-strict"
      style={{ height: `min(32rem, ${total}px)` }}
      tabIndex={0}
      aria-label="Legs, scrollable"
    >
      <div style={{ height: total }} className="relative">
        <div className="absolute inset-x-0" style={{ top: items[0]?.start ?? 0 }}>
          {items.map((item) => {
            const row = rows[item.index];
            if (row === undefined) return null;
            return (
              <LegsRow key={row.id} index={item.index} row={row.original} crateHref={crateHref} />
            );
          })}
        </div>
      </div>
    </div>
  );
}

/** A row in view renders once, not again at every scroll step. */
const LegsRow = memo(function LegsRow({
  index,
  row,
  crateHref,
}: {
  index: number;
  row: LegRow;
  crateHref: Props["crateHref"];
}) {
  return (
    <div
      role="row"
      aria-rowindex={index + 2}
      className={`${grid} items-center border-b border-line tabular-nums`}
      style={{ height: rowHeight }}
    >
      {legColumns.map((c) => (
        <div role="cell" key={c.id} className="truncate">
          {c.cell(row, crateHref)}
        </div>
      ))}
    </div>
  );
});
