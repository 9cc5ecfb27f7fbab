/**
 * Property: an invalid scenario is rejected with a ScenarioError whose problems name the field
 * that was broken, say what is allowed, and never show NaN (issue 5, "Robustness"; the ranges
 * are the JSDoc table of src/core/scenario/fields.ts). Anything at all (random JSON) either gives a
 * sound estimate or a ScenarioError: never another exception.
 */
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { estimate, ScenarioError } from "../../src/core/index.ts";
import { RANGES } from "../../src/core/scenario.ts";
import type { Scenario, ScenarioProblem } from "../../src/core/types.ts";
import { runs, timeout } from "../support/fast-check.ts";
import { expectSoundEstimate, numbersIn, validScenario } from "./arbitraries.ts";

function rejection(raw: unknown): ScenarioError {
  try {
    estimate(raw);
  } catch (err) {
    if (err instanceof ScenarioError) return err;
    throw new Error(`estimate threw ${String(err)} instead of a ScenarioError`);
  }
  throw new Error(`estimate accepted ${JSON.stringify(raw).slice(0, 300)}`);
}

function expectReadable(p: ScenarioProblem): void {
  // An unknown key "" is reported under the field "" (nothing better to name); any other
  // problem names a field.
  if (!p.message.startsWith("is not a known field")) expect(p.field.length).toBeGreaterThan(0);
  expect(p.message.length).toBeGreaterThan(0);
  expect(p.message, `message of ${p.field}`).not.toMatch(/NaN|undefined|\[object/);
}

/**
 * The error's message without the field names it quotes: a key the user wrote (such as "NaN")
 * comes back as a field's name, which is right; the rest must never show NaN.
 */
function withoutFieldNames(err: ScenarioError): string {
  let m = err.message;
  for (const p of err.problems) if (p.field) m = m.split(p.field).join("");
  return m;
}

test("regression (npm run fuzz, seed -657655808): a key named NaN is named, the message shows no NaN", () => {
  let err: unknown = null;
  try {
    estimate({ NaN: 1 } as unknown as Scenario);
  } catch (e) {
    err = e;
  }
  expect(err).toBeInstanceOf(ScenarioError);
  const problems = (err as ScenarioError).problems;
  expect(problems.map((p) => p.field)).toContain("NaN");
  expect(withoutFieldNames(err as ScenarioError)).not.toContain("NaN");
});

/** A numeric field of the contract, where it lives, and its range from scenario/fields.ts. */
interface NumericField {
  path: (s: Scenario) => string[] | null;
  range: { min: number; max: number; minOpen: boolean };
}

const cont = (s: Scenario) => s.release.kind === "continuous";
const FIELDS: Record<string, NumericField> = {
  "release.rate_g_s": {
    path: (s) => (cont(s) ? ["release", "rate_g_s"] : null),
    range: RANGES.rate_g_s,
  },
  "release.duration_s": {
    path: (s) => (cont(s) ? ["release", "duration_s"] : null),
    range: RANGES.duration_s,
  },
  "release.mass_g": { path: (s) => (cont(s) ? null : ["release", "mass_g"]), range: RANGES.mass_g },
  "release.height_m": { path: () => ["release", "height_m"], range: RANGES.height_m },
  "weather.wind_speed_m_s": {
    path: () => ["weather", "wind_speed_m_s"],
    range: RANGES.wind_speed_m_s,
  },
  "weather.wind_height_m": {
    path: () => ["weather", "wind_height_m"],
    range: RANGES.wind_height_m,
  },
  "weather.wind_from_deg": {
    path: () => ["weather", "wind_from_deg"],
    range: RANGES.wind_from_deg,
  },
  "weather.mixing_height_m": {
    path: () => ["weather", "mixing_height_m"],
    range: RANGES.mixing_height_m,
  },
  "weather.air_temperature_k": {
    path: () => ["weather", "air_temperature_k"],
    range: RANGES.air_temperature_k,
  },
  receptor_height_m: { path: () => ["receptor_height_m"], range: RANGES.receptor_height_m },
  molecular_weight_g_mol: {
    path: () => ["molecular_weight_g_mol"],
    range: RANGES.molecular_weight_g_mol,
  },
  "limits[0].value": { path: () => ["limits", "0", "value"], range: RANGES.limit_value },
  "limits[0].averaging_s": {
    path: () => ["limits", "0", "averaging_s"],
    range: RANGES.averaging_s,
  },
  wind_swing_deg: { path: () => ["wind_swing_deg"], range: RANGES.wind_swing_deg },
  near_zone_m: { path: () => ["near_zone_m"], range: RANGES.near_zone_m },
  "source.lat": { path: () => ["source", "lat"], range: RANGES.lat },
  "source.lon": { path: () => ["source", "lon"], range: RANGES.lon },
};

/** Values outside a range: below it, above it, not finite, or not a number at all. */
function badValue(range: NumericField["range"]): fc.Arbitrary<unknown> {
  const below = fc
    .double({ max: range.min, noNaN: true, noDefaultInfinity: true })
    .filter((v) => (range.minOpen ? v <= range.min : v < range.min)); // -0 is not below 0
  const above = fc.double({
    min: range.max,
    minExcluded: true,
    noNaN: true,
    noDefaultInfinity: true,
  });
  return fc.oneof(
    below,
    above,
    fc.constantFrom(Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY),
    fc.constantFrom("5", "", "NaN", null, true, false, [], {}, [1]),
  );
}

function setPath(root: Record<string, unknown>, path: string[], value: unknown): void {
  let o = root;
  for (const k of path.slice(0, -1)) {
    if (typeof o[k] !== "object" || o[k] === null) o[k] = k === "source" ? { lat: 0, lon: 0 } : {};
    o = o[k] as Record<string, unknown>;
  }
  o[path[path.length - 1] as string] = value;
}

describe("an invalid scenario is rejected naming the field, never with NaN", () => {
  test(
    "one numeric field out of range, non-finite or of the wrong type",
    () => {
      const names = Object.keys(FIELDS);
      const arb = fc
        .tuple(
          validScenario({ maxLimits: 3, swing: true, source: true, maxPoints: 1 }),
          fc.constantFrom(...names),
        )
        .chain(([s, name]) => {
          const f = FIELDS[name] as NumericField;
          return fc.tuple(fc.constant(s), fc.constant(name), badValue(f.range));
        });
      fc.assert(
        fc.property(arb, ([s, name, bad]) => {
          const f = FIELDS[name] as NumericField;
          const path = f.path(s);
          fc.pre(path !== null);
          const broken = structuredClone(s) as unknown as Record<string, unknown>;
          // null in an optional field means "leave it out" to no one: it is still reported.
          setPath(broken, path as string[], bad);
          const err = rejection(broken);
          expect(err.problems.length).toBeGreaterThan(0);
          for (const p of err.problems) expectReadable(p);
          expect(
            err.problems.map((p) => p.field),
            `${name} = ${String(bad)}`,
          ).toContain(name);
        }),
        runs(2_000),
      );
    },
    timeout(120_000),
  );

  test(
    "anything at all: a sound estimate or a ScenarioError, never another exception",
    () => {
      // Random JSON, and valid scenarios with one subtree replaced by random JSON.
      const json = fc.jsonValue({ maxDepth: 4 });
      const arb = fc.oneof(
        fc.anything({ maxDepth: 3 }),
        fc
          .tuple(
            validScenario({ maxLimits: 2, swing: true, source: true, maxPoints: 1 }),
            fc.constantFrom(
              "release",
              "weather",
              "limits",
              "source",
              "points",
              "release.kind",
              "weather.stability",
              "weather.sky",
              "weather.time",
              "limits.0",
              "limits.0.unit",
              "limits.0.label",
            ),
            json,
          )
          .map(([s, where, v]) => {
            const broken = structuredClone(s) as unknown as Record<string, unknown>;
            setPath(broken, where.split("."), v);
            return broken;
          }),
      );
      fc.assert(
        fc.property(arb, (raw) => {
          let out: ReturnType<typeof estimate> | null = null;
          try {
            out = estimate(raw);
          } catch (err) {
            expect(err, "only ScenarioError escapes").toBeInstanceOf(ScenarioError);
            for (const p of (err as ScenarioError).problems) expectReadable(p);
            expect(withoutFieldNames(err as ScenarioError)).not.toContain("NaN");
            return;
          }
          // Accepted (a replacement that happens to be valid): the result is sound.
          expectSoundEstimate(raw as Scenario, out);
          expect(numbersIn(out).every(([, v]) => Number.isFinite(v))).toBe(true);
        }),
        runs(2_000),
      );
    },
    timeout(120_000),
  );
});
