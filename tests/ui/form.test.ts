/**
 * From form state to a core Scenario and back (src/ui/form.ts), and the mapping of the core's
 * problems to inputs. Conversions follow NIST SP 811 (2008) App. B (lb = 0.45359237 kg,
 * ft = 0.3048 m, knot = 1852/3600 m/s); compass points are 22.5° apart (common practice).
 */
import { describe, expect, it } from "vitest";
import demo from "../../examples/demo.json" with { type: "json" };
import { ScenarioError } from "../../src/core/errors.ts";
import { estimate } from "../../src/core/index.ts";
import type { Scenario } from "../../src/core/types.ts";
import { evaluate } from "../../src/ui/evaluate.ts";
import {
  applyTemplate,
  buildScenario,
  emptyLimit,
  type FormState,
  fieldForPath,
  formFromScenario,
  groupProblems,
  initialForm,
  LIMIT_TEMPLATES,
  problemsFromCore,
} from "../../src/ui/form.ts";

const ctx = { timeIso: "2026-06-21T12:00:00Z" };

function filled(): FormState {
  return {
    ...initialForm(),
    rate: "120",
    rateUnit: "lb/min",
    height: "10",
    heightUnit: "ft",
    windSpeed: "8",
    windSpeedUnit: "knots",
    windFrom: "SW",
    stability: "D",
    molecularWeight: "40",
    limits: [
      { name: "Tier low", value: "5", unit: "ppm", averagingMin: "60" },
      { name: "Tier high", value: "40", unit: "mg/m3", averagingMin: "10" },
    ],
  };
}

describe("buildScenario", () => {
  it("converts the typed values to the core's SI scenario", () => {
    const r = buildScenario(filled(), ctx);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const s = r.scenario;
    expect(s.release.kind).toBe("continuous");
    if (s.release.kind !== "continuous") return;
    expect(s.release.rate_g_s).toBeCloseTo((120 * 453.59237) / 60, 9);
    expect(s.release.duration_s).toBeUndefined(); // ongoing
    expect(s.release.height_m).toBeCloseTo(3.048, 12);
    expect(s.weather.wind_speed_m_s).toBeCloseTo((8 * 1852) / 3600, 12);
    expect(s.weather.wind_from_deg).toBe(225);
    expect(s.weather.stability).toBe("D");
    expect(s.weather.time).toBeUndefined(); // only sent when the class is suggested
    expect(s.limits).toEqual([
      { label: "Tier low", value: 5, unit: "ppm", averaging_s: 3600 },
      { label: "Tier high", value: 40, unit: "mg/m3", averaging_s: 600 },
    ]);
    expect(s.molecular_weight_g_mol).toBe(40);
    expect(s.source).toBeUndefined();
    // The core accepts it.
    expect(() => estimate(s)).not.toThrow();
  });

  it("sends 'auto' with the sky and the screen's clock when the class is suggested", () => {
    const r = buildScenario(
      { ...filled(), stability: "auto", sky: "sun", lat: "47", lon: "8" },
      ctx,
    );
    expect(r.ok && r.scenario.weather).toMatchObject({
      stability: "auto",
      sky: "sun",
      time: ctx.timeIso,
    });
    expect(r.ok && r.scenario.source).toEqual({ lat: 47, lon: 8 });
  });

  it("builds an all-at-once release with its mass, and a finite duration", () => {
    const a = buildScenario(
      { ...filled(), kind: "instantaneous", mass: "10", massUnit: "lb" },
      ctx,
    );
    expect(a.ok && a.scenario.release).toMatchObject({ kind: "instantaneous" });
    if (a.ok && a.scenario.release.kind === "instantaneous") {
      expect(a.scenario.release.mass_g).toBeCloseTo(4535.9237, 9);
    }
    const b = buildScenario({ ...filled(), duration: "15", durationUnit: "min" }, ctx);
    expect(b.ok && b.scenario.release.kind === "continuous" && b.scenario.release.duration_s).toBe(
      900,
    );
  });

  it("names the field and the value when something typed is not a number", () => {
    const r = buildScenario({ ...filled(), rate: "abc" }, ctx);
    expect(r.ok).toBe(false);
    expect(r.problems).toContainEqual({
      field: "rate",
      message: "Release rate: 'abc' is not a number",
    });
  });

  it("asks for required values, the molecular weight with ppm, and both coordinates", () => {
    const r = buildScenario(
      { ...filled(), windSpeed: "", molecularWeight: "", lat: "47", windFrom: "west-ish" },
      ctx,
    );
    const byField = groupProblems(r.problems);
    expect(byField["wind-speed"]?.[0]).toMatch(/^Wind speed: enter a value/);
    expect(byField["molecular-weight"]?.[0]).toMatch(/^Molecular weight: needed/);
    expect(byField.lon?.[0]).toMatch(/^Longitude: enter both/);
    expect(byField["wind-from"]?.[0]).toMatch(
      /^Wind from: 'west-ish' is not degrees or a compass point/,
    );
  });

  it("refuses two limits with the same name (bands are told apart by name)", () => {
    const f = filled();
    const first = f.limits[0] ?? emptyLimit();
    f.limits = [first, { ...first }];
    const r = buildScenario(f, ctx);
    expect(r.problems.map((p) => p.field)).toContain("limit-1-name");
  });

  it("names unnamed limits by their place", () => {
    const f = filled();
    f.limits = [{ ...emptyLimit(), value: "3" }];
    const r = buildScenario(f, ctx);
    expect(r.ok && r.scenario.limits[0]?.label).toBe("Limit 1");
  });
});

describe("the core's problems land on the right input, named by its label", () => {
  it("maps dotted paths to input ids", () => {
    expect(fieldForPath("release.rate_g_s")).toBe("rate");
    expect(fieldForPath("release.hot.gas_temperature_k")).toBe("gas-temp");
    expect(fieldForPath("weather.wind_from_deg")).toBe("wind-from");
    expect(fieldForPath("limits[2].averaging_s")).toBe("limit-2-avg");
    expect(fieldForPath("limits[0].value")).toBe("limit-0-value");
    expect(fieldForPath("source.lon")).toBe("lon");
    expect(fieldForPath("points[0].x_m")).toBe("");
  });

  it("turns a real ScenarioError for a negative rate into a message naming 'Release rate'", () => {
    const r = buildScenario({ ...filled(), rate: "-5" }, ctx);
    expect(r.ok).toBe(true); // the sign is the core's to judge
    if (!r.ok) return;
    let problems: ReturnType<typeof problemsFromCore> = [];
    try {
      estimate(r.scenario);
    } catch (e) {
      expect(e).toBeInstanceOf(ScenarioError);
      problems = problemsFromCore((e as ScenarioError).problems);
    }
    expect(problems[0]?.field).toBe("rate");
    expect(problems[0]?.message).toMatch(/^Release rate: /);
  });

  it("keeps the last valid result, marked stale, while the inputs are invalid", () => {
    const good = evaluate(filled(), ctx, estimate, null);
    expect(good.stale).toBe(false);
    expect(good.last?.output.bands).toHaveLength(2);
    const bad = evaluate({ ...filled(), rate: "-5" }, ctx, estimate, good.last);
    expect(bad.stale).toBe(true);
    expect(bad.last).toBe(good.last);
    expect(bad.problems[0]?.message).toMatch(/^Release rate/);
    const none = evaluate({ ...filled(), rate: "" }, ctx, estimate, null);
    expect(none).toMatchObject({ last: null, stale: false });
  });
});

describe("limit templates", () => {
  it("offer AEGL-1/2/3 at 10, 30 and 60 min, ERPG-1/2/3 at 60 min and IDLH at 30 min", () => {
    const names = LIMIT_TEMPLATES.map((t) => `${t.name}|${t.averagingMin}`);
    for (const tier of ["AEGL-1", "AEGL-2", "AEGL-3"]) {
      for (const m of [10, 30, 60]) expect(names).toContain(`${tier} ${m} min|${m}`);
    }
    for (const tier of ["ERPG-1", "ERPG-2", "ERPG-3"]) expect(names).toContain(`${tier}|60`);
    expect(names).toContain("IDLH worker escape value|30");
  });

  it("fill the name and averaging time but never a value", () => {
    for (const t of LIMIT_TEMPLATES) {
      const out = applyTemplate({ ...emptyLimit(), value: "" }, t.id);
      expect(out.value).toBe("");
      expect(out.name).toBe(t.name);
      const kept = applyTemplate({ ...emptyLimit(), value: "12" }, t.id);
      expect(kept.value).toBe("12");
    }
  });
});

describe("formFromScenario", () => {
  it("round-trips the demo scenario through the form", () => {
    const s = demo as unknown as Scenario;
    const r = buildScenario(formFromScenario(s), ctx);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.scenario.release).toEqual(s.release);
    expect(r.scenario.limits).toEqual(s.limits);
    expect(r.scenario.source).toEqual(s.source);
    expect(r.scenario.weather).toMatchObject({
      wind_speed_m_s: s.weather.wind_speed_m_s,
      wind_from_deg: s.weather.wind_from_deg,
      stability: s.weather.stability,
      mixing_height_m: s.weather.mixing_height_m,
    });
    expect(r.scenario.wind_swing_deg).toBe(s.wind_swing_deg);
    // Same figures as the original (points aside, which the screen does not ask for).
    const a = estimate({ ...s, points: [] }).bands.map((b) => b.reach_m);
    const b = estimate(r.scenario).bands.map((x) => x.reach_m);
    expect(b).toEqual(a);
  });
});

describe("model settings", () => {
  it("keep a logged scenario's near zone, breathing height and dispersion curves on reopening", () => {
    const s: Scenario = {
      ...(demo as unknown as Scenario),
      near_zone_m: 250,
      receptor_height_m: 2.5,
      sigma_scheme: "pasquill-gifford",
    };
    const r = buildScenario(formFromScenario(s), ctx);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.scenario.near_zone_m).toBe(250);
    expect(r.scenario.receptor_height_m).toBe(2.5);
    expect(r.scenario.sigma_scheme).toBe("pasquill-gifford");
    const a = estimate({ ...s, points: [] }).bands.map((b) => b.reach_m);
    expect(estimate(r.scenario).bands.map((b) => b.reach_m)).toEqual(a);
  });

  it("a breathing height the core refuses is marked on its input by label", () => {
    const f = { ...filled(), receptorHeight: "250" };
    const ev = evaluate(f, ctx, estimate, null);
    const p = ev.problems.find((x) => x.field === "receptor-height");
    expect(p?.message).toMatch(/^Breathing height/);
  });
});

describe("every problem at once", () => {
  it("marks a negative rate even while another field cannot be read yet", () => {
    const ev = evaluate({ ...filled(), rate: "-5", windFrom: "xyz" }, ctx, estimate, null);
    const fields = ev.problems.map((p) => p.field);
    expect(fields).toContain("wind-from");
    expect(fields).toContain("rate");
    expect(ev.problems.find((p) => p.field === "rate")?.message).toMatch(/^Release rate: /);
    // A field the form already flagged gets no second, stand-in-based message from the core.
    const two = evaluate({ ...filled(), rate: "abc" }, ctx, estimate, null);
    expect(two.problems.filter((p) => p.field === "rate")).toHaveLength(1);
  });
});

describe("hot release", () => {
  it("sends exit speed, diameter and temperatures in SI (0 °C = 273.15 K)", () => {
    const r = buildScenario(
      {
        ...filled(),
        hotOn: true,
        exitSpeed: "12",
        diameter: "2",
        diameterUnit: "ft",
        gasTemp: "400",
        airTemp: "10",
      },
      ctx,
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.scenario.release.hot?.exit_speed_m_s).toBe(12);
    expect(r.scenario.release.hot?.diameter_m).toBeCloseTo(0.6096, 12);
    expect(r.scenario.release.hot?.gas_temperature_k).toBeCloseTo(673.15, 9);
    expect(r.scenario.weather.air_temperature_k).toBeCloseTo(283.15, 9);
    expect(() => estimate(r.scenario)).not.toThrow();
  });
});

describe("suggested stability class", () => {
  it("shown beside the picker is the class the core uses with 'auto'", async () => {
    const { suggestionFor } = await import("../../src/ui/suggestion.ts");
    for (const sky of ["night-clear", "night-cloudy", "strong-sun", "overcast"] as const) {
      for (const windSpeed of ["1.5", "2.5", "4", "7"]) {
        const form = {
          ...filled(),
          stability: "auto" as const,
          sky,
          windSpeed,
          windSpeedUnit: "m/s" as const,
        };
        const s = suggestionFor(form, ctx.timeIso);
        const built = buildScenario(form, ctx);
        expect(built.ok).toBe(true);
        if (!built.ok || !s) throw new Error("no suggestion");
        const out = estimate(built.scenario);
        expect(s.stability).toBe(out.stability_used);
        expect(s.reason).toBe(out.stability_reason);
      }
    }
    // Pasquill (1961), as tabulated in Boubel, Fox, Turner & Stern (1994), Table 19-3, p. 302:
    // night with ≤ 3/8 cloud: 2–3 m/s → F, 3–5 m/s → E; heavy overcast → D.
    const at = (sky: "night-clear" | "overcast", windSpeed: string) =>
      suggestionFor(
        { ...filled(), stability: "auto", sky, windSpeed, windSpeedUnit: "m/s" },
        ctx.timeIso,
      )?.stability;
    expect(at("night-clear", "2.5")).toBe("F");
    expect(at("night-clear", "4")).toBe("E");
    expect(at("overcast", "4")).toBe("D");
    // Overriding keeps the suggestion visible: it does not depend on the chosen letter.
    expect(
      suggestionFor(
        { ...filled(), stability: "A", sky: "night-clear", windSpeed: "2" },
        ctx.timeIso,
      )?.stability,
    ).toBe(
      suggestionFor(
        { ...filled(), stability: "auto", sky: "night-clear", windSpeed: "2" },
        ctx.timeIso,
      )?.stability,
    );
  });
});
