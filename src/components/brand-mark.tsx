import { cx } from "../lib/cx";

/** Equipot's mark: a clock standing on a level line (the same drawing as public/icons/icon.svg). */
export function BrandMark({ className }: { className?: string }) {
  const stroke = { stroke: "var(--eq-on-primary)", fill: "none", strokeLinecap: "round" } as const;
  return (
    <svg
      viewBox="0 0 32 32"
      aria-hidden="true"
      focusable="false"
      className={cx("h-9 w-9", className)}
    >
      <rect width="32" height="32" rx="7" fill="var(--eq-primary)" />
      <circle cx="16" cy="12.9" r="7.4" strokeWidth="2.25" {...stroke} />
      <path d="M16 12.9 V8.3 M16 12.9 H19.7" strokeWidth="1.9" {...stroke} />
      <path d="M16 21.4 V25" strokeWidth="1.9" {...stroke} strokeLinecap="butt" />
      <path d="M6 25.75 H26" strokeWidth="1.9" {...stroke} />
      <path d="M9.4 23.3 V25.75 M22.6 23.3 V25.75" strokeWidth="1.1" {...stroke} />
    </svg>
  );
}
