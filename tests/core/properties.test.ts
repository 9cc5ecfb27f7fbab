/**
 * Invariants of `estimate` over random valid scenarios (fast-check), and the warnings model.md
 * ("Warnings the model must raise") requires, each raised where it says.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { estimate } from "../../src/core/index.ts";
import type { EstimateOutput, Scenario, ScenarioLimit } from "../../src/core/types.ts";
import { runs } from "../support/fast-check.ts";

const logUniform = (lo: number, hi: number) =>
  fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((e) => 10 ** e);

const releaseArb = fc.oneof(
  fc.record(
    {
      kind: fc.constant("continuous" as const),
      rate_g_s: logUniform(1e-3, 1e5),
      duration_s: logUniform(1, 1e5),
      height_m: fc.double({ min: 0, max: 150, noNaN: true }),
      hot: fc.record({
        exit_speed_m_s: fc.double({ min: 1, max: 30, noNaN: true }),
        diameter_m: fc.double({ min: 0.1, max: 5, noNaN: true }),
        gas_temperature_k: fc.double({ min: 320, max: 1200, noNaN: true }),
      }),
    },
    { requiredKeys: ["kind", "rate_g_s"] },
  ),
  fc.record(
    {
      kind: fc.constant("instantaneous" as const),
      mass_g: logUniform(1, 1e7),
      height_m: fc.double({ min: 0, max: 150, noNaN: true }),
    },
    { requiredKeys: ["kind", "mass_g"] },
  ),
);

const limitArb: fc.Arbitrary<ScenarioLimit> = fc.record({
  label: fc.constantFrom("L1", "L2", "L3"),
  value: logUniform(1e-3, 1e4),
  unit: fc.constantFrom("ppm" as const, "mg/m3" as const),
  averaging_s: fc.constantFrom(60, 600, 1800, 3600, 7200),
});

const scenarioArb: fc.Arbitrary<Scenario> = fc
  .record(
    {
      release: releaseArb,
      weather: fc.record(
        {
          wind_speed_m_s: fc.double({ min: 0, max: 20, noNaN: true }),
          wind_height_m: fc.double({ min: 2, max: 50, noNaN: true }),
          wind_from_deg: fc.double({ min: 0, max: 360, noNaN: true }),
          stability: fc.constantFrom(
            "A" as const,
            "B" as const,
            "C" as const,
            "D" as const,
            "E" as const,
            "F" as const,
          ),
          terrain: fc.constantFrom("open" as const, "urban" as const),
          mixing_height_m: fc.double({ min: 20, max: 3000, noNaN: true }),
        },
        { requiredKeys: ["wind_speed_m_s", "wind_from_deg", "stability"] },
      ),
      sigma_scheme: fc.constantFrom("briggs" as const, "pasquill-gifford" as const),
      receptor_height_m: fc.double({ min: 0, max: 5, noNaN: true }),
      molecular_weight_g_mol: fc.double({ min: 2, max: 300, noNaN: true }),
      limits: fc.uniqueArray(limitArb, { minLength: 1, maxLength: 3, selector: (l) => l.label }),
      wind_swing_deg: fc.double({ min: 0, max: 45, noNaN: true }),
      near_zone_m: fc.double({ min: 0, max: 500, noNaN: true }),
      points: fc.array(
        fc.record({
          x_m: fc.double({ min: -1000, max: 20_000, noNaN: true }),
          y_m: fc.double({ min: -500, max: 500, noNaN: true }),
          z_m: fc.double({ min: 0, max: 5, noNaN: true }),
          averaging_s: fc.constantFrom(60, 600, 3600),
        }),
        { maxLength: 3 },
      ),
    },
    { requiredKeys: ["release", "weather", "molecular_weight_g_mol", "limits"] },
  )
  .map((s) => s as Scenario);

/** Every number anywhere in the value is finite. */
function allFinite(v: unknown, path = "$"): string | null {
  if (typeof v === "number") return Number.isFinite(v) ? null : `${path} = ${v}`;
  if (Array.isArray(v)) {
    for (let i = 0; i < v.length; i++) {
      const bad = allFinite(v[i], `${path}[${i}]`);
      if (bad) return bad;
    }
    return null;
  }
  if (v && typeof v === "object") {
    for (const [k, x] of Object.entries(v)) {
      const bad = allFinite(x, `${path}.${k}`);
      if (bad) return bad;
    }
  }
  return null;
}

const reachOf = (o: EstimateOutput, i: number) => o.bands[i]?.reach_m ?? null;

describe("estimate over random valid scenarios", () => {
  it("never gives NaN or ±Infinity in any figure", () => {
    fc.assert(
      fc.property(scenarioArb, (s) => {
        expect(allFinite(estimate(s, { geojson: false, spread: false }))).toBeNull();
      }),
      runs(150),
    );
  });

  it("never gives NaN or ±Infinity in the GeoJSON either (with a source)", () => {
    fc.assert(
      fc.property(
        scenarioArb,
        fc.double({ min: -80, max: 80, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        (s, lat, lon) => {
          const o = estimate({ ...s, source: { lat, lon } }, { spread: false });
          expect(o.geojson?.type).toBe("FeatureCollection");
          expect(allFinite(o)).toBeNull();
        },
      ),
      runs(30),
    );
  });

  it("reach decreases (never grows) as the limit rises", () => {
    fc.assert(
      fc.property(
        scenarioArb,
        limitArb,
        fc.double({ min: 1.01, max: 100, noNaN: true }),
        (s, l, k) => {
          const o = estimate(
            { ...s, limits: [l, { ...l, label: "higher", value: l.value * k }] },
            { geojson: false, spread: false },
          );
          const lo = reachOf(o, 0);
          const hi = reachOf(o, 1);
          if (lo === null) expect(hi).toBeNull();
          else if (hi !== null) expect(hi).toBeLessThanOrEqual(lo * (1 + 1e-9));
        },
      ),
      runs(150),
    );
  });

  it("reach grows (never shrinks) with the rate or mass", () => {
    fc.assert(
      fc.property(scenarioArb, fc.double({ min: 1.01, max: 100, noNaN: true }), (s, k) => {
        const rel = s.release;
        const more =
          rel.kind === "continuous"
            ? { ...rel, rate_g_s: rel.rate_g_s * k }
            : { ...rel, mass_g: rel.mass_g * k };
        const a = estimate(s, { geojson: false, spread: false });
        const b = estimate({ ...s, release: more }, { geojson: false, spread: false });
        a.bands.forEach((band, i) => {
          const r1 = band.reach_m;
          const r2 = reachOf(b, i);
          if (r1 !== null) {
            expect(r2).not.toBeNull();
            expect(r2 as number).toBeGreaterThanOrEqual(r1 * (1 - 1e-9));
          }
        });
      }),
      runs(100),
    );
  });

  it("is symmetric in y: C̄(x, y) = C̄(x, −y), same arrival and clear times", () => {
    fc.assert(
      fc.property(
        scenarioArb,
        fc.double({ min: 1, max: 20_000, noNaN: true }),
        fc.double({ min: 0, max: 2000, noNaN: true }),
        (s, x, y) => {
          const o = estimate(
            {
              ...s,
              points: [
                { x_m: x, y_m: y },
                { x_m: x, y_m: -y },
              ],
            },
            { geojson: false, spread: false },
          );
          const [p, q] = o.points;
          expect(p?.concentration_mg_m3).toBe(q?.concentration_mg_m3);
          expect(p?.limits).toEqual(q?.limits);
          for (const band of o.footprint.bands) {
            // the outline mirrors: the set of (x, |y|) with y > 0 equals that with y < 0
            const up = band.outline
              .filter((v) => v[1] > 0)
              .map((v) => `${v[0]},${v[1]}`)
              .sort();
            const down = band.outline
              .filter((v) => v[1] < 0)
              .map((v) => `${v[0]},${-v[1]}`)
              .sort();
            expect(up).toEqual(down);
          }
        },
      ),
      runs(100),
    );
  });
});

describe("warnings raised where model.md says", () => {
  const base = (
    over: Partial<Scenario> = {},
    weather: Partial<Scenario["weather"]> = {},
  ): Scenario => ({
    release: { kind: "continuous", rate_g_s: 100, height_m: 2 },
    weather: { wind_speed_m_s: 4, wind_from_deg: 270, stability: "D", ...weather },
    limits: [{ label: "L", value: 10, unit: "mg/m3", averaging_s: 600 }],
    ...over,
  });
  const codes = (s: Scenario) =>
    estimate(s, { geojson: false, spread: false }).warnings.map((w) => w.code);

  it("none of the optional warnings for a plain neutral case", () => {
    const c = codes(base());
    for (const code of [
      "calm-wind",
      "dense-gas",
      "above-lid",
      "reach-over-100km",
      "averaging-clamped",
      "stable-low-wind",
    ])
      expect(c).not.toContain(code);
  });

  it("calm wind: below 1 m/s at release height (power law first)", () => {
    expect(codes(base({}, { wind_speed_m_s: 0.5 }))).toContain("calm-wind");
    expect(estimate(base({}, { wind_speed_m_s: 0.5 })).wind_speed_used_m_s).toBe(1);
    // 0.9 m/s at 10 m is 0.9·3^0.55 = 1.65 m/s at 30 m in class F: no calm.
    const high = base(
      { release: { kind: "continuous", rate_g_s: 100, height_m: 30 } },
      { wind_speed_m_s: 0.9, stability: "F" },
    );
    expect(codes(high)).not.toContain("calm-wind");
  });

  it("dense gas: molecular weight above 29 g/mol, or flagged (Britter & McQuaid 1988)", () => {
    const lim = [{ label: "L", value: 5, unit: "ppm" as const, averaging_s: 600 }];
    expect(codes(base({ molecular_weight_g_mol: 34.1, limits: lim }))).toContain("dense-gas");
    expect(codes(base({ molecular_weight_g_mol: 17.03, limits: lim }))).not.toContain("dense-gas");
    expect(codes(base({ molecular_weight_g_mol: 29, limits: lim }))).not.toContain("dense-gas");
    const flagged = base({ release: { kind: "continuous", rate_g_s: 100, heavy_or_cold: true } });
    expect(codes(flagged)).toContain("dense-gas");
  });

  it("release above the mixing lid: warns, and no ground band", () => {
    const s = base(
      { release: { kind: "continuous", rate_g_s: 100, height_m: 300 } },
      { mixing_height_m: 200 },
    );
    const o = estimate(s, { geojson: false, spread: false });
    expect(o.warnings.map((w) => w.code)).toContain("above-lid");
    expect(o.bands[0]?.reach_m).toBeNull();
  });

  it("reach over 100 km: reported as 100000 with a warning", () => {
    const s = base(
      {
        release: { kind: "continuous", rate_g_s: 1e5 },
        limits: [{ label: "L", value: 1e-3, unit: "mg/m3", averaging_s: 600 }],
      },
      { stability: "F", wind_speed_m_s: 2 },
    );
    const o = estimate(s, { geojson: false, spread: false });
    expect(o.bands[0]?.reach_m).toBe(100_000);
    expect(o.warnings.map((w) => w.code)).toContain("reach-over-100km");
  });

  it("outside the 100 m – 10 km range of the curves, below and above", () => {
    const short = base({ release: { kind: "continuous", rate_g_s: 1 } });
    expect(
      estimate(short, { geojson: false, spread: false }).bands[0]?.reach_m as number,
    ).toBeLessThan(100);
    expect(codes(short)).toContain("outside-curve-range");
    const long = base({ limits: [{ label: "L", value: 0.01, unit: "mg/m3", averaging_s: 600 }] });
    expect(
      estimate(long, { geojson: false, spread: false }).bands[0]?.reach_m as number,
    ).toBeGreaterThan(10_000);
    expect(codes(long)).toContain("outside-curve-range");
    expect(codes(base())).not.toContain("outside-curve-range"); // reach in range
    expect(
      estimate(base(), { geojson: false, spread: false }).bands[0]?.reach_m as number,
    ).toBeGreaterThan(100);
  });

  it("averaging clamps: t_s outside 180–3600 s", () => {
    const lim = (a: number) => [{ label: "L", value: 10, unit: "mg/m3" as const, averaging_s: a }];
    expect(codes(base({ limits: lim(60) }))).toContain("averaging-clamped");
    expect(codes(base({ limits: lim(7200) }))).toContain("averaging-clamped");
    expect(codes(base({ limits: lim(600) }))).not.toContain("averaging-clamped");
    expect(codes(base({ limits: lim(3600) }))).not.toContain("averaging-clamped");
    const shortRelease = base({
      release: { kind: "continuous", rate_g_s: 100, duration_s: 60 },
      limits: lim(3600),
    });
    expect(codes(shortRelease)).toContain("averaging-clamped");
  });

  it("stable low wind: class E or F with a light wind", () => {
    expect(codes(base({}, { stability: "F", wind_speed_m_s: 1.5 }))).toContain("stable-low-wind");
    expect(codes(base({}, { stability: "E", wind_speed_m_s: 1.5 }))).toContain("stable-low-wind");
    expect(codes(base({}, { stability: "F", wind_speed_m_s: 4 }))).not.toContain("stable-low-wind");
    expect(codes(base({}, { stability: "D", wind_speed_m_s: 1.5 }))).not.toContain(
      "stable-low-wind",
    );
  });

  it("every warning has a stable code and a plain-language message", () => {
    const o = estimate(base({}, { wind_speed_m_s: 0.5, stability: "F" }), {
      geojson: false,
      spread: false,
    });
    expect(o.warnings.length).toBeGreaterThan(1);
    for (const w of o.warnings) {
      expect(w.code).toMatch(/^[a-z0-9-]+$/);
      expect(w.message.length).toBeGreaterThan(20);
      expect(w.message).not.toMatch(/NaN|undefined|Infinity/);
    }
  });
});
