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

export function evaluate(
  form: FormState,
  ctx: BuildContext,
  estimate: EstimateFn,
  previous: Valid | null,
): Evaluation {
  const built = buildScenario(form, ctx);
  if (!built.ok) {
    return {
      last: previous,
      stale: previous !== null,
      problems: withCoreChecks(form, ctx, built.problems),
    };
  }
  try {
    const output = estimate(built.scenario);
    return { last: { scenario: built.scenario, output }, stale: false, problems: [] };
  } catch (err) {
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
