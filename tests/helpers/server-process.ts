// The real server as a child process (server/index.ts), for tests that kill it with SIGKILL.
import { spawn, type ChildProcess } from "node:child_process";
import { createServer } from "node:net";

export const freePort = () =>
  new Promise<number>((resolve) => {
    const s = createServer().listen(0, "127.0.0.1", () => {
      const port = (s.address() as { port: number }).port;
      s.close(() => resolve(port));
    });
  });

/** Starts the server on `port` against `databaseUrl`; resolves once it listens. */
export async function startServerProcess(databaseUrl: string, port: number): Promise<ChildProcess> {
  const child = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
    env: {
      ...process.env,
      NODE_ENV: "test",
      PORT: String(port),
      DATABASE_URL: databaseUrl,
      JWT_SECRET: "server-process-test-secret-0123456789abcdef",
      LOG_LEVEL: "silent",
    },
    stdio: ["ignore", "pipe", "inherit"],
  });
  await new Promise<void>((resolve, reject) => {
    child.stdout?.on("data", (d: Buffer) => d.toString().includes("listening") && resolve());
    child.once("exit", (code) => reject(new Error(`server exited early (${code})`)));
  });
  return child;
}
