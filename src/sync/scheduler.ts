// When the sync engine runs, in the browser: at start, when the network returns, on a periodic
// probe of the server while the tab is visible, shortly after local writes, and on demand. After a
// failure it waits (doubling, with jitter) before trying on its own again. Plain TypeScript.
import { withWebLock } from "../lib/web-lock";

export interface SchedulerEnvironment {
  /** Adds a listener for the browser's `online` event; returns a remover. */
  onOnline: (listener: () => void) => () => void;
  isVisible: () => boolean;
}

export interface SyncSchedulerOptions {
  /** One engine run; rejects on failure. */
  sync: () => Promise<void>;
  /** Whether the server answers (GET /api/health); never rejects. */
  probe: () => Promise<boolean>;
  environment?: SchedulerEnvironment;
  probeIntervalMs?: number;
  writeDebounceMs?: number;
  backoffStartMs?: number;
  backoffMaxMs?: number;
  /** 0 ≤ random() < 1; injectable for tests. */
  random?: () => number;
}

export interface SyncScheduler {
  start: () => void;
  stop: () => void;
  /** After a local write: runs once writes have paused for a moment. */
  notifyWrite: () => void;
  /** "Sync now": runs at once, even while waiting after a failure. */
  runNow: () => Promise<void>;
  /** When the next retry after a failure is due (ms since epoch), or null. */
  retryAt: () => number | null;
}

/** Delay before retry number `failures` (1, 2, …): doubling from start to max, half of it random. */
export function backoffDelayMs(
  failures: number,
  startMs: number,
  maxMs: number,
  random: () => number,
): number {
  const full = Math.min(maxMs, startMs * 2 ** Math.max(0, failures - 1));
  return Math.round(full / 2 + (random() * full) / 2);
}

export function browserEnvironment(): SchedulerEnvironment {
  return {
    onOnline: (listener) => {
      window.addEventListener("online", listener);
      return () => window.removeEventListener("online", listener);
    },
    isVisible: () => document.visibilityState !== "hidden",
  };
}

/** The engine's `exclusive` option: one run at a time across every tab of this browser. */
export const webLockExclusive = <T>(work: () => Promise<T>): Promise<T> =>
  withWebLock("equipot-sync", work);

export function createSyncScheduler(options: SyncSchedulerOptions): SyncScheduler {
  const {
    sync,
    probe,
    probeIntervalMs = 30_000,
    writeDebounceMs = 1_500,
    backoffStartMs = 5_000,
    backoffMaxMs = 5 * 60_000,
    random = Math.random,
  } = options;
  const environment = options.environment ?? browserEnvironment();
  let started = false;
  let running: Promise<void> | null = null;
  let again = false;
  let failures = 0;
  let retryDue: number | null = null;
  let retryTimer: ReturnType<typeof setTimeout> | undefined;
  let writeTimer: ReturnType<typeof setTimeout> | undefined;
  let probeTimer: ReturnType<typeof setInterval> | undefined;
  let removeOnline: (() => void) | undefined;

  const waitingAfterFailure = () => retryDue !== null;

  function scheduleRetry() {
    failures += 1;
    const delay = backoffDelayMs(failures, backoffStartMs, backoffMaxMs, random);
    retryDue = Date.now() + delay;
    clearTimeout(retryTimer);
    retryTimer = setTimeout(() => void run(), delay);
  }

  async function runOnce(): Promise<void> {
    try {
      await sync();
      failures = 0;
    } catch {
      if (started) scheduleRetry();
    }
  }

  /** Runs now, or once more right after the run in progress (writes may have come in meanwhile). */
  function run(): Promise<void> {
    if (!started) return Promise.resolve();
    clearTimeout(retryTimer);
    retryDue = null;
    if (running !== null) {
      again = true;
      return running;
    }
    running = (async () => {
      do {
        again = false;
        await runOnce();
      } while (again && started && !waitingAfterFailure());
    })().finally(() => (running = null));
    return running;
  }

  async function probeTick() {
    if (!environment.isVisible() || waitingAfterFailure() || running !== null) return;
    if (await probe()) await run();
  }

  return {
    start() {
      if (started) return;
      started = true;
      removeOnline = environment.onOnline(() => void run());
      probeTimer = setInterval(() => void probeTick(), probeIntervalMs);
      void run();
    },
    stop() {
      started = false;
      removeOnline?.();
      clearInterval(probeTimer);
      clearTimeout(writeTimer);
      clearTimeout(retryTimer);
      retryDue = null;
    },
    notifyWrite() {
      if (!started || waitingAfterFailure()) return;
      clearTimeout(writeTimer);
      writeTimer = setTimeout(() => void run(), writeDebounceMs);
    },
    runNow: () => run(),
    retryAt: () => retryDue,
  };
}
