// The sync scheduler with fake timers: when it runs, how it backs off, and that runs never overlap.
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import {
  backoffDelayMs,
  createSyncScheduler,
  type SchedulerEnvironment,
  type SyncSchedulerOptions,
} from "../../../src/sync/scheduler";

function fakeEnvironment() {
  const listeners = new Set<() => void>();
  let visible = true;
  const environment: SchedulerEnvironment = {
    onOnline: (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    isVisible: () => visible,
  };
  return {
    environment,
    goOnline: () => listeners.forEach((listener) => listener()),
    setVisible: (value: boolean) => (visible = value),
    listenerCount: () => listeners.size,
  };
}

function setup(overrides: Partial<SyncSchedulerOptions> = {}) {
  const env = fakeEnvironment();
  const outcomes: ("ok" | "fail")[] = [];
  let inFlight = 0;
  let maxInFlight = 0;
  const sync = vi.fn(async () => {
    inFlight += 1;
    maxInFlight = Math.max(maxInFlight, inFlight);
    await new Promise((resolve) => setTimeout(resolve, 100));
    inFlight -= 1;
    if (outcomes.shift() === "fail") throw new Error("no connection");
  });
  const probe = vi.fn(async () => true);
  const scheduler = createSyncScheduler({
    sync,
    probe,
    environment: env.environment,
    random: () => 0.5,
    ...overrides,
  });
  return { env, sync, probe, scheduler, outcomes, maxInFlight: () => maxInFlight };
}

beforeEach(() => {
  vi.useFakeTimers();
});
afterEach(() => {
  vi.useRealTimers();
});

describe("backoffDelayMs", () => {
  it("doubles from 5 s up to 5 min, with half of the delay random", () => {
    const fixed = (r: number) => (n: number) => backoffDelayMs(n, 5_000, 300_000, () => r);
    expect([1, 2, 3, 4].map(fixed(1 - Number.EPSILON))).toEqual([5_000, 10_000, 20_000, 40_000]);
    expect(fixed(0)(1)).toBe(2_500);
    expect(fixed(0.999999)(20)).toBe(300_000);
    expect(fixed(0)(20)).toBe(150_000);
  });
});

describe("createSyncScheduler", () => {
  it("runs at start and again when the browser comes online", async () => {
    const { scheduler, sync, env } = setup();
    scheduler.start();
    await vi.advanceTimersByTimeAsync(150);
    expect(sync).toHaveBeenCalledTimes(1);
    env.goOnline();
    await vi.advanceTimersByTimeAsync(150);
    expect(sync).toHaveBeenCalledTimes(2);
    scheduler.stop();
    expect(env.listenerCount()).toBe(0);
  });

  it("waits for writes to pause before running", async () => {
    const { scheduler, sync } = setup();
    scheduler.start();
    await vi.advanceTimersByTimeAsync(150);
    scheduler.notifyWrite();
    await vi.advanceTimersByTimeAsync(1_000);
    scheduler.notifyWrite();
    await vi.advanceTimersByTimeAsync(1_000);
    expect(sync).toHaveBeenCalledTimes(1);
    await vi.advanceTimersByTimeAsync(600);
    expect(sync).toHaveBeenCalledTimes(2);
    scheduler.stop();
  });

  it("probes the server every 30 s while visible and syncs when it answers", async () => {
    const { scheduler, sync, probe, env } = setup();
    scheduler.start();
    await vi.advanceTimersByTimeAsync(150);
    await vi.advanceTimersByTimeAsync(30_000);
    expect(probe).toHaveBeenCalledTimes(1);
    expect(sync).toHaveBeenCalledTimes(2);
    env.setVisible(false);
    await vi.advanceTimersByTimeAsync(60_000);
    expect(probe).toHaveBeenCalledTimes(1);
    probe.mockResolvedValue(false);
    env.setVisible(true);
    await vi.advanceTimersByTimeAsync(30_000);
    expect(probe).toHaveBeenCalledTimes(2);
    expect(sync).toHaveBeenCalledTimes(2);
    scheduler.stop();
  });

  it("backs off after failures, doubling, and resets after a success", async () => {
    const { scheduler, sync, outcomes } = setup({ probe: async () => false });
    outcomes.push("fail", "fail", "ok");
    scheduler.start();
    await vi.advanceTimersByTimeAsync(100);
    expect(sync).toHaveBeenCalledTimes(1);
    // random 0.5 → three quarters of the full delay: 3.75 s, then 7.5 s.
    expect(scheduler.retryAt()).toBe(Date.now() + 3_750);
    await vi.advanceTimersByTimeAsync(3_749);
    expect(sync).toHaveBeenCalledTimes(1);
    await vi.advanceTimersByTimeAsync(1 + 100);
    expect(sync).toHaveBeenCalledTimes(2);
    expect(scheduler.retryAt()).toBe(Date.now() + 7_500);
    await vi.advanceTimersByTimeAsync(7_600);
    expect(sync).toHaveBeenCalledTimes(3);
    expect(scheduler.retryAt()).toBeNull();
    scheduler.stop();
  });

  it("does not run on writes while waiting after a failure, but runs on demand", async () => {
    const { scheduler, sync, outcomes } = setup({ probe: async () => false });
    outcomes.push("fail");
    scheduler.start();
    await vi.advanceTimersByTimeAsync(100);
    scheduler.notifyWrite();
    await vi.advanceTimersByTimeAsync(2_000);
    expect(sync).toHaveBeenCalledTimes(1);
    const now = scheduler.runNow();
    await vi.advanceTimersByTimeAsync(100);
    await now;
    expect(sync).toHaveBeenCalledTimes(2);
    expect(scheduler.retryAt()).toBeNull();
    scheduler.stop();
  });

  it("never overlaps runs; a request during a run gives exactly one more run", async () => {
    const { scheduler, sync, maxInFlight } = setup();
    scheduler.start();
    void scheduler.runNow();
    void scheduler.runNow();
    void scheduler.runNow();
    await vi.advanceTimersByTimeAsync(500);
    expect(sync).toHaveBeenCalledTimes(2);
    expect(maxInFlight()).toBe(1);
    scheduler.stop();
  });

  it("does nothing once stopped", async () => {
    const { scheduler, sync, outcomes } = setup();
    outcomes.push("fail");
    scheduler.start();
    await vi.advanceTimersByTimeAsync(100);
    scheduler.stop();
    await vi.advanceTimersByTimeAsync(10 * 60_000);
    await scheduler.runNow();
    expect(sync).toHaveBeenCalledTimes(1);
  });
});
