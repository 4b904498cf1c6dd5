import { cx } from "../lib/cx";

/** Heights in Equipot are campaign results (DESIGN.md §9): say so, modestly. */
export function HeightsNote({ className }: { className?: string }) {
  return (
    <p className={cx("text-sm text-muted", className)}>
      Heights in Equipot are campaign results, not official heights of the national height network.
    </p>
  );
}
