/**
 * Driftmark's one entry point: `estimate(scenario)` takes the scenario object (the JSON the
 * command-line estimator reads) and returns the estimate object it prints. The app, the command
 * and the model checks all call it. Pure: no DOM, no storage, no clock.
 *
 * The one place the core uses `src/geo` (itself pure, importing only core types and turf): to
 * place the footprint on the earth as RFC 7946 GeoJSON when the scenario has a `source`.
 */
import { footprintGeoJSON } from "../geo/geojson.ts";
import { CAUTION, MODEL_VERSION } from "./caution.ts";
import { solveLocal } from "./estimate.ts";
import { addSpread } from "./spread.ts";
import type { EstimateOutput, Scenario } from "./types.ts";

export { CAUTION, MODEL_VERSION } from "./caution.ts";
export { formatProblem, ScenarioError } from "./errors.ts";
export {
  AIR_MOLECULAR_WEIGHT,
  centrelineProfile,
  estimateLocal,
  LOW_WIND_M_S,
  type Prepared,
  prepare,
} from "./estimate.ts";
export { SCAN_MAX_M } from "./footprint.ts";
export { parseScenario } from "./scenario.ts";
export type * from "./types.ts";

export interface EstimateOptions {
  /** Build the GeoJSON when `source` is given (default true). */
  geojson?: boolean;
  /** Solve the spread (default true; false gives the main bands alone, about nine times faster). */
  spread?: boolean;
}

/**
 * Run the estimate for a scenario (see types.ts `Scenario`; SI with units in the field names).
 * Returns the bands of every limit (each with its spread), the points asked for, the model's warnings, the local
 * footprint geometry and, when `source` is given, the footprint as RFC 7946 GeoJSON.
 * Throws `ScenarioError` listing every problem when the scenario is not valid.
 *
 * @example
 * estimate({
 *   release: { kind: "continuous", rate_g_s: 500, duration_s: 900, height_m: 2 },
 *   weather: { wind_speed_m_s: 3, wind_from_deg: 250, stability: "D" },
 *   limits: [{ label: "Limit A (invented)", value: 40, unit: "mg/m3", averaging_s: 3600 }],
 * }).bands[0].reach_m; // metres downwind
 */
export function estimate(
  scenario: Scenario | unknown,
  options: EstimateOptions = {},
): EstimateOutput {
  const { out, prep, solutions } = solveLocal(scenario);
  if (options.spread !== false) addSpread(out, prep, solutions);
  const source = (scenario as Scenario).source;
  if (source && options.geojson !== false) {
    out.geojson = footprintGeoJSON({
      footprint: out.footprint,
      bands: out.bands,
      source,
      inputs: scenario as Record<string, unknown>,
      modelVersion: MODEL_VERSION,
      caution: CAUTION,
      timestamp: null,
      limitSet: out.limit_set ?? null,
    });
  }
  return out;
}
