/**
 * The centreline chart of an estimate: samples the profile (core `centrelineProfile`) and draws
 * it. Loaded after the first estimate is drawn (src/ui/deferred.tsx), with the sampling code.
 */
import { useMemo } from "preact/hooks";
import { centrelineProfile } from "../../core/estimate.ts";
import type { EstimateOutput, Scenario } from "../../core/types.ts";
import type { BandStyle } from "../palette.ts";
import { makeProfile } from "../profile.ts";
import type { UnitSystem } from "../units.ts";
import { CentrelineChart } from "./CentrelineChart.tsx";

export interface ProfileChartProps {
  scenario: Scenario;
  output: EstimateOutput;
  styles: readonly BandStyle[];
  units: UnitSystem;
}

export function ProfileChart({ scenario, output, styles, units }: ProfileChartProps) {
  const profile = useMemo(() => {
    try {
      return makeProfile(scenario, output, centrelineProfile);
    } catch {
      return null;
    }
  }, [scenario, output]);
  return profile ? <CentrelineChart profile={profile} styles={styles} units={units} /> : null;
}
