// The section misclosure against the class tolerance, live while typing, with a bar that fills
// up to the allowed value: shape and words say the verdict, the bar only shows how close it is.
import { describeMisclosure, formatMillimetres } from "../../../../shared/levelling-book";
import type {
  LevellingClass,
  MisclosureCheck,
} from "../../../../shared/science/levelling/misclosure";
import { StatusShape } from "../../../components/status-shape";
import { cx } from "../../../lib/cx";

// The bar's full width is 1.5 × the tolerance, so a failing value still shows how far beyond.
const BAR_SPAN = 1.5;
// Above this share of the tolerance the verdict still passes but says it is close (common practice).
const CLOSE_TO_LIMIT = 0.8;

interface MisclosurePanelProps {
  check: MisclosureCheck | null;
  levellingClass: LevellingClass;
  /** True when the figures include the setup still being typed. */
  includesDraft: boolean;
}

function verdictOf(check: MisclosureCheck) {
  if (!check.withinTolerance)
    return {
      shape: "octagon" as const,
      word: "Out of tolerance — re-level before closing",
      box: "border-danger bg-danger-soft text-danger-ink",
      fill: "bg-danger",
    };
  if (check.usedFraction > CLOSE_TO_LIMIT)
    return {
      shape: "triangle" as const,
      word: "Within tolerance, close to the limit",
      box: "border-attention bg-attention-soft text-attention-ink",
      fill: "bg-attention",
    };
  return {
    shape: "disc" as const,
    word: "Within tolerance",
    box: "border-line bg-surface text-ink",
    fill: "bg-primary",
  };
}

export function MisclosurePanel({ check, levellingClass, includesDraft }: MisclosurePanelProps) {
  if (check === null) {
    return (
      <section aria-label="Misclosure" className="rounded-xl border-2 border-line bg-surface p-4">
        <p className="font-semibold">Misclosure</p>
        <p className="text-muted">
          Shown once both runs have a setup with its sight distances ({levellingClass.name}, ±
          {levellingClass.sectionKMm} mm·√K).
        </p>
      </section>
    );
  }
  const verdict = verdictOf(check);
  const widthPct = Math.min(check.usedFraction / BAR_SPAN, 1) * 100;
  return (
    <section
      aria-label="Misclosure"
      className={cx("flex flex-col gap-3 rounded-xl border-2 p-4", verdict.box)}
    >
      <p aria-live="polite" className="flex items-center gap-2 text-lg font-semibold">
        <StatusShape
          shape={verdict.shape}
          className={cx(
            verdict.shape === "disc" ? "text-primary" : "",
            verdict.shape === "triangle" ? "text-attention" : "",
            verdict.shape === "octagon" ? "text-danger" : "",
          )}
        />
        {verdict.word}
      </p>
      <p className="tabular-nums">
        {describeMisclosure(check, levellingClass)}
        {includesDraft && <span className="text-sm"> · with the setup being typed</span>}
      </p>
      <div aria-hidden="true" className="relative h-4 rounded-full border-2 border-ink bg-paper">
        <div
          className={cx("h-full rounded-full", verdict.fill)}
          style={{ width: `${widthPct}%` }}
        />
        <div
          className="absolute inset-y-[-6px] w-0.5 bg-ink"
          style={{ left: `${100 / BAR_SPAN}%` }}
        />
      </div>
      <p className="text-sm">
        The bar fills to the mark at the allowed ±{formatMillimetres(check.toleranceM)}.
      </p>
    </section>
  );
}
