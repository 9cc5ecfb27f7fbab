/**
 * The spread (glossary: Spread): every band again under the weather's uncertainty, the
 * stability class one step less and one step more stable (clamped to A–F) crossed with the
 * measured wind divided and multiplied by a factor: up to nine weathers, the estimate's own
 * included. Per band: the shortest and longest reach and which weather gives each, the widest
 * band and the largest area, and the outer envelope of all the variants' swept bands.
 * Pure: no DOM, no storage, no clock.
 */
import { envelopeRing } from "./envelope.ts";
import { fmt, type Prepared, warn } from "./estimate.ts";
import { type BandSolution, solveBand } from "./footprint.ts";
import { plumeCache, setupFor } from "./setup.ts";
import type {
  BandSpread,
  EstimateOutput,
  LocalRing,
  SpreadSummary,
  SpreadVariant,
  StabilityClass,
} from "./types.ts";
import { STABILITY_CLASSES } from "./types.ts";

/** One weather of the spread, with whether its wind hit the calm clamp, and its bands. */
export interface SolvedVariant {
  variant: SpreadVariant;
  /** The wind at release height was under 1 m/s and computed as 1 m/s. */
  calm: boolean;
  /** One solution per limit, in the scenario's order. */
  solutions: readonly BandSolution[];
}

export interface SpreadResult {
  summary: SpreadSummary;
  /** One per limit, in the scenario's order. */
  bands: BandSpread[];
  /** The outer envelope of each band (swing included); empty when no variant gives a band. */
  envelopes: LocalRing[];
  /** Every variant solved (the estimate itself first among equals, in class × wind order). */
  variants: SolvedVariant[];
}

/**
 * The classes of the spread around `c`, least stable first: `steps` (0 or 1) each way,
 * clamped to A–F without repeats (at A: A and B; at F: E and F).
 */
export function spreadClasses(c: StabilityClass, steps: number): StabilityClass[] {
  const i = STABILITY_CLASSES.indexOf(c);
  const out: StabilityClass[] = [];
  for (let k = i - steps; k <= i + steps; k++) {
    const cls = STABILITY_CLASSES[Math.max(0, Math.min(STABILITY_CLASSES.length - 1, k))];
    if (cls !== undefined && !out.includes(cls)) out.push(cls);
  }
  return out;
}

/** The measured wind speeds of the spread (m/s), slowest first: u/f, u, u·f without repeats. */
export function spreadWinds(u: number, factor: number): number[] {
  const out: number[] = [];
  for (const v of [u / factor, u, u * factor]) if (!out.includes(v)) out.push(v);
  return out;
}

/**
 * Solves every band under every weather of the spread. `main` holds the estimate's own
 * solutions (reused, not solved again).
 */
export function solveSpread(prep: Prepared, main: readonly BandSolution[]): SpreadResult {
  const { parsed, setup } = prep;
  const zr = parsed.receptorHeight;
  const classes = spreadClasses(setup.stability, parsed.spread.classes);
  const winds = spreadWinds(parsed.windSpeedRef, parsed.spread.windFactor);
  const variants: SolvedVariant[] = [];
  for (const stability of classes) {
    for (const u of winds) {
      const v = setupFor(parsed, stability, u);
      const own = stability === setup.stability && u === parsed.windSpeedRef;
      let solutions = main;
      if (!own) {
        const plume = plumeCache(v.setup);
        solutions = prep.limits.map((l) =>
          solveBand(plume(l.averaging), l.value, zr, parsed.windSwingDeg),
        );
      }
      variants.push({ variant: { stability, wind_speed_m_s: u }, calm: v.calm, solutions });
    }
  }
  const bands = prep.limits.map((_, i) => bandSpread(variants, i));
  const envelopes = prep.limits.map((_, i) =>
    envelopeRing(variants.map((v) => (v.solutions[i] as BandSolution).swept)),
  );
  return {
    summary: { classes, wind_speeds_m_s: winds, variants: variants.length },
    bands,
    envelopes,
    variants,
  };
}

/** The spread figures of band `i` over the variants. */
function bandSpread(variants: readonly SolvedVariant[], i: number): BandSpread {
  const first = variants[0] as SolvedVariant;
  let reachMin: number | null = Number.POSITIVE_INFINITY;
  let reachMax: number | null = null;
  let widthMax: number | null = null;
  let areaMax: number | null = null;
  let minV = first.variant;
  let maxV = first.variant;
  let wideV = first.variant;
  for (const v of variants) {
    const s = v.solutions[i] as BandSolution;
    if (s.reach === null) {
      if (reachMin !== null) minV = v.variant;
      reachMin = null;
    } else {
      if (reachMin !== null && s.reach < reachMin) {
        reachMin = s.reach;
        minV = v.variant;
      }
      if (reachMax === null || s.reach > reachMax) {
        reachMax = s.reach;
        maxV = v.variant;
      }
    }
    if (s.sweptMaxWidth !== null && (widthMax === null || s.sweptMaxWidth > widthMax)) {
      widthMax = s.sweptMaxWidth;
      wideV = v.variant;
    }
    if (s.sweptArea !== null && (areaMax === null || s.sweptArea > areaMax)) areaMax = s.sweptArea;
  }
  return {
    reach_min_m: reachMin,
    reach_max_m: reachMax,
    width_max_m: widthMax,
    area_max_m2: areaMax,
    reach_min_variant: minV,
    reach_max_variant: maxV,
    widest_variant: wideV,
  };
}

/**
 * Adds the spread to `out` (from `solveLocal`): each band's figures and envelope, the summary,
 * and the calm warning of a weather whose wind is clamped when the estimate's own is not.
 */
export function addSpread(out: EstimateOutput, prep: Prepared, solutions: BandSolution[]): void {
  const spread = solveSpread(prep, solutions);
  out.bands.forEach((b, i) => {
    b.spread = spread.bands[i];
  });
  out.footprint.bands.forEach((lb, i) => {
    lb.envelope = spread.envelopes[i] ?? [];
  });
  out.spread = spread.summary;
  const calm = spread.variants.filter((v) => v.calm).map((v) => v.variant);
  if (calm.length > 0 && !out.warnings.some((w) => w.code === "calm-wind")) {
    const which = calm.map((v) => `class ${v.stability} at ${fmt(v.wind_speed_m_s)} m/s`);
    warn(
      out.warnings,
      "spread-calm-wind",
      `Spread: with ${which.join(", ")} the wind at release height is under 1 m/s; those ` +
        "weathers are computed with 1 m/s, but a Gaussian plume does not describe calms.",
    );
  }
}
