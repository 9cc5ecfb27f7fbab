/**
 * Messages between the page and the estimate worker, and the worker's one job: run `estimate`
 * on a request and describe the outcome as plain, structured-cloneable data.
 *
 * A ScenarioError cannot cross postMessage as itself (structured clone keeps only name and
 * message of an Error), so its `problems` travel as data and the client rebuilds the error.
 */

import { ScenarioError } from "../../core/errors.ts";
import type { EstimateOptions } from "../../core/index.ts";
import type { EstimateOutput, ScenarioProblem } from "../../core/types.ts";

export interface EstimateRequest {
  /** Increasing per client; the reply carries it back. */
  id: number;
  scenario: unknown;
  options?: EstimateOptions;
}

export type EstimateReply =
  | { id: number; ok: true; output: EstimateOutput }
  | { id: number; ok: false; error: { kind: "scenario"; problems: ScenarioProblem[] } }
  | { id: number; ok: false; error: { kind: "failure"; message: string } };

/** Runs one request through `estimateFn`; never throws. */
export function answer(
  req: EstimateRequest,
  estimateFn: (scenario: unknown, options?: EstimateOptions) => EstimateOutput,
): EstimateReply {
  try {
    return { id: req.id, ok: true, output: estimateFn(req.scenario, req.options) };
  } catch (err) {
    if (err instanceof ScenarioError) {
      return { id: req.id, ok: false, error: { kind: "scenario", problems: err.problems } };
    }
    const message = err instanceof Error ? err.message : String(err);
    return { id: req.id, ok: false, error: { kind: "failure", message } };
  }
}
