// The science tasks a worker thread can run, by name. Each takes structured-cloneable input
// (typed arrays are transferred, not copied) and returns a structured-cloneable result.
import {
  adjustLevellingNetwork,
  type AdjustmentInput,
  type AdjustmentOptions,
} from "../../shared/science";

export const scienceTasks = {
  adjust: (input: { network: AdjustmentInput; options: AdjustmentOptions }) =>
    adjustLevellingNetwork(input.network, input.options),
};

export type ScienceTasks = typeof scienceTasks;
export type TaskName = keyof ScienceTasks;
