// Starts bench/sync/server.ts as a child process and talks to it over IPC.
import { fork, type ChildProcess } from "node:child_process";
import { fileURLToPath } from "node:url";
import type { ServerMemory, ServerMessage } from "./server";

export interface BenchServer {
  url: string;
  memoryStart: () => Promise<void>;
  memoryStop: () => Promise<ServerMemory>;
  close: () => Promise<void>;
}

type Reply =
  | { type: "listening"; port: number }
  | { type: "memory-started" }
  | { type: "memory"; memory: ServerMemory };

function next<T extends Reply["type"]>(
  child: ChildProcess,
  type: T,
): Promise<Extract<Reply, { type: T }>> {
  return new Promise((resolve, reject) => {
    const onMessage = (message: Reply) => {
      if (message.type !== type) return;
      child.off("message", onMessage).off("exit", onExit);
      resolve(message as Extract<Reply, { type: T }>);
    };
    const onExit = (code: number | null) =>
      reject(new Error(`the benchmark server exited (code ${code}) before answering ${type}`));
    child.on("message", onMessage).once("exit", onExit);
  });
}

function profileArgs(): string[] {
  const dir = process.env.EQUIPOT_BENCH_PROFILE;
  return dir ? ["--cpu-prof", `--cpu-prof-dir=${dir}`] : [];
}

export async function startBenchServer(databaseUrl: string): Promise<BenchServer> {
  const child = fork(fileURLToPath(new URL("./server.ts", import.meta.url)), [], {
    // EQUIPOT_BENCH_PROFILE=dir writes a V8 CPU profile of the server into dir.
    execArgv: ["--import", "tsx", ...profileArgs()],
    env: { ...process.env, DATABASE_URL: databaseUrl },
    stdio: ["ignore", "inherit", "inherit", "ipc"],
  });
  const { port } = await next(child, "listening");
  const send = (message: ServerMessage) => child.send(message);
  return {
    url: `http://127.0.0.1:${port}`,
    async memoryStart() {
      const started = next(child, "memory-started");
      send({ type: "memory-start" });
      await started;
    },
    async memoryStop() {
      const answer = next(child, "memory");
      send({ type: "memory-stop" });
      return (await answer).memory;
    },
    async close() {
      if (child.exitCode !== null) return;
      const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
      child.disconnect();
      const timer = setTimeout(() => child.kill("SIGKILL"), 5_000);
      await exited;
      clearTimeout(timer);
    },
  };
}
