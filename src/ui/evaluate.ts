/**
 * One pass from the form to what the screen shows: build the scenario, run the
 * core, and keep the last valid result (marked stale while the inputs are invalid).
 * Pure apart from the `estimate` function passed in.
 */
import { ScenarioError } from "../core/errors.ts";
import { parseScenario } from "../core/scenario.ts";
import type { EstimateOutput, Scenario } from "../core/types.ts";
import {
  type BuildContext,
  buildForChecking,
  buildScenario,
  type FieldProblem,
  type FormState,
  problemsFromCore,
} from "./form.ts";

export interface Valid {
  scenario: Scenario;
  output: EstimateOutput;
}

export interface Evaluation {
  /** The latest valid result: of the current inputs, or of earlier ones when `stale`. */
  last: Valid | null;
  /** True when `last` does not describe the inputs now on screen. */
  stale: boolean;
  problems: FieldProblem[];
}

export type EstimateFn = (s: Scenario) => EstimateOutput;

/** The form read into a scenario to estimate, or the problems that stop it (previous result kept). */
export type Readiness =
  | { ready: true; scenario: Scenario }
  | { ready: false; evaluation: Evaluation };

/** First half of a pass: read the form; the estimate itself may then run here or in a worker. */
export function readForm(form: FormState, ctx: BuildContext, previous: Valid | null): Readiness {
  const built = buildScenario(form, ctx);
  if (built.ok) return { ready: true, scenario: built.scenario };
  return {
    ready: false,
    evaluation: {
      last: previous,
      stale: previous !== null,
      problems: withCoreChecks(form, ctx, built.problems),
    },
  };
}

/** Second half: what the screen shows for the estimate's output, or for the error it threw. */
export function settle(
  scenario: Scenario,
  outcome: { output: EstimateOutput } | { error: unknown },
  previous: Valid | null,
): Evaluation {
  if ("output" in outcome) {
    return { last: { scenario, output: outcome.output }, stale: false, problems: [] };
  }
  const err = outcome.error;
  const problems: FieldProblem[] =
    err instanceof ScenarioError
      ? problemsFromCore(err.problems)
      : [
          {
            field: "",
            message: `The estimate could not be computed for these inputs (${
              err instanceof Error ? err.message : String(err)
            }). Check the values.`,
          },
        ];
  return { last: previous, stale: previous !== null, problems };
}

/** One synchronous pass: read the form, run `estimate`, settle. */
export function evaluate(
  form: FormState,
  ctx: BuildContext,
  estimate: EstimateFn,
  previous: Valid | null,
): Evaluation {
  const r = readForm(form, ctx, previous);
  if (!r.ready) return r.evaluation;
  try {
    return settle(r.scenario, { output: estimate(r.scenario) }, previous);
  } catch (error) {
    return settle(r.scenario, { error }, previous);
  }
}

/**
 * While some field cannot be read, still let the core check all the others, so
 * every problem shows at once (a negative rate is marked even while the wind
 * direction is half typed). Core problems on fields the form already flagged are dropped.
 */
function withCoreChecks(form: FormState, ctx: BuildContext, own: FieldProblem[]): FieldProblem[] {
  const checked = buildForChecking(form, ctx);
  if (!checked.scenario) return own;
  try {
    parseScenario(checked.scenario);
    return own;
  } catch (err) {
    if (!(err instanceof ScenarioError)) return own;
    const flagged = new Set(own.map((p) => p.field));
    return [
      ...own,
      ...problemsFromCore(err.problems).filter((p) => p.field && !flagged.has(p.field)),
    ];
  }
}
