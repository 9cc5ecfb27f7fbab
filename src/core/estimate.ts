/**
 * The estimate itself, without placing it on the earth: `estimateLocal(scenario)` gives every
 * figure, warning and the local footprint geometry. `src/core/index.ts` wraps it as `estimate`,
 * adding the GeoJSON when the scenario has a `source`. The app's live updates call this one (the
 * GeoJSON is built only when a footprint is shared), so the first screen does not load the
 * geodesy. Pure: no DOM, no storage, no clock.
 */
import { CAUTION, MODEL_VERSION } from "./caution.ts";
import { type BandSolution, solveBand } from "./footprint.ts";
import type { Plume } from "./plume.ts";
import { parseScenario } from "./scenario.ts";
import { plumeCache, setupFor } from "./setup.ts";
import { CURVE_RANGE_M } from "./sigma.ts";
import { suggestStability } from "./stability.ts";
import { cloudPassage, passageAt } from "./timing.ts";
import type {
  BandOutput,
  EstimateOutput,
  LocalBand,
  ParsedScenario,
  PlumeSetup,
  PointOutput,
  Scenario,
  StabilityClass,
  Warning,
  WarningCode,
} from "./types.ts";
import { mgM3ToPpm, ppmToMgM3 } from "./units.ts";

/** Molecular weight of dry air (g/mol); heavier gases raise the dense-gas caution. */
export const AIR_MOLECULAR_WEIGHT = 29;
/** Below this measured wind (m/s) a stable night gives long, narrow, meandering bands. */
export const LOW_WIND_M_S = 2;

/** What the physics works with after validation and the weather step. */
export interface Prepared {
  parsed: ParsedScenario;
  setup: PlumeSetup;
  stabilityReason: string;
  /** Limits in g/m³, in the scenario's order. */
  limits: { label: string; value: number; averaging: number }[];
  warnings: Warning[];
  /** Plume for averaging time t_a (s), built once per distinct t_a. */
  plume(averaging: number): Plume;
}

/** Validate the scenario and work out the weather, heights and limits. Throws ScenarioError. */
export function prepare(raw: unknown): Prepared {
  const parsed = parseScenario(raw);
  const warnings: Warning[] = [];

  let stability: StabilityClass;
  let stabilityReason: string;
  if (parsed.stability === "auto") {
    const s = suggestStability({
      windSpeed: parsed.windSpeedRef,
      windHeight: parsed.windRefHeight,
      terrain: parsed.terrain,
      sky: parsed.sky ?? "overcast",
      timeMs: parsed.timeMs,
      lat: parsed.source?.lat ?? null,
      lon: parsed.source?.lon ?? null,
    });
    stability = s.stability;
    stabilityReason = s.reason;
    warnings.push(...s.warnings);
  } else {
    stability = parsed.stability;
    stabilityReason = `Given: class ${stability}`;
  }

  const { setup, calm, powerLaw } = setupFor(parsed, stability, parsed.windSpeedRef);
  if (calm) {
    warn(
      warnings,
      "calm-wind",
      `Wind at release height is ${fmt(powerLaw)} m/s, under 1 m/s: the model computes with 1 m/s, ` +
        "but a Gaussian plume does not describe calms. The cloud may pool and spread in any direction.",
    );
  }
  if ((stability === "E" || stability === "F") && parsed.windSpeedRef < LOW_WIND_M_S) {
    warn(
      warnings,
      "stable-low-wind",
      `Stable air (class ${stability}) with a light wind: bands are long and narrow and may meander ` +
        "off the mean wind direction. Widen the wind swing.",
    );
  }
  const mw = parsed.molecularWeight;
  if (parsed.heavyOrCold || (mw !== null && mw > AIR_MOLECULAR_WEIGHT)) {
    const why = parsed.heavyOrCold
      ? "the release is marked heavier than air, cold or pressurised"
      : `molecular weight ${fmt(mw ?? 0)} g/mol is above air's ${AIR_MOLECULAR_WEIGHT} g/mol`;
    warn(
      warnings,
      "dense-gas",
      `Possible dense gas: ${why}. A heavy cloud slumps and spreads near the ground, wider and ` +
        "sometimes upwind, which a Gaussian plume does not describe (Britter & McQuaid 1988).",
    );
  }

  if (setup.mixingHeight !== null && setup.effectiveHeight > setup.mixingHeight) {
    warn(
      warnings,
      "above-lid",
      `The plume (${fmt(setup.effectiveHeight)} m) is above the mixing height (${fmt(setup.mixingHeight)} m): ` +
        "the model gives no ground concentration, but the lid may not hold. Do not read this as safe.",
    );
  }

  const limits = parsed.limits.map((l) => ({
    label: l.label,
    value: (l.unit === "ppm" ? ppmToMgM3(l.value, mw as number) : l.value) / 1000,
    averaging: l.averaging,
  }));

  return { parsed, setup, stabilityReason, limits, warnings, plume: plumeCache(setup) };
}

/**
 * Every figure of the estimate for a scenario (see types.ts `Scenario`), without GeoJSON and
 * without the spread (spread.ts `addSpread` adds it; `estimate` in index.ts does so by default).
 * Throws `ScenarioError` listing every problem when the scenario is not valid.
 */
export function estimateLocal(scenario: Scenario | unknown): EstimateOutput {
  return solveLocal(scenario).out;
}

/** `estimateLocal`'s output with what it was solved from: the prepared scenario and the bands. */
export function solveLocal(scenario: Scenario | unknown): {
  out: EstimateOutput;
  prep: Prepared;
  solutions: BandSolution[];
} {
  const prep = prepare(scenario);
  const { parsed, setup, warnings } = prep;
  const zr = parsed.receptorHeight;

  const solutions: BandSolution[] = [];
  const bands: BandOutput[] = prep.limits.map((limit) => {
    const plume = prep.plume(limit.averaging);
    const sol = solveBand(plume, limit.value, zr, parsed.windSwingDeg);
    solutions.push(sol);
    bandWarnings(warnings, limit.label, limit.averaging, plume, sol, parsed);
    // Far end: the cloud's front and back there (½ peak); see timing.ts `cloudPassage`.
    const far = sol.reach !== null && !sol.overMaxRange ? cloudPassage(plume, sol.reach) : null;
    return {
      label: limit.label,
      limit_mg_m3: limit.value * 1000,
      averaging_s: limit.averaging,
      reach_m: sol.reach,
      start_m: sol.start,
      max_width_m: sol.sweptMaxWidth,
      max_width_at_m: sol.sweptMaxWidthAt,
      area_m2: sol.sweptArea,
      arrives_s: far?.arrives ?? null,
      clears_s: far?.clears ?? null,
    };
  });

  const mw = parsed.molecularWeight;
  const points: PointOutput[] = parsed.points.map((pt, i) => {
    pointWarnings(warnings, i, pt.x);
    const c = prep.plume(pt.averaging).concentration(pt.x, pt.y, pt.z) * 1000;
    return {
      x_m: pt.x,
      y_m: pt.y,
      z_m: pt.z,
      averaging_s: pt.averaging,
      concentration_mg_m3: c,
      concentration_ppm: mw === null ? null : mgM3ToPpm(c, mw),
      limits: prep.limits.map((limit) => {
        const p = passageAt(prep.plume(limit.averaging), limit.value, pt.x, pt.y, pt.z);
        return { label: limit.label, arrives_s: p.arrives, clears_s: p.clears };
      }),
    };
  });

  const heading = (((parsed.windFromDeg + 180) % 360) + 360) % 360;
  const localBands: LocalBand[] = solutions.map((s, i) => ({
    label: prep.limits[i]?.label ?? "",
    outline: s.outline,
    swept: s.swept,
  }));
  let longest = 0;
  for (const s of solutions) if (s.reach !== null && s.reach > longest) longest = s.reach;
  const footprint = {
    heading_deg: heading,
    wind_swing_deg: parsed.windSwingDeg,
    near_zone_m: parsed.nearZone,
    bands: localBands,
    centreline_m: Math.max(longest, parsed.nearZone),
  };

  const out: EstimateOutput = {
    model_version: MODEL_VERSION,
    caution: CAUTION,
    wind_speed_used_m_s: setup.windSpeed,
    release_height_used_m: setup.height,
    effective_height_m: setup.effectiveHeight,
    stability_used: setup.stability,
    stability_reason: prep.stabilityReason,
    bands,
    points,
    warnings,
    ...(parsed.limitSet ? { limit_set: { ...parsed.limitSet } } : {}),
    footprint,
  };
  return { out, prep, solutions };
}

/**
 * The centreline concentration C̄(x, 0, z_r) (mg/m³) at each distance in `xs` (m), one curve per
 * limit (each limit has its own averaging time), for the centreline chart.
 */
export function centrelineProfile(
  scenario: Scenario | unknown,
  xs: readonly number[],
): { label: string; averaging_s: number; limit_mg_m3: number; values_mg_m3: number[] }[] {
  const prep = prepare(scenario);
  const zr = prep.parsed.receptorHeight;
  return prep.limits.map((l) => {
    const p = prep.plume(l.averaging);
    return {
      label: l.label,
      averaging_s: l.averaging,
      limit_mg_m3: l.value * 1000,
      values_mg_m3: xs.map((x) => p.centreline(x, zr) * 1000),
    };
  });
}

function bandWarnings(
  warnings: Warning[],
  label: string,
  averaging: number,
  plume: Plume,
  sol: BandSolution,
  parsed: ParsedScenario,
): void {
  if (sol.reach === null) {
    warn(
      warnings,
      "no-exceedance",
      `${label}: the estimate stays below this limit at breathing height everywhere from 1 m to 100 km.`,
      label,
    );
  } else {
    if (sol.overMaxRange) {
      warn(
        warnings,
        "reach-over-100km",
        `${label}: the band reaches over 100 km, beyond anything this model can say. Treat as very large.`,
        label,
      );
    }
    if (sol.reach < CURVE_RANGE_M.min || sol.reach > CURVE_RANGE_M.max) {
      warn(
        warnings,
        "outside-curve-range",
        `${label}: reach ${fmt(sol.reach)} m is outside the 100 m – 10 km range the dispersion curves ` +
          "were fitted for; the figure is less certain.",
        label,
      );
    }
    if (sol.reach <= parsed.nearZone) {
      warn(
        warnings,
        "near-zone-only",
        `${label}: the band lies inside the near zone (${fmt(parsed.nearZone)} m), where the model does not hold.`,
        label,
      );
    }
  }
  if (plume.samplingClamped && parsed.release.kind === "continuous") {
    warn(
      warnings,
      "averaging-clamped",
      `${label}: the spread correction for the averaging time is held at ${fmt(plume.samplingTime)} s ` +
        `(allowed 180–3600 s; asked ${fmt(Math.min(averaging, parsed.release.duration ?? Number.POSITIVE_INFINITY))} s).`,
      label,
    );
  }
}

function pointWarnings(warnings: Warning[], i: number, x: number): void {
  const where = `Point ${i + 1} (${fmt(x)} m downwind)`;
  if (!(x > 0)) {
    warn(
      warnings,
      "upwind-point",
      `${where} is at or upwind of the source: the model describes nothing upwind and gives 0 there. ` +
        "Near a real source gas can spread upwind, above all a dense gas.",
      { point: i },
    );
  } else if (x < CURVE_RANGE_M.min || x > CURVE_RANGE_M.max) {
    warn(
      warnings,
      "outside-curve-range",
      `${where} is outside the 100 m – 10 km range the dispersion curves were fitted for; the ` +
        "concentration there is less certain.",
      { point: i },
    );
  }
}

export function warn(
  list: Warning[],
  code: WarningCode,
  message: string,
  about?: string | { point: number },
): void {
  const limit = typeof about === "string" ? about : undefined;
  const point = typeof about === "object" ? about.point : undefined;
  if (list.some((w) => w.code === code && w.limit === limit && w.point === point)) return;
  const w: Warning = { code, message };
  if (limit !== undefined) w.limit = limit;
  if (point !== undefined) w.point = point;
  list.push(w);
}

/** A number for a message: whole above 100, else three significant digits, no trailing zeros. */
export function fmt(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  return Math.abs(v) >= 100 ? v.toFixed(0) : String(Number(v.toPrecision(3)));
}
