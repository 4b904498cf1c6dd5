// A run's state in a word and a shape (never colour alone), from its height result.
import type { StatusShapeName } from "../../../components/status-shape";
import type { HeightResultView } from "../../../../shared/schemas/comparison";
import { formatDuration } from "./durations";

export interface RunState {
  shape: StatusShapeName;
  word: string;
  /** Wall-clock time left and expected date, or the reason; null when there is nothing more. */
  detail: string | null;
  /** The expected date (ISO 8601), when there is one. */
  eta: string | null;
  tone: "fine" | "working" | "attention" | "danger";
}

export function runStateOf(result: HeightResultView | undefined): RunState {
  if (result === undefined)
    return { shape: "dots", word: "Not known yet", detail: null, eta: null, tone: "working" };
  const { analysis, timeToTarget: t } = result;
  if (analysis.state === "none")
    return { shape: "dots", word: "No data yet", detail: null, eta: null, tone: "working" };
  if (analysis.state === "failed")
    return {
      shape: "triangle",
      word: "Analysis failed",
      detail: analysis.error,
      eta: null,
      tone: "attention",
    };
  if (result.clock === null)
    return { shape: "dots", word: "Analysing…", detail: null, eta: null, tone: "working" };
  if (!t.reachable)
    return { shape: "octagon", word: "Not reachable", detail: t.reason, eta: null, tone: "danger" };
  if (t.leftS === 0)
    return { shape: "disc", word: "Target reached", detail: null, eta: null, tone: "fine" };
  return {
    shape: "disc",
    word: `${formatDuration(t.wallClockLeftS ?? Number.NaN)} left`,
    detail: `at ${Math.round(t.input.uptime * 100)} % uptime`,
    eta: t.eta,
    tone: "fine",
  };
}
