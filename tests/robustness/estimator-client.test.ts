/**
 * The estimate worker's client (src/app/worker/client.ts): latest wins, a 2 s timeout that
 * restarts the worker, and typed errors — the contract written at the top of client.ts, so that
 * the screen never waits on a slow solve (issue 5, "The UI never blocks"). A fake worker stands
 * in for the Web Worker; timers are vitest's fake timers (no assertion depends on real time).
 */
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import {
  createEstimator,
  DEFAULT_TIMEOUT_MS,
  EstimateCancelled,
  EstimateTimeout,
  EstimateWorkerError,
  type WorkerLike,
} from "../../src/app/worker/client.ts";
import { answer, type EstimateReply, type EstimateRequest } from "../../src/app/worker/protocol.ts";
import { estimate, ScenarioError } from "../../src/core/index.ts";
import type { Scenario } from "../../src/core/types.ts";

/** A fake worker: records requests; the test answers them (through the real core) or not. */
class FakeWorker implements WorkerLike {
  onmessage: ((ev: { data: EstimateReply }) => void) | null = null;
  onerror: ((ev: { message?: string }) => void) | null = null;
  readonly received: EstimateRequest[] = [];
  terminated = false;
  postMessage(message: EstimateRequest): void {
    // Like the real thing: the message is structured-cloned.
    this.received.push(structuredClone(message));
  }
  terminate(): void {
    this.terminated = true;
  }
  /** Answers request `id` with the real core, the reply structured-cloned as postMessage does. */
  reply(id: number): void {
    const req = this.received.find((r) => r.id === id);
    if (!req) throw new Error(`request ${id} was never posted`);
    this.onmessage?.({ data: structuredClone(answer(req, estimate)) });
  }
}

function harness() {
  const workers: FakeWorker[] = [];
  const est = createEstimator({
    makeWorker: () => {
      const w = new FakeWorker();
      workers.push(w);
      return w;
    },
  });
  const last = () => workers[workers.length - 1] as FakeWorker;
  return { est, workers, last };
}

/** An invented scenario with a given rate (g/s). */
function scenario(rate: number): Scenario {
  return {
    release: { kind: "continuous", rate_g_s: rate },
    weather: { wind_speed_m_s: 3, wind_from_deg: 250, stability: "D" },
    limits: [{ label: "Limit A (invented)", value: 40, unit: "mg/m3", averaging_s: 3600 }],
  };
}

/** Records how a promise settled, without awaiting it. */
function track<T>(p: Promise<T>) {
  const state: { value?: T; error?: unknown; settled: boolean } = { settled: false };
  p.then(
    (v) => Object.assign(state, { value: v, settled: true }),
    (e) => Object.assign(state, { error: e, settled: true }),
  );
  return state;
}

const flush = () => vi.advanceTimersByTimeAsync(0);

beforeEach(() => {
  vi.useFakeTimers();
});
afterEach(() => {
  vi.useRealTimers();
});

describe("createEstimator", () => {
  test("resolves with the worker's estimate, equal to the core's own", async () => {
    const { est, last } = harness();
    const p = track(est.run(scenario(500)));
    expect(last().received.map((r) => r.id)).toEqual([1]);
    last().reply(1);
    await flush();
    expect(p.value).toEqual(estimate(scenario(500)));
  });

  test("passes the options through (geojson: false)", async () => {
    const { est, last } = harness();
    const s = { ...scenario(500), source: { lat: 47, lon: 8 } };
    const p = track(est.run(s, { geojson: false }));
    expect(last().received[0]?.options).toEqual({ geojson: false });
    last().reply(1);
    await flush();
    expect(p.value?.geojson).toBeUndefined();
  });

  test("latest wins: older calls reject as superseded, only the newest waiting one is sent", async () => {
    const { est, last } = harness();
    const a = track(est.run(scenario(100)));
    const b = track(est.run(scenario(200)));
    const c = track(est.run(scenario(300)));
    await flush();
    expect(a.error).toBeInstanceOf(EstimateCancelled);
    expect((a.error as EstimateCancelled).reason).toBe("superseded");
    expect(b.error).toBeInstanceOf(EstimateCancelled);
    expect(c.settled).toBe(false);
    // a is in the worker; b was replaced by c before it was ever sent.
    expect(last().received.map((r) => r.id)).toEqual([1]);
    last().reply(1); // a's late answer is dropped, then c is sent
    await flush();
    expect(c.settled).toBe(false);
    expect(last().received.map((r) => r.id)).toEqual([1, 3]);
    last().reply(3);
    await flush();
    expect(c.value?.bands[0]?.reach_m).toBe(estimate(scenario(300)).bands[0]?.reach_m);
  });

  test(`a solve over ${DEFAULT_TIMEOUT_MS} ms: the worker is restarted and the promise rejects with EstimateTimeout`, async () => {
    const { est, workers, last } = harness();
    const slow = track(est.run(scenario(500)));
    await vi.advanceTimersByTimeAsync(DEFAULT_TIMEOUT_MS - 1);
    expect(slow.settled).toBe(false);
    await vi.advanceTimersByTimeAsync(1);
    expect(slow.error).toBeInstanceOf(EstimateTimeout);
    expect(workers[0]?.terminated).toBe(true);
    // The next call gets a fresh worker and an answer.
    const next = track(est.run(scenario(50)));
    expect(workers).toHaveLength(2);
    last().reply(2);
    await flush();
    expect(next.value?.bands).toHaveLength(1);
  });

  test("an answer just inside the time allowed is delivered, and the timer does not fire later", async () => {
    const { est, workers, last } = harness();
    const p = track(est.run(scenario(500)));
    await vi.advanceTimersByTimeAsync(DEFAULT_TIMEOUT_MS - 1);
    last().reply(1);
    await vi.advanceTimersByTimeAsync(10 * DEFAULT_TIMEOUT_MS);
    expect(p.value).toBeDefined();
    expect(workers[0]?.terminated).toBe(false);
  });

  test("a superseded solve that hangs: the newest call runs on a fresh worker after the timeout", async () => {
    const { est, workers, last } = harness();
    const hung = track(est.run(scenario(1)));
    const newest = track(est.run(scenario(2)));
    await flush();
    expect((hung.error as EstimateCancelled).reason).toBe("superseded"); // not a timeout
    await vi.advanceTimersByTimeAsync(DEFAULT_TIMEOUT_MS);
    expect(workers).toHaveLength(2);
    expect(workers[0]?.terminated).toBe(true);
    expect(last().received.map((r) => r.id)).toEqual([2]);
    last().reply(2);
    await flush();
    expect(newest.value).toBeDefined();
  });

  test("a rejected scenario comes back as the core's ScenarioError with its problems", async () => {
    const { est, last } = harness();
    const p = track(est.run(scenario(0)));
    last().reply(1);
    await flush();
    expect(p.error).toBeInstanceOf(ScenarioError);
    expect((p.error as ScenarioError).problems.map((q) => q.field)).toEqual(["release.rate_g_s"]);
  });

  test("a failing worker rejects with EstimateWorkerError and the next call gets a fresh one", async () => {
    const { est, workers, last } = harness();
    const p = track(est.run(scenario(500)));
    last().onerror?.({ message: "script did not load" });
    await flush();
    expect(p.error).toBeInstanceOf(EstimateWorkerError);
    expect((p.error as Error).message).toContain("script did not load");
    expect(workers[0]?.terminated).toBe(true);
    track(est.run(scenario(500)));
    expect(workers).toHaveLength(2);
  });

  test("dispose rejects what is unsettled, terminates the worker, and refuses later calls", async () => {
    const { est, workers } = harness();
    const a = track(est.run(scenario(1)));
    const b = track(est.run(scenario(2)));
    est.dispose();
    const c = track(est.run(scenario(3)));
    await vi.advanceTimersByTimeAsync(10 * DEFAULT_TIMEOUT_MS);
    expect((a.error as EstimateCancelled).reason).toBe("superseded");
    expect((b.error as EstimateCancelled).reason).toBe("disposed");
    expect((c.error as EstimateCancelled).reason).toBe("disposed");
    expect(workers[0]?.terminated).toBe(true);
    expect(workers).toHaveLength(1);
  });
});
