/**
 * The spread against the field (issue 13): for each compared arc, the concentration range the
 * spread gives at that distance (centreline at 1.5 m, the run's class one step either way ×
 * the measured wind ÷ and × 1.3, the model's defaults), and whether the measured arc maximum lies
 * inside it (coverage). Also how wide the range is: the ratio max/min, and that ratio ÷ 4, the
 * ratio of a factor-of-two band (obs/2 to 2·obs), so 1 means as wide as FAC2. Nothing is tuned.
 */
import { DEFAULTS } from "../../src/core/scenario.ts";
import { spreadClasses, spreadWinds } from "../../src/core/spread.ts";
import type { Scenario, SigmaScheme, StabilityClass } from "../../src/core/types.ts";
import type { CheckResult, ComparedArc, Estimator } from "./check.ts";

export interface CoverageGroup {
  group: string;
  count: number;
  /** Share of arcs whose measured maximum lies in [min, max] of the spread (0–1). */
  coverage: number;
  /** Geometric mean of max/min over the group's arcs. */
  width_ratio: number;
  /** width_ratio ÷ 4: how many times wider than a factor-of-two band. */
  times_fac2: number;
}

/** Concentration range [min, max] (mg/m³) at each point of `scenario` over the spread's weathers. */
export function spreadRange(scenario: Scenario, estimate: Estimator): [number, number][] {
  const w = scenario.weather;
  const classes = spreadClasses(w.stability as StabilityClass, DEFAULTS.spread_classes);
  const winds = spreadWinds(w.wind_speed_m_s, DEFAULTS.spread_wind_factor);
  let ranges: [number, number][] | null = null;
  for (const stability of classes) {
    for (const wind_speed_m_s of winds) {
      const out = estimate({
        ...scenario,
        weather: { ...w, stability, wind_speed_m_s },
        spread: { classes: 0, wind_factor: 1 },
      });
      const cs = out.points.map((p) => p.concentration_mg_m3);
      ranges = ranges
        ? ranges.map(([lo, hi], i) => [Math.min(lo, cs[i] ?? lo), Math.max(hi, cs[i] ?? hi)])
        : cs.map((c) => [c, c]);
    }
  }
  return ranges ?? [];
}

function group(name: string, rows: readonly ComparedArc[], scheme: SigmaScheme): CoverageGroup {
  let inside = 0;
  let lnSum = 0;
  for (const r of rows) {
    const [lo, hi] = r.spread_mg_m3[scheme];
    if (r.observed_mg_m3 >= lo && r.observed_mg_m3 <= hi) inside++;
    lnSum += Math.log(hi / lo);
  }
  const n = rows.length;
  const ratio = n > 0 ? Math.exp(lnSum / n) : Number.NaN;
  return {
    group: name,
    count: n,
    coverage: n > 0 ? inside / n : Number.NaN,
    width_ratio: ratio,
    times_fac2: ratio / 4,
  };
}

/** Coverage per arc distance and per class (and overall), for one scheme. */
export function coverage(result: CheckResult, scheme: SigmaScheme): CoverageGroup[] {
  const rows = result.compared;
  const out = [group("all arcs", rows, scheme)];
  const distances = [...new Set(rows.map((r) => r.distance_m))].sort((a, b) => a - b);
  for (const d of distances) {
    out.push(
      group(
        `${d} m`,
        rows.filter((r) => r.distance_m === d),
        scheme,
      ),
    );
  }
  for (const c of ["A", "B", "C", "D", "E", "F"] as const) {
    const cr = rows.filter((r) => r.stability === c);
    if (cr.length > 0) out.push(group(`class ${c}`, cr, scheme));
  }
  return out;
}

/** The coverage table as text, both schemes. */
export function formatCoverage(result: CheckResult): string {
  const out = [
    "",
    "Spread: class one step either way × wind ÷ and × 1.3; coverage = share of measured arc maxima inside the spread's range at that distance; width = geometric mean of max/min, and that ÷ 4 (a factor-of-two band spans 4).",
  ];
  for (const scheme of ["briggs", "pasquill-gifford"] as const) {
    out.push("", `Spread coverage, ${scheme}`);
    const head = ["group".padEnd(12), "    n", "coverage", " max/min", " × FAC2 band"];
    out.push(head.join("  "), "-".repeat(head.join("  ").length));
    for (const g of coverage(result, scheme)) {
      out.push(
        [
          g.group.padEnd(12),
          String(g.count).padStart(5),
          g.coverage.toFixed(2).padStart(8),
          g.width_ratio.toFixed(2).padStart(8),
          g.times_fac2.toFixed(2).padStart(12),
        ].join("  "),
      );
    }
  }
  return `${out.join("\n")}\n`;
}
