/**
 * The page side of the estimate worker: `createEstimator().run(scenario)` returns a promise of
 * the estimate, computed off the main thread.
 *
 * Promise contract (written before the code):
 * - Latest wins. At most one request is in the worker and at most one waits. A newer `run`
 *   settles every older unsettled promise at once with `EstimateCancelled` (reason
 *   "superseded"); a superseded request already in the worker runs on, but its answer is dropped.
 * - Timeout. A request in the worker longer than `timeoutMs` (2 s; counted from the moment it is
 *   posted, so it includes the worker's start-up on the first request) makes the client
 *   terminate the worker and start a fresh one; that promise rejects with `EstimateTimeout`
 *   (unless it was already superseded), and the waiting request, if any, goes to the new worker.
 * - A scenario the core rejects rejects with the core's own `ScenarioError` (problems intact).
 * - A worker that fails (its script does not load, an uncaught error) rejects the request in it
 *   with `EstimateWorkerError`; the next request gets a fresh worker.
 * - `dispose()` rejects what is unsettled with `EstimateCancelled` (reason "disposed"),
 *   terminates the worker, and makes later `run` calls reject the same way.
 * Every promise settles exactly once.
 */
import { ScenarioError } from "../../core/errors.ts";
import type { EstimateOptions } from "../../core/index.ts";
import type { EstimateOutput } from "../../core/types.ts";
import type { EstimateReply, EstimateRequest } from "./protocol.ts";

/** A solve took longer than the time allowed; the worker was restarted. */
export class EstimateTimeout extends Error {
  readonly timeoutMs: number;
  constructor(timeoutMs: number) {
    super(`The estimate took longer than ${timeoutMs / 1000} s and was stopped.`);
    this.name = "EstimateTimeout";
    this.timeoutMs = timeoutMs;
  }
}

/** A newer request took this one's place, or the estimator was disposed. Not a failure. */
export class EstimateCancelled extends Error {
  readonly reason: "superseded" | "disposed";
  constructor(reason: "superseded" | "disposed") {
    super(
      reason === "superseded" ? "Superseded by a newer estimate." : "The estimator was closed.",
    );
    this.name = "EstimateCancelled";
    this.reason = reason;
  }
}

/** The worker itself failed (did not load, or threw outside the estimate). */
export class EstimateWorkerError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "EstimateWorkerError";
  }
}

/** What the client needs of a Worker (a fake one in the unit tests). */
export interface WorkerLike {
  postMessage(message: EstimateRequest): void;
  terminate(): void;
  onmessage: ((ev: { data: EstimateReply }) => void) | null;
  onerror: ((ev: { message?: string }) => void) | null;
}

export interface Estimator {
  run(scenario: unknown, options?: EstimateOptions): Promise<EstimateOutput>;
  dispose(): void;
}

export interface EstimatorOptions {
  /** Longest time (ms) one request may spend in the worker; default 2000. */
  timeoutMs?: number;
  /** Makes a worker; default: the module worker estimate.worker.ts. */
  makeWorker?: () => WorkerLike;
}

export const DEFAULT_TIMEOUT_MS = 2000;

function moduleWorker(): WorkerLike {
  // Vite recognises this exact form and bundles the worker as its own chunk.
  return new Worker(new URL("./estimate.worker.ts", import.meta.url), {
    type: "module",
  }) as unknown as WorkerLike;
}

interface Job {
  id: number;
  scenario: unknown;
  options: EstimateOptions | undefined;
  resolve(out: EstimateOutput): void;
  reject(err: Error): void;
  settled: boolean;
}

export function createEstimator(opts: EstimatorOptions = {}): Estimator {
  const timeoutMs = opts.timeoutMs ?? DEFAULT_TIMEOUT_MS;
  const makeWorker = opts.makeWorker ?? moduleWorker;
  let worker: WorkerLike | null = null;
  let inFlight: Job | null = null;
  let waiting: Job | null = null;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let nextId = 1;
  let disposed = false;

  const settle = (job: Job, fn: () => void) => {
    if (job.settled) return;
    job.settled = true;
    fn();
  };
  const cancel = (job: Job | null, reason: "superseded" | "disposed") => {
    if (job) settle(job, () => job.reject(new EstimateCancelled(reason)));
  };
  const stopTimer = () => {
    if (timer !== null) clearTimeout(timer);
    timer = null;
  };
  const dropWorker = () => {
    if (!worker) return;
    worker.onmessage = null;
    worker.onerror = null;
    worker.terminate();
    worker = null;
  };

  const onReply = (reply: EstimateReply) => {
    const job = inFlight;
    if (!job || reply.id !== job.id) return;
    stopTimer();
    inFlight = null;
    settle(job, () => {
      if (reply.ok) job.resolve(reply.output);
      else if (reply.error.kind === "scenario") job.reject(new ScenarioError(reply.error.problems));
      else job.reject(new EstimateWorkerError(reply.error.message));
    });
    pump();
  };

  const onFailure = (message: string) => {
    const job = inFlight;
    stopTimer();
    inFlight = null;
    dropWorker();
    if (job) settle(job, () => job.reject(new EstimateWorkerError(message)));
    pump();
  };

  const onTimeout = () => {
    timer = null;
    const job = inFlight;
    inFlight = null;
    dropWorker();
    if (job) settle(job, () => job.reject(new EstimateTimeout(timeoutMs)));
    pump();
  };

  const ensureWorker = (): WorkerLike => {
    if (worker) return worker;
    const w = makeWorker();
    w.onmessage = (ev) => onReply(ev.data);
    w.onerror = (ev) => onFailure(`The estimate worker failed: ${ev.message ?? "unknown error"}`);
    worker = w;
    return w;
  };

  function pump(): void {
    if (disposed || inFlight || !waiting) return;
    const job = waiting;
    waiting = null;
    inFlight = job;
    let w: WorkerLike;
    try {
      w = ensureWorker();
      const req: EstimateRequest = { id: job.id, scenario: job.scenario };
      if (job.options) req.options = job.options;
      w.postMessage(req);
    } catch (err) {
      // No worker could be made, or the scenario could not be cloned.
      inFlight = null;
      settle(job, () =>
        job.reject(new EstimateWorkerError(err instanceof Error ? err.message : String(err))),
      );
      pump();
      return;
    }
    timer = setTimeout(onTimeout, timeoutMs);
  }

  return {
    run(scenario, options) {
      if (disposed) return Promise.reject(new EstimateCancelled("disposed"));
      return new Promise<EstimateOutput>((resolve, reject) => {
        cancel(waiting, "superseded");
        cancel(inFlight, "superseded");
        waiting = { id: nextId++, scenario, options, resolve, reject, settled: false };
        pump();
      });
    },
    dispose() {
      if (disposed) return;
      disposed = true;
      stopTimer();
      cancel(waiting, "disposed");
      cancel(inFlight, "disposed");
      waiting = null;
      inFlight = null;
      dropWorker();
    },
  };
}
