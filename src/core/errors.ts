import type { ScenarioProblem } from "./types.ts";

/**
 * Thrown by `parseScenario` / `estimate` when the scenario is not valid.
 * `problems` lists every problem found, each naming the field, the value and what is allowed.
 */
export class ScenarioError extends Error {
  readonly problems: ScenarioProblem[];
  constructor(problems: ScenarioProblem[]) {
    super(problems.map(formatProblem).join("\n"));
    this.name = "ScenarioError";
    this.problems = problems;
  }
}

/** One line: `field: message (got VALUE)`. */
export function formatProblem(p: ScenarioProblem): string {
  let shown: string;
  try {
    shown = p.value === undefined ? "nothing" : JSON.stringify(p.value);
  } catch {
    shown = String(p.value);
  }
  if (shown.length > 60) shown = `${shown.slice(0, 57)}...`;
  return `${p.field}: ${p.message} (got ${shown})`;
}
