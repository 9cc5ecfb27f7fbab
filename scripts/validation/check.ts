/**
 * The model check against Project Prairie Grass (Barad 1958): builds one scenario per run that
 * has meteorology, asks the estimator for the centreline concentration at 1.5 m on each arc,
 * and pairs it with the arc's corrected maximum.
 *
 * Choices (also stated in scripts/validate.ts and the report):
 * - Runs: those in modelParamList.txt (53). Release rate Q and height hs from PGARCS.txt.
 * - Wind: U at 2 m (`wind_height_m: 2`), direction irrelevant for the centreline.
 * - Class: from σθ by EPA-454/R-99-005 Table 6-7 σA ranges (`classFromSigmaTheta`).
 * - Open country, no lid, receptor 1.5 m, 10-minute (600 s) averaging, ongoing release.
 * - Observed: the largest reading on the arc × the arc's Table 5.4 factor. Arcs with no valid
 *   reading, or whose largest reading is below 0.1 mg/m³, are left out and counted.
 */

import type { Scenario, SigmaScheme, StabilityClass } from "../../src/core/types.ts";
import { computeMetrics, type Metrics, type Pair } from "./metrics.ts";
import {
  ARC_DISTANCES_M,
  type ArcMaximum,
  arcMaximum,
  classFromSigmaTheta,
  type PrairieGrassData,
  PrairieGrassDataError,
} from "./prairie-grass.ts";
import { spreadRange } from "./spread-coverage.ts";

/** The part of `estimate()` the check uses. */
export type Estimator = (scenario: Scenario) => { points: { concentration_mg_m3: number }[] };

export const SCHEMES: readonly SigmaScheme[] = ["briggs", "pasquill-gifford"];
export const RECEPTOR_HEIGHT_M = 1.5;
export const AVERAGING_S = 600;
export const WIND_HEIGHT_M = 2;

export interface ComparedArc {
  experiment: number;
  distance_m: number;
  stability: StabilityClass;
  sigma_theta_deg: number;
  observed_mg_m3: number;
  predicted_mg_m3: Record<SigmaScheme, number>;
  /** The spread's concentration range [min, max] (mg/m³) at the arc (spread-coverage.ts). */
  spread_mg_m3: Record<SigmaScheme, [number, number]>;
}

export interface ExcludedArc {
  experiment: number;
  distance_m: number;
  status: Exclude<ArcMaximum["status"], "ok">;
}

export interface SchemeFigures {
  overall: Metrics;
  byDistance: { distance_m: number; metrics: Metrics }[];
  byClass: { stability: StabilityClass; metrics: Metrics }[];
}

export interface CheckResult {
  runs: number;
  arcsConsidered: number;
  compared: ComparedArc[];
  excluded: ExcludedArc[];
  amendments: PrairieGrassData["corrections"]["amendments"];
  figures: Record<SigmaScheme, SchemeFigures>;
}

const CLASSES: readonly StabilityClass[] = ["A", "B", "C", "D", "E", "F"];

/** The scenario for one run (all five arcs as points). */
export function scenarioFor(
  run: { rate_g_s: number; release_height_m: number; wind_speed_2m_m_s: number },
  wind_from_deg: number,
  stability: StabilityClass,
  scheme: SigmaScheme,
  distances: readonly number[],
): Scenario {
  return {
    release: { kind: "continuous", rate_g_s: run.rate_g_s, height_m: run.release_height_m },
    weather: {
      wind_speed_m_s: run.wind_speed_2m_m_s,
      wind_height_m: WIND_HEIGHT_M,
      wind_from_deg,
      stability,
      terrain: "open",
    },
    sigma_scheme: scheme,
    receptor_height_m: RECEPTOR_HEIGHT_M,
    limits: [],
    points: distances.map((x_m) => ({
      x_m,
      y_m: 0,
      z_m: RECEPTOR_HEIGHT_M,
      averaging_s: AVERAGING_S,
    })),
  };
}

function summarise(compared: ComparedArc[], scheme: SigmaScheme): SchemeFigures {
  const pairs = (rows: ComparedArc[]): Pair[] =>
    rows.map((r) => ({ observed: r.observed_mg_m3, predicted: r.predicted_mg_m3[scheme] }));
  return {
    overall: computeMetrics(pairs(compared)),
    byDistance: ARC_DISTANCES_M.map((d) => ({
      distance_m: d,
      metrics: computeMetrics(pairs(compared.filter((r) => r.distance_m === d))),
    })),
    byClass: CLASSES.map((c) => ({
      stability: c,
      metrics: computeMetrics(pairs(compared.filter((r) => r.stability === c))),
    })).filter((g) => g.metrics.count > 0),
  };
}

/** Run the whole check with the given estimator. */
export function runCheck(data: PrairieGrassData, estimate: Estimator): CheckResult {
  const compared: ComparedArc[] = [];
  const excluded: ExcludedArc[] = [];
  let arcsConsidered = 0;
  for (const met of data.meteorology) {
    const arcs = data.arcs
      .filter((a) => a.experiment === met.experiment)
      .sort((a, b) => a.distance_m - b.distance_m);
    const first = arcs[0];
    if (!first) {
      throw new PrairieGrassDataError(
        `run ${met.experiment} has meteorology but no arcs in PGARCS.txt`,
      );
    }
    const stability = classFromSigmaTheta(met.sigma_theta_deg);
    const run = {
      rate_g_s: first.rate_g_s,
      release_height_m: first.release_height_m,
      wind_speed_2m_m_s: met.wind_speed_2m_m_s,
    };
    const maxima = arcs.map((a) => arcMaximum(a, data.corrections));
    arcsConsidered += maxima.length;
    const distances = arcs.map((a) => a.distance_m);
    const predicted = new Map<SigmaScheme, number[]>();
    const spread = new Map<SigmaScheme, [number, number][]>();
    for (const scheme of SCHEMES) {
      const scenario = scenarioFor(run, met.wind_from_deg, stability, scheme, distances);
      const out = estimate(scenario);
      predicted.set(
        scheme,
        out.points.map((p) => p.concentration_mg_m3),
      );
      spread.set(scheme, spreadRange(scenario, estimate));
    }
    maxima.forEach((m, j) => {
      if (m.status !== "ok" || m.corrected_max_mg_m3 === null) {
        excluded.push({
          experiment: m.experiment,
          distance_m: m.distance_m,
          status: m.status === "ok" ? "missing" : m.status,
        });
        return;
      }
      const cp = {} as Record<SigmaScheme, number>;
      const sp = {} as Record<SigmaScheme, [number, number]>;
      for (const scheme of SCHEMES) {
        const v = predicted.get(scheme)?.[j];
        if (v === undefined || !Number.isFinite(v) || v <= 0) {
          throw new Error(
            `estimate() gave ${v} mg/m³ for run ${m.experiment} at ${m.distance_m} m (${scheme}); expected a positive number`,
          );
        }
        cp[scheme] = v;
        sp[scheme] = spread.get(scheme)?.[j] ?? [v, v];
      }
      compared.push({
        experiment: m.experiment,
        distance_m: m.distance_m,
        stability,
        sigma_theta_deg: met.sigma_theta_deg,
        observed_mg_m3: m.corrected_max_mg_m3,
        predicted_mg_m3: cp,
        spread_mg_m3: sp,
      });
    });
  }
  const figures = {
    briggs: summarise(compared, "briggs"),
    "pasquill-gifford": summarise(compared, "pasquill-gifford"),
  };
  return {
    runs: data.meteorology.length,
    arcsConsidered,
    compared,
    excluded,
    amendments: data.corrections.amendments,
    figures,
  };
}
