/**
 * The invented demo scenario: examples/demo.json when the build has it, otherwise
 * an invented fallback below. Neither is a real incident or chemical.
 */
import type { Scenario } from "../core/types.ts";

// A glob, not a plain import, so the build still works if the example file is missing.
const files = import.meta.glob<{ default: Scenario }>("../../examples/demo.json", { eager: true });

/** Invented fallback: "Substance X" and its limits are made up for illustration. */
const FALLBACK: Scenario = {
  release: { kind: "continuous", rate_g_s: 400, duration_s: 1200, height_m: 1 },
  weather: {
    wind_speed_m_s: 3,
    wind_height_m: 10,
    wind_from_deg: 225,
    stability: "D",
    terrain: "open",
  },
  molecular_weight_g_mol: 40,
  limits: [
    { label: "Invented limit low 60 min", value: 5, unit: "ppm", averaging_s: 3600 },
    { label: "Invented limit high 10 min", value: 80, unit: "ppm", averaging_s: 600 },
  ],
  wind_swing_deg: 10,
};

export const DEMO_SCENARIO: Scenario = Object.values(files)[0]?.default ?? FALLBACK;
