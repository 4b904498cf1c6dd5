// The science tasks a worker thread can run, by name. Each takes structured-cloneable input
// (typed arrays are transferred, not copied) and returns a structured-cloneable result.
import {
  adjustLevellingNetwork,
  type AdjustmentInput,
  type AdjustmentOptions,
} from "../../shared/science";
import { analyseSeries, type AnalyseSeriesInput } from "../../shared/comparison/analyse-series";

export const scienceTasks = {
  adjust: (input: { network: AdjustmentInput; options: AdjustmentOptions }) =>
    adjustLevellingNetwork(input.network, input.options),
  /** The run's grid arrives transferred (its buffer moves to the worker, no copy). */
  analyseSeries: (input: AnalyseSeriesInput) => analyseSeries(input),
};

export type ScienceTasks = typeof scienceTasks;
export type TaskName = keyof ScienceTasks;
