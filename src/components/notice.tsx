import type { ReactNode } from "react";
import { cx } from "../lib/cx";
import { StatusShape, type StatusShapeName } from "./status-shape";

export type NoticeTone = "info" | "attention" | "danger";

const tones: Record<NoticeTone, { box: string; shape: StatusShapeName; icon: string }> = {
  info: { box: "border-line bg-surface text-ink", shape: "disc", icon: "text-primary" },
  attention: {
    box: "border-attention bg-attention-soft text-attention-ink",
    shape: "triangle",
    icon: "text-attention",
  },
  danger: {
    box: "border-danger bg-danger-soft text-danger-ink",
    shape: "octagon",
    icon: "text-danger",
  },
};

interface NoticeProps {
  tone?: NoticeTone;
  /** A word or two that says the status without the colour, e.g. "Not saved". */
  title: string;
  children?: ReactNode;
  /** Announce to screen readers at once (errors after an action). */
  live?: boolean;
  className?: string;
}

export function Notice({ tone = "info", title, children, live = false, className }: NoticeProps) {
  const style = tones[tone];
  return (
    <div
      role={live ? "alert" : undefined}
      className={cx("flex gap-3 rounded-lg border-2 px-4 py-3", style.box, className)}
    >
      <StatusShape shape={style.shape} className={cx("mt-0.5", style.icon)} />
      <div className="min-w-0">
        <p className="font-semibold">{title}</p>
        {children !== undefined && <div className="mt-1">{children}</div>}
      </div>
    </div>
  );
}
