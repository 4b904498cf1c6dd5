import { cx } from "../lib/cx";
import { StatusShape } from "./status-shape";

/** A record changed on this device that the server has not confirmed yet: shape plus words. */
export function PendingMark({ className }: { className?: string }) {
  return (
    <span
      className={cx(
        "inline-flex items-center gap-1.5 rounded-full border-2 border-ink px-2 py-0.5 text-sm font-semibold",
        className,
      )}
    >
      <StatusShape shape="dots" className="h-4 w-4" />
      Not yet sent
    </span>
  );
}
