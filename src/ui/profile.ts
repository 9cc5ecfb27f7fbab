/**
 * The distances at which the centreline chart is sampled, and the profile itself.
 */
import type { EstimateOutput, Scenario } from "../core/types.ts";
import { logGrid } from "./chart-scale.ts";

export interface ProfileCurve {
  label: string;
  averaging_s: number;
  limit_mg_m3: number;
  values_mg_m3: number[];
}

export interface Profile {
  xs: number[];
  curves: ProfileCurve[];
}

export type ProfileFn = (scenario: Scenario, xs_m: number[]) => ProfileCurve[];

/** Chart distances: 10 m to three times the longest reach (at least 1 km, at most 100 km), 96 points. */
export function chartDistances(output: EstimateOutput): number[] {
  const longest = Math.max(0, ...output.bands.map((b) => b.reach_m ?? 0));
  const max = Math.min(100_000, Math.max(1000, longest * 3));
  return logGrid(10, max, 96);
}

export function makeProfile(scenario: Scenario, output: EstimateOutput, fn: ProfileFn): Profile {
  const xs = chartDistances(output);
  return { xs, curves: fn(scenario, xs) };
}
