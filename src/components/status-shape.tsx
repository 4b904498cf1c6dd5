import { cx } from "../lib/cx";

/**
 * Shapes that go with every status word, so that status never rests on colour alone:
 * a filled disc (fine), a hollow ring (no connection), a triangle (needs attention),
 * an octagon (limit exceeded or refused), a dotted ring (working on it).
 */
export type StatusShapeName = "disc" | "ring" | "triangle" | "octagon" | "dots";

interface StatusShapeProps {
  shape: StatusShapeName;
  className?: string;
}

export function StatusShape({ shape, className }: StatusShapeProps) {
  return (
    <svg
      viewBox="0 0 20 20"
      aria-hidden="true"
      focusable="false"
      className={cx("h-5 w-5 shrink-0", className)}
    >
      {shape === "disc" && <circle cx="10" cy="10" r="7" fill="currentColor" />}
      {shape === "ring" && (
        <>
          <circle cx="10" cy="10" r="6.5" fill="none" stroke="currentColor" strokeWidth="3" />
          <line x1="4" y1="16" x2="16" y2="4" stroke="currentColor" strokeWidth="2.5" />
        </>
      )}
      {shape === "triangle" && (
        <>
          <path d="M10 2 L19 18 H1 Z" fill="currentColor" />
          <rect x="9" y="7" width="2" height="6" fill="var(--eq-surface)" />
          <rect x="9" y="14.5" width="2" height="2" fill="var(--eq-surface)" />
        </>
      )}
      {shape === "octagon" && (
        <>
          <path d="M6 1 H14 L19 6 V14 L14 19 H6 L1 14 V6 Z" fill="currentColor" />
          <rect x="5" y="9" width="10" height="2.5" fill="var(--eq-surface)" />
        </>
      )}
      {shape === "dots" && (
        <circle
          cx="10"
          cy="10"
          r="7"
          fill="none"
          stroke="currentColor"
          strokeWidth="3"
          strokeDasharray="3 3"
        />
      )}
    </svg>
  );
}
