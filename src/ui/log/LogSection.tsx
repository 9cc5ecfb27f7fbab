// Placeholder until the estimate log lands (issue 4). Contract: see LogSectionProps.
import type { EstimateOutput, Scenario } from "../../core/types.ts";

export interface LogSectionProps {
  /** The scenario on screen and its latest valid result (null while inputs are invalid). */
  scenario: Scenario | null;
  result: EstimateOutput | null;
  /** Load a logged entry's inputs into the screen as a new estimate. */
  onReopen: (scenario: Scenario) => void;
}

export function LogSection(_props: LogSectionProps) {
  return null;
}
