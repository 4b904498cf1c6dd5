import { StatusShape } from "../../../components/status-shape";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import type { RunState } from "../lib/run-state";

const shapeTone: Record<RunState["tone"], string> = {
  fine: "text-primary",
  working: "text-muted",
  attention: "text-attention",
  danger: "text-danger",
};

/** The state word with its shape, then the detail and the expected date (UTC, local beside). */
export function RunStateLine({ state }: { state: RunState }) {
  return (
    <div className="flex flex-col gap-1">
      <p className="flex items-center gap-2 font-semibold">
        <StatusShape shape={state.shape} className={shapeTone[state.tone]} />
        <span>{state.word}</span>
        {state.detail !== null && <span className="font-normal text-muted">· {state.detail}</span>}
      </p>
      {state.eta !== null && (
        <p className="text-sm tabular-nums">
          Expected {formatUtc(state.eta)}{" "}
          <span className="text-muted">({formatLocalBeside(state.eta)})</span>
        </p>
      )}
    </div>
  );
}
