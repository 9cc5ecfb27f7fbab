import { describe, expect, it } from "vitest";
import { buildScenario, formFromScenario, initialForm } from "../../src/ui/form.ts";
import { setFromForm } from "../../src/ui/limitsets/fill.ts";

const ctx = { timeIso: "2026-12-03T12:00:00Z" };

function filledForm() {
  const f = initialForm();
  f.rate = "0.5";
  f.windSpeed = "3";
  f.windFrom = "250";
  f.molecularWeight = "17";
  f.limits = [
    { name: "Tier 1 (invented)", value: "2", unit: "ppm", averagingMin: "60" },
    { name: "Tier 2 (invented)", value: "30", unit: "mg/m3", averagingMin: "10" },
  ];
  return f;
}

describe("the limit set on the form", () => {
  it("is recorded in the scenario when the limits came from a set, and read back from one", () => {
    const f = filledForm();
    const plain = buildScenario(f, ctx);
    expect(plain.ok && plain.scenario.limit_set).toBeFalsy();
    f.limitSet = { name: "Gas Q (invented)", source_note: "Invented list" };
    const r = buildScenario(f, ctx);
    expect(r.ok).toBe(true);
    expect(r.scenario?.limit_set).toEqual({
      name: "Gas Q (invented)",
      source_note: "Invented list",
    });
    if (r.scenario) expect(formFromScenario(r.scenario).limitSet).toEqual(f.limitSet);
  });

  it("saving the Limits section as a set takes its limits and weight", () => {
    const r = setFromForm(filledForm(), " Gas Q (invented) ", "Invented list");
    expect(r).toEqual({
      ok: true,
      set: {
        name: "Gas Q (invented)",
        molecular_weight_g_mol: 17,
        source_note: "Invented list",
        limits: [
          { label: "Tier 1 (invented)", value: 2, unit: "ppm", averaging_min: 60 },
          { label: "Tier 2 (invented)", value: 30, unit: "mg/m3", averaging_min: 10 },
        ],
      },
    });
  });

  it("saving names what stops it", () => {
    expect(setFromForm(filledForm(), " ", "")).toMatchObject({ ok: false, message: /Set name/ });
    const noMw = filledForm();
    noMw.molecularWeight = "";
    expect(setFromForm(noMw, "G", "")).toMatchObject({ ok: false, message: /needed for ppm/ });
    const badAvg = filledForm();
    (badAvg.limits[1] as { averagingMin: string }).averagingMin = "2000";
    expect(setFromForm(badAvg, "G", "")).toMatchObject({
      ok: false,
      message: /Limit 2 averaging time/,
    });
  });
});
