// A crate's or leg's state as a shape plus words, never colour alone.
import type { CrateState, LegState } from "../../../../shared/schemas/logistics";
import { crateStateLabels } from "../../../../shared/schemas/logistics";
import { StatusShape } from "../../../components/status-shape";
import { cx } from "../../../lib/cx";
import { crateStateShapes, legStateWords } from "../format";

export function CrateStateWord({ state, className }: { state: CrateState; className?: string }) {
  const { shape, tone } = crateStateShapes[state];
  return (
    <span className={cx("inline-flex items-center gap-2 font-semibold", className)}>
      <StatusShape shape={shape} className={tone} />
      {crateStateLabels[state]}
    </span>
  );
}

export function LegStateWord({ state }: { state: LegState }) {
  const { word, shape } = legStateWords[state];
  return (
    <span className="inline-flex items-center gap-2">
      <StatusShape shape={shape} />
      {word}
    </span>
  );
}
