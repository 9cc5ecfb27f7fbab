/**
 * parseScenario: the scenario boundary.
 *
 * Rules come from issue 2 ("The command-line estimator": field names, units, which fields are
 * optional) and the ranges in the JSDoc table of src/core/scenario/fields.ts; defaults from model.md
 * ("Inputs" table) and issue 2 (points: averaging 600 s). The bad-input cases live in
 * tests/cli/bad-scenarios.ts and are shared with the command-line test.
 */
import { describe, expect, test } from "vitest";
import { formatProblem, ScenarioError } from "../../src/core/errors.ts";
import { parseIsoTime, parseScenario } from "../../src/core/scenario.ts";
import type { ScenarioProblem } from "../../src/core/types.ts";
import { BAD_CASES, baseScenario, breakScenario, type Draft } from "../cli/bad-scenarios.ts";

function problemsOf(raw: unknown): ScenarioProblem[] {
  try {
    parseScenario(raw);
  } catch (err) {
    expect(err).toBeInstanceOf(ScenarioError);
    return (err as ScenarioError).problems;
  }
  throw new Error("parseScenario accepted a scenario that should fail");
}

function shown(value: unknown): string {
  return value === undefined ? "nothing" : JSON.stringify(value).slice(0, 57);
}

function deepFreeze<T>(v: T): T {
  if (typeof v === "object" && v !== null) {
    for (const x of Object.values(v)) deepFreeze(x);
    Object.freeze(v);
  }
  return v;
}

describe("parseScenario rejects each broken rule with one problem naming field, value and what is allowed", () => {
  test.each(BAD_CASES.map((c) => [c.rule, c] as const))("%s", (_rule, c) => {
    const problems = problemsOf(breakScenario(c));
    expect(problems).toHaveLength(1);
    const p = problems[0] as ScenarioProblem;
    expect(p.field).toBe(c.field);
    expect(p.value).toStrictEqual(c.value);
    expect(p.message).toContain(c.allowed);
    const line = formatProblem(p);
    expect(line.startsWith(`${c.field}: `)).toBe(true);
    expect(line).toContain(`(got ${shown(c.value)}`);
  });
});

describe("parseScenario reports every problem at once", () => {
  test("three independent problems give three problems, in field order", () => {
    const s = baseScenario();
    s.release.rate_g_s = -1;
    s.weather.wind_from_deg = 400;
    s.limits[0].unit = "ppb";
    const fields = problemsOf(s).map((p) => p.field);
    expect(fields).toEqual(["release.rate_g_s", "weather.wind_from_deg", "limits[0].unit"]);
  });

  test("the error message lists one line per problem", () => {
    const s = baseScenario();
    delete s.release;
    delete s.weather;
    try {
      parseScenario(s);
      expect.unreachable("should throw");
    } catch (err) {
      const e = err as ScenarioError;
      expect(e.name).toBe("ScenarioError");
      expect(e.message.split("\n")).toEqual(e.problems.map(formatProblem));
      expect(e.problems.map((p) => p.field)).toEqual(["release", "weather"]);
    }
  });
});

describe("parseScenario accepts the edges of each range", () => {
  // biome-ignore format: one edge per line reads as a table
  const edges: [string, (s: Draft) => void][] = [
    ["a 1 s release", (s) => { s.release.duration_s = 1; }],
    ["a 30-day release (2 592 000 s)", (s) => { s.release.duration_s = 30 * 86400; }],
    ["a 3.2e7 s release", (s) => { s.release.duration_s = 3.2e7; }],
    ["a rate of 1e10 g/s", (s) => { s.release.rate_g_s = 1e10; }],
    ["zero wind (the model clamps calms)", (s) => { s.weather.wind_speed_m_s = 0; }],
    ["wind from 0 degrees", (s) => { s.weather.wind_from_deg = 0; }],
    ["wind from 360 degrees", (s) => { s.weather.wind_from_deg = 360; }],
    ["a 10 m lid", (s) => { s.weather.mixing_height_m = 10; }],
    ["a 10000 m lid", (s) => { s.weather.mixing_height_m = 10000; }],
    ["no limits", (s) => { s.limits = []; }],
    ["100 limits", (s) => { s.limits = Array.from({ length: 100 }, (_, i) => ({ label: `L${i}`, value: 1, unit: "ppm", averaging_s: 1 })); }],
    ["1000 points", (s) => { s.points = Array.from({ length: 1000 }, (_, i) => ({ x_m: i, y_m: -1e6, z_m: 1000, averaging_s: 86400 })); }],
    ["an 80-character label", (s) => { s.limits[0].label = "x".repeat(80); }],
    ["no molecular weight when every limit is in mg/m3", (s) => { delete s.molecular_weight_g_mol; s.limits[0].unit = "mg/m3"; }],
    ["an all-at-once release", (s) => { s.release = { kind: "instantaneous", mass_g: 1e11, height_m: 0 }; }],
    ["a hot release", (s) => { s.release.hot = { exit_speed_m_s: 300, diameter_m: 50, gas_temperature_k: 3000 }; }],
    ["a heavy or cold flag", (s) => { s.release.heavy_or_cold = true; }],
    ["a suggested class from a named sky", (s) => { s.weather.stability = "auto"; s.weather.sky = "night-clear"; }],
    ["a suggested class from the sun, time and place", (s) => { s.weather.stability = "auto"; s.weather.sky = "sun"; s.weather.time = "2026-06-21T14:30+02:00"; }],
    ["the poles and the antimeridian", (s) => { s.source = { lat: -90, lon: 180 }; }],
    ["keys beginning with _ anywhere (comments)", (s) => { s._note = "invented"; s.release._why = 1; s.limits[0]._src = "x"; s.points[0]._p = 0; }],
  ];
  test.each(edges)("%s", (_name, edit) => {
    const s = baseScenario();
    edit(s);
    expect(() => parseScenario(s)).not.toThrow();
  });
});

describe("parseScenario fills model.md's defaults", () => {
  test("a minimal scenario gets every default", () => {
    const p = parseScenario({
      release: { rate_g_s: 500 },
      weather: { wind_speed_m_s: 3, wind_from_deg: 250, stability: "D" },
      limits: [{ label: "Limit A (invented)", value: 40, unit: "mg/m3", averaging_s: 3600 }],
      points: [{ x_m: 1000, y_m: 0 }],
    });
    // model.md "Inputs": kind continuous, duration ongoing, height 0, z_ref 10 m, open terrain,
    // no lid, receptor 1.5 m, air 25 °C, wind swing 0, near zone 100 m; Briggs is the default scheme
    // (model.md "Dispersion coefficients"); points average over 600 s (issue 2).
    expect(p.release).toEqual({ kind: "continuous", rate: 500, duration: null });
    expect(p.height).toBe(0);
    expect(p.windRefHeight).toBe(10);
    expect(p.terrain).toBe("open");
    expect(p.mixingHeight).toBeNull();
    expect(p.receptorHeight).toBe(1.5);
    expect(p.airTemperature).toBe(298.15);
    expect(p.scheme).toBe("briggs");
    expect(p.windSwingDeg).toBe(0);
    expect(p.nearZone).toBe(100);
    expect(p.heavyOrCold).toBe(false);
    expect(p.hot).toBeNull();
    expect(p.sky).toBeNull();
    expect(p.timeMs).toBeNull();
    expect(p.source).toBeNull();
    expect(p.molecularWeight).toBeNull();
    expect(p.points).toEqual([{ x: 1000, y: 0, z: 1.5, averaging: 600 }]);
  });

  test("a point's height defaults to the receptor height given", () => {
    const s = baseScenario();
    s.receptor_height_m = 2;
    s.points = [
      { x_m: 500, y_m: 50 },
      { x_m: 500, y_m: 50, z_m: 0, averaging_s: 60 },
    ];
    expect(parseScenario(s).points).toEqual([
      { x: 500, y: 50, z: 2, averaging: 600 },
      { x: 500, y: 50, z: 0, averaging: 60 },
    ]);
  });

  test("given values are carried through in SI", () => {
    const s = baseScenario();
    s.release.hot = { exit_speed_m_s: 12, diameter_m: 0.5, gas_temperature_k: 600 };
    s.weather = {
      wind_speed_m_s: 4,
      wind_height_m: 2,
      wind_from_deg: 90,
      stability: "auto",
      sky: "sun",
      time: "2026-06-21T14:30:00+02:00",
      terrain: "urban",
      mixing_height_m: 800,
      air_temperature_k: 280,
    };
    s.sigma_scheme = "pasquill-gifford";
    s.wind_swing_deg = 10;
    s.near_zone_m = 250;
    const p = parseScenario(s);
    expect(p.release).toEqual({ kind: "continuous", rate: 500, duration: 900 });
    expect(p.height).toBe(2);
    expect(p.hot).toEqual({ exitSpeed: 12, diameter: 0.5, gasTemperature: 600 });
    expect([p.windSpeedRef, p.windRefHeight, p.windFromDeg]).toEqual([4, 2, 90]);
    expect([p.stability, p.sky, p.terrain, p.scheme]).toEqual([
      "auto",
      "sun",
      "urban",
      "pasquill-gifford",
    ]);
    expect([p.mixingHeight, p.airTemperature, p.windSwingDeg, p.nearZone]).toEqual([
      800, 280, 10, 250,
    ]);
    // 14:30 at UTC+2 is 12:30 UTC.
    expect(p.timeMs).toBe(Date.UTC(2026, 5, 21, 12, 30, 0));
    expect(p.molecularWeight).toBe(34.1);
    expect(p.limits).toEqual([
      { label: "Limit A (invented)", value: 3, unit: "ppm", averaging: 3600 },
      { label: "Limit B (invented)", value: 40, unit: "mg/m3", averaging: 600 },
    ]);
    expect(p.source).toEqual({ lat: 47, lon: 8 });
  });

  test("an all-at-once release carries its mass", () => {
    const s = baseScenario();
    s.release = { kind: "instantaneous", mass_g: 50000 };
    expect(parseScenario(s).release).toEqual({ kind: "instantaneous", mass: 50000 });
  });

  test("the input is not modified", () => {
    const s = deepFreeze(baseScenario());
    const before = JSON.stringify(s);
    parseScenario(s);
    expect(JSON.stringify(s)).toBe(before);
  });
});

describe("parseIsoTime reads ISO 8601 date-times that carry a zone", () => {
  // Expected instants computed independently with Date.UTC (ECMA-262 §21.4.3.4).
  test.each([
    ["2026-06-21T12:30:00Z", Date.UTC(2026, 5, 21, 12, 30)],
    ["2026-06-21T12:30Z", Date.UTC(2026, 5, 21, 12, 30)],
    ["2026-06-21T14:30:00+02:00", Date.UTC(2026, 5, 21, 12, 30)],
    ["2026-06-21T07:00:00-0530", Date.UTC(2026, 5, 21, 12, 30)],
    ["2026-06-21T13:30+01", Date.UTC(2026, 5, 21, 12, 30)],
    ["2024-02-29T00:00:00.250Z", Date.UTC(2024, 1, 29, 0, 0, 0, 250)],
    ["2026-01-01T00:30:00+01:00", Date.UTC(2025, 11, 31, 23, 30)],
  ])("%s", (text, expected) => {
    expect(parseIsoTime(text)).toBe(expected);
  });

  test.each([
    "2026-06-21T12:30:00",
    "2026-06-21",
    "2026-06-21 12:30Z",
    "2025-02-29T00:00Z",
    "2026-13-01T00:00Z",
    "2026-06-31T00:00Z",
    "2026-06-21T12:60Z",
    "2026-06-21T12:30:61Z",
    "2026-06-21T12:30+15:00",
    "21/06/2026 12:30",
    "",
  ])("rejects %j", (text) => {
    expect(parseIsoTime(text)).toBeNull();
  });
});

describe("parseScenario keeps the limit set used", () => {
  test("name and source note, or null when absent", () => {
    const s = baseScenario() as Record<string, unknown>;
    expect(parseScenario(s).limitSet).toBeNull();
    s.limit_set = { name: "Gas Q (invented)", source_note: "Invented list, rev. 2" };
    expect(parseScenario(s).limitSet).toEqual({
      name: "Gas Q (invented)",
      source_note: "Invented list, rev. 2",
    });
  });
});
