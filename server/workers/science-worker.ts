// Worker thread entry: runs one science task per message, so heavy analysis never blocks the
// API's event loop.
import { parentPort } from "node:worker_threads";
import { ScienceInputError } from "../../shared/science";
import { scienceTasks, type TaskName } from "./tasks";

interface Request {
  id: number;
  task: TaskName;
  input: unknown;
}

parentPort?.on("message", (request: Request) => {
  try {
    const run = scienceTasks[request.task] as (input: unknown) => unknown;
    parentPort?.postMessage({ id: request.id, ok: true, result: run(request.input) });
  } catch (error) {
    const e = error instanceof Error ? error : new Error(String(error));
    parentPort?.postMessage({
      id: request.id,
      ok: false,
      // A ScienceInputError names the field: keep it across the thread boundary.
      error:
        error instanceof ScienceInputError
          ? { field: error.field, message: e.message.slice(error.field.length + 2) }
          : { field: null, message: e.message },
    });
  }
});
