// A small pool of worker threads for the science core (DESIGN.md: heavy analysis never blocks the
// API). Workers start on first use and stay; tasks wait in a queue when all are busy. A crashed
// worker fails its task and is replaced. Nothing here is durable: callers keep their own state in
// PostgreSQL (an analysis row says "running"), so a lost task is simply run again.
import { availableParallelism } from "node:os";
import { Worker, type Transferable } from "node:worker_threads";
import { ScienceInputError } from "../../shared/science";
import type { ScienceTasks, TaskName } from "./tasks";

interface Job {
  id: number;
  task: TaskName;
  input: unknown;
  transfer: Transferable[];
  resolve: (value: unknown) => void;
  reject: (error: Error) => void;
}

interface Reply {
  id: number;
  ok: boolean;
  result?: unknown;
  error?: { field: string | null; message: string };
}

const bootstrap = new URL("./bootstrap.mjs", import.meta.url);
const entry = new URL("./science-worker.ts", import.meta.url).href;

export interface SciencePool {
  run<N extends TaskName>(
    task: N,
    input: Parameters<ScienceTasks[N]>[0],
    transfer?: Transferable[],
  ): Promise<ReturnType<ScienceTasks[N]>>;
  close(): Promise<void>;
}

export function createSciencePool(size = Math.max(1, availableParallelism() - 1)): SciencePool {
  const idle: Worker[] = [];
  const busy = new Map<Worker, Job>();
  const queue: Job[] = [];
  let started = 0;
  let nextId = 1;
  let closed = false;

  function settle(worker: Worker, reply: Reply) {
    const job = busy.get(worker);
    busy.delete(worker);
    idle.push(worker);
    if (job !== undefined && job.id === reply.id) {
      if (reply.ok) job.resolve(reply.result);
      else if (reply.error?.field != null)
        job.reject(new ScienceInputError(reply.error.field, reply.error.message));
      else job.reject(new Error(reply.error?.message ?? "the worker failed"));
    }
    pump();
  }

  function fail(worker: Worker, error: Error) {
    const job = busy.get(worker);
    busy.delete(worker);
    const at = idle.indexOf(worker);
    if (at >= 0) idle.splice(at, 1);
    started--;
    job?.reject(error);
    pump();
  }

  function spawn(): Worker {
    const worker = new Worker(bootstrap, { workerData: { entry } });
    started++;
    worker.on("message", (reply: Reply) => settle(worker, reply));
    worker.on("error", (error) => fail(worker, error));
    worker.on("exit", (code) => {
      if (busy.has(worker) || idle.includes(worker))
        fail(worker, new Error(`the analysis worker stopped (exit code ${code})`));
    });
    return worker;
  }

  function pump() {
    while (queue.length > 0 && !closed) {
      const worker = idle.pop() ?? (started < size ? spawn() : undefined);
      if (worker === undefined) return;
      const job = queue.shift();
      if (job === undefined) return;
      busy.set(worker, job);
      worker.postMessage({ id: job.id, task: job.task, input: job.input }, job.transfer);
    }
  }

  return {
    run(task, input, transfer = []) {
      if (closed) return Promise.reject(new Error("the science pool is closed"));
      return new Promise((resolve, reject) => {
        queue.push({
          id: nextId++,
          task,
          input,
          transfer,
          resolve: resolve as (value: unknown) => void,
          reject,
        });
        pump();
      });
    },
    async close() {
      closed = true;
      for (const job of queue.splice(0)) job.reject(new Error("the science pool is closed"));
      const all = [...idle, ...busy.keys()];
      idle.length = 0;
      for (const [worker, job] of busy) {
        busy.delete(worker);
        job.reject(new Error("the science pool is closed"));
      }
      await Promise.all(all.map((w) => w.terminate()));
    },
  };
}
