/**
 * Text table, JSON figures and the generated about-page module for the Prairie Grass check.
 * Pure string building: no file access here.
 */

import type { SigmaScheme } from "../../src/core/types.ts";
import type { CheckResult } from "./check.ts";
import type { Metrics } from "./metrics.ts";

export const DATASET_CITATION =
  "Barad, M. L. (ed.) (1958). Project Prairie Grass, a Field Program in Diffusion. Geophysical Research Papers No. 59, Air Force Cambridge Research Center.";
export const METRICS_CITATION =
  "Chang, J. C. & Hanna, S. R. (2004). Air quality model performance evaluation. Meteorology and Atmospheric Physics 87, 167–196.";

export const SCHEME_TITLES: Record<SigmaScheme, string> = {
  briggs: "Briggs open-country curves (default)",
  "pasquill-gifford": "Pasquill–Gifford curves",
};

const num = (v: number | null, digits: number): string => (v === null ? "–" : v.toFixed(digits));

function row(label: string, m: Metrics): string {
  return [
    label.padEnd(12),
    String(m.count).padStart(5),
    num(m.fac2, 2).padStart(6),
    num(m.mg, 2).padStart(6),
    num(m.vg, 2).padStart(7),
    num(m.fb, 2).padStart(6),
    num(m.nmse, 2).padStart(7),
  ].join("  ");
}

/** The readable table printed by `npm run validate`. */
export function formatTable(result: CheckResult): string {
  const out: string[] = [];
  const below = result.excluded.filter((e) => e.status === "below-threshold").length;
  const missing = result.excluded.filter((e) => e.status === "missing").length;
  out.push(
    "Model check: Project Prairie Grass (Barad 1958), predicted centreline vs measured arc maximum",
    `Runs with meteorology: ${result.runs}; arcs: ${result.arcsConsidered}; compared: ${result.compared.length}; left out: ${below} below 0.1 mg/m³, ${missing} with no reading`,
  );
  out.push(
    "Observed = largest reading on the arc × its Table 5.4 factor; arcs whose largest reading is below 0.1 mg/m³ (Barad 1958, Vol. I p. 77) or that have none are left out.",
    "Predicted = centreline at 1.5 m, 10-minute average; class from σθ (EPA-454/R-99-005 Table 6-7); wind at 2 m; open country; no lid.",
  );
  for (const a of result.amendments) {
    out.push(
      `Correction factor, experiment ${a.experiment} at ${a.distance_m} m: printed ${a.printed}, used ${a.used} (${a.reason})`,
    );
  }
  out.push(
    "Measures as defined by Chang & Hanna (2004); FAC2 ≥ 0.5 is the commonly cited acceptance level. MG < 1 and FB < 0 mean over-prediction.",
  );
  for (const scheme of ["briggs", "pasquill-gifford"] as const) {
    const f = result.figures[scheme];
    out.push("", SCHEME_TITLES[scheme]);
    const head = ["group".padEnd(12), "    n", "  FAC2", "    MG", "     VG", "    FB", "   NMSE"];
    out.push(head.join("  "));
    out.push("-".repeat(head.join("  ").length));
    out.push(row("all arcs", f.overall));
    for (const d of f.byDistance) out.push(row(`${d.distance_m} m`, d.metrics));
    for (const c of f.byClass) out.push(row(`class ${c.stability}`, c.metrics));
  }
  return `${out.join("\n")}\n`;
}

/** Figures for `--json`: choices, counts, measures and the compared pairs. */
export function figuresJson(result: CheckResult, modelVersion: string): unknown {
  return {
    dataset: DATASET_CITATION,
    metrics_definitions: METRICS_CITATION,
    model_version: modelVersion,
    setup: {
      release: "continuous, ongoing; Q and release height from PGARCS.txt",
      wind: "U at 2 m from modelParamList.txt (wind_height_m 2)",
      stability: "from sigma_theta by EPA-454/R-99-005 Table 6-7 sigma-A ranges",
      terrain: "open",
      mixing_height: "none",
      receptor_height_m: 1.5,
      averaging_s: 600,
      observed:
        "largest reading on the arc x Table 5.4 factor; arcs below 0.1 mg/m3 or with no reading left out",
    },
    runs: result.runs,
    arcs_considered: result.arcsConsidered,
    arcs_compared: result.compared.length,
    excluded: result.excluded,
    correction_amendments: result.amendments,
    figures: result.figures,
    pairs: result.compared,
  };
}

/** The plain-language sentence for the about page, derived from FAC2 and MG (default scheme). */
export function plainSentence(m: Metrics): string {
  if (m.fac2 === null || m.mg === null) {
    return "No arcs could be compared, so there is no figure to report.";
  }
  const n = Math.round(m.fac2 * 100);
  // MG = exp(<ln Co> - <ln Cp>): the typical (geometric-mean) prediction is Co/MG.
  const ratio = 1 / m.mg;
  let bias: string;
  if (Math.round(Math.abs(ratio - 1) * 100) === 0) {
    bias = "on average they neither over- nor under-predict";
  } else if (ratio > 1) {
    bias = `on average they over-predict by about ${Math.round((ratio - 1) * 100)}%, which errs on the side of caution`;
  } else {
    bias = `on average they under-predict by about ${Math.round((1 - ratio) * 100)}%, so real concentrations can be higher than shown`;
  }
  return `On these 1956 measurements the default curves predict within a factor of two ${n}% of the time; ${bias}.`;
}

/**
 * A second sentence about the farthest arcs, where a Gaussian plume with these curves does
 * worst on this data; derived from the figures, so it stays true when they change.
 */
export function farthestArcSentence(groups: { distance_m: number; metrics: Metrics }[]): string {
  const far = [...groups]
    .filter((g) => g.metrics.count > 0)
    .sort((a, b) => b.distance_m - a.distance_m)[0];
  if (!far || far.metrics.fac2 === null || far.metrics.mg === null) return "";
  const n = Math.round(far.metrics.fac2 * 100);
  return `At ${far.distance_m} m, the farthest arcs, ${n}% are within a factor of two: the scatter grows with distance, so treat far reaches as rough.`;
}

// --- TypeScript literal writer (output formatted the way Biome formats it) -------------------

const IDENT = /^[A-Za-z_$][A-Za-z0-9_$]*$/;
const LINE_WIDTH = 100; // biome.json formatter.lineWidth

function literal(v: unknown, indent: string): string {
  if (v === null) return "null";
  if (typeof v === "number") {
    if (!Number.isFinite(v)) throw new RangeError(`cannot write ${v} into the about module`);
    return String(v);
  }
  if (typeof v === "string") return JSON.stringify(v);
  if (typeof v === "boolean") return String(v);
  if (Array.isArray(v)) {
    if (v.length === 0) return "[]";
    const inner = `${indent}  `;
    return `[\n${v.map((x) => `${inner}${literal(x, inner)},`).join("\n")}\n${indent}]`;
  }
  if (typeof v === "object") {
    const entries = Object.entries(v as Record<string, unknown>);
    if (entries.length === 0) return "{}";
    const inner = `${indent}  `;
    const body = entries
      .map(([k, x]) => {
        const key = IDENT.test(k) ? k : JSON.stringify(k);
        const one = `${inner}${key}: ${literal(x, inner)},`;
        // Like Biome: a string too long for the line moves below its key, indented once more.
        return typeof x === "string" && one.length > LINE_WIDTH
          ? `${inner}${key}:\n${inner}  ${literal(x, inner)},`
          : one;
      })
      .join("\n");
    return `{\n${body}\n${indent}}`;
  }
  throw new TypeError(`cannot write a ${typeof v} into the about module`);
}

const round = (v: number | null, digits = 3): number | null =>
  v === null ? null : Number(v.toFixed(digits));

function schemeFigures(m: Metrics) {
  return {
    count: m.count,
    fac2: round(m.fac2),
    mg: round(m.mg),
    vg: round(m.vg),
    fb: round(m.fb),
    nmse: round(m.nmse),
  };
}

/** Source text of src/ui/about/model-check.ts (figures only, never the data). */
export function aboutModule(result: CheckResult, modelVersion: string): string {
  const b = result.figures.briggs.overall;
  const pg = result.figures["pasquill-gifford"].overall;
  const value = {
    modelVersion,
    dataset: "Project Prairie Grass, O'Neill, Nebraska, July–August 1956",
    citation: DATASET_CITATION,
    metricsCitation: METRICS_CITATION,
    runs: result.runs,
    arcsCompared: result.compared.length,
    arcsBelowThreshold: result.excluded.filter((e) => e.status === "below-threshold").length,
    arcsWithoutReading: result.excluded.filter((e) => e.status === "missing").length,
    briggs: schemeFigures(b),
    pasquillGifford: schemeFigures(pg),
    summary: plainSentence(b),
    farthestArcs: farthestArcSentence(result.figures.briggs.byDistance),
  };
  return `/**
 * How the model compares with field measurements, for the "about the model" page.
 *
 * GENERATED by \`npm run validate -- ../shared/data/prairie_grass --write-about\`
 * (scripts/validate.ts); do not edit by hand. Figures only, not the data.
 *
 * Predicted: centreline concentration at 1.5 m, 10-minute average, stability class from the
 * run's wind-direction spread (σθ). Observed: the largest corrected reading on each arc
 * (50–800 m). Measures (Chang & Hanna 2004): FAC2 = share of arcs predicted within a factor of
 * two; MG = geometric mean bias (below 1 = over-prediction); VG = geometric variance;
 * FB = fractional bias (below 0 = over-prediction); NMSE = normalised mean square error.
 */

export interface ModelCheckScheme {
  count: number;
  fac2: number | null;
  mg: number | null;
  vg: number | null;
  fb: number | null;
  nmse: number | null;
}

export interface ModelCheck {
  modelVersion: string;
  dataset: string;
  citation: string;
  metricsCitation: string;
  runs: number;
  arcsCompared: number;
  arcsBelowThreshold: number;
  arcsWithoutReading: number;
  briggs: ModelCheckScheme;
  pasquillGifford: ModelCheckScheme;
  /** Plain-language summary for a responder (default curves). */
  summary: string;
  /** Plain-language note on the farthest arcs (default curves). */
  farthestArcs: string;
}

export const MODEL_CHECK: ModelCheck = ${literal(value, "")};
`;
}
