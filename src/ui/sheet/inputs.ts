/**
 * The estimate sheet's text: every input of a scenario as label/value rows, and the places to
 * check with their figures. Pure (no DOM); display rounding only, no model math.
 */
import type { PointOutput, Scenario } from "../../core/types.ts";
import {
  compassPoint,
  formatConcentration,
  formatDistance,
  formatDuration,
  roundSig,
  type UnitSystem,
} from "../units.ts";

export interface SheetRow {
  label: string;
  value: string;
}

const n = (v: number) => String(roundSig(v, 4));

const SKY_WORDS: Record<string, string> = {
  "strong-sun": "strong sun",
  "moderate-sun": "moderate sun",
  "slight-sun": "slight sun",
  overcast: "overcast",
  "night-cloudy": "night with cloud",
  "night-clear": "clear night",
  sun: "sun (strength from the time and place)",
};

/** Every input of the scenario, in the order of the screen's sections. */
export function inputRows(s: Scenario, system: UnitSystem): SheetRow[] {
  const rows: SheetRow[] = [];
  const add = (label: string, value: string) => rows.push({ label, value });
  const dist = (m: number) => formatDistance(m, system);
  const r = s.release;
  if (r.kind === "continuous") {
    add("Release", "continuous");
    add("Release rate", `${n(r.rate_g_s / 1000)} kg/s`);
    add("Duration", r.duration_s === undefined ? "ongoing" : formatDuration(r.duration_s));
  } else {
    add("Release", "all at once");
    add("Mass released", `${n(r.mass_g / 1000)} kg`);
  }
  add("Release height", dist(r.height_m ?? 0));
  if (r.heavy_or_cold) add("Heavy or cold", "yes");
  if (r.hot) {
    add("Exit speed", `${n(r.hot.exit_speed_m_s)} m/s`);
    add("Vent diameter", `${n(r.hot.diameter_m)} m`);
    add("Gas temperature", `${n(r.hot.gas_temperature_k - 273.15)} °C`);
  }
  const w = s.weather;
  add("Wind speed", `${n(w.wind_speed_m_s)} m/s`);
  add("Measured at height", `${n(w.wind_height_m ?? 10)} m`);
  add("Wind from", `${n(w.wind_from_deg)}° (${compassPoint(w.wind_from_deg)})`);
  add("Stability class", w.stability === "auto" ? "suggested from wind and sky" : w.stability);
  if (w.sky) add("Sky", SKY_WORDS[w.sky] ?? w.sky);
  if (w.time) add("Weather time", w.time);
  add("Ground", (w.terrain ?? "open") === "open" ? "open country" : "built-up");
  add("Mixing height", w.mixing_height_m === undefined ? "none" : dist(w.mixing_height_m));
  if (w.air_temperature_k !== undefined) {
    add("Air temperature", `${n(w.air_temperature_k - 273.15)} °C`);
  }
  add(
    "Molecular weight",
    s.molecular_weight_g_mol === undefined ? "not given" : `${n(s.molecular_weight_g_mol)} g/mol`,
  );
  s.limits.forEach((l, i) => {
    const unit = l.unit === "mg/m3" ? "mg/m³" : "ppm";
    add(`Limit ${i + 1}`, `${l.label}: ${n(l.value)} ${unit}, ${n(l.averaging_s / 60)} min`);
  });
  if (s.limit_set) {
    add("Limit set", s.limit_set.name);
    add("Limit set source", s.limit_set.source_note || "none given");
  }
  add("Wind swing", `±${n(s.wind_swing_deg ?? 0)}°`);
  add("Near zone radius", dist(s.near_zone_m ?? 100));
  add("Breathing height", `${n(s.receptor_height_m ?? 1.5)} m`);
  add("Dispersion curves", s.sigma_scheme === "pasquill-gifford" ? "Pasquill–Gifford" : "Briggs");
  add(
    "Source location",
    s.source ? `${s.source.lat.toFixed(5)}, ${s.source.lon.toFixed(5)}` : "not given",
  );
  return rows;
}

/** One line per place to check: where it is and what the estimate gives there. */
export function placeRows(points: readonly PointOutput[], system: UnitSystem): SheetRow[] {
  return points.map((p, i) => {
    const across =
      p.y_m === 0
        ? ""
        : `, ${formatDistance(Math.abs(p.y_m), system)} ${p.y_m > 0 ? "left" : "right"}`;
    const over = p.limits
      .filter((l) => l.arrives_s !== null)
      .map(
        (l) =>
          `above ${l.label} from ${formatDuration(l.arrives_s ?? 0, "down")}${l.clears_s === null ? "" : ` to ${formatDuration(l.clears_s, "up")}`}`,
      );
    // A place's name, when the point carries one (places to check are named by the user).
    const name = (p as PointOutput & { name?: string }).name;
    return {
      label: `${name ? name : `Place ${i + 1}`}: ${formatDistance(p.x_m, system)} downwind${across}`,
      value: `${formatConcentration(p.concentration_mg_m3)}; ${over.length > 0 ? over.join("; ") : "below every limit"}`,
    };
  });
}
