/**
 * ppm ↔ mg/m³ at the conventional 24.45 L/mol (25 °C, 1 atm; NIOSH/ACGIH convention),
 * src/core/units.ts, against conversions printed by published guideline documents.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { MOLAR_VOLUME_L, mgM3ToPpm, ppmToMgM3 } from "../../src/core/units.ts";
import { runs } from "../support/fast-check.ts";

describe("ppm ↔ mg/m³", () => {
  it("uses 24.45 L/mol (NIOSH Pocket Guide, Introduction: conversions at 25 °C and 1 atm)", () => {
    expect(MOLAR_VOLUME_L).toBe(24.45);
  });

  it("SO₂ (MW 64.06): 0.20 ppm = 0.52 mg/m³ (NRC 2010, AEGLs for Selected Airborne Chemicals, vol. 8, sulfur dioxide)", () => {
    const v = ppmToMgM3(0.2, 64.06);
    expect(Math.round(v * 100) / 100).toBe(0.52);
  });

  it("NH₃ (MW 17.03): 1 ppm = 0.70 mg/m³, so 25 ppm ≈ 18 mg/m³ (NIOSH Pocket Guide, ammonia)", () => {
    // NIOSH prints the rounded factor 0.70 mg/m³ per ppm and REL 25 ppm (18 mg/m³): 25·0.70 = 17.5.
    expect(Math.round(ppmToMgM3(1, 17.03) * 100) / 100).toBe(0.7);
    const v = ppmToMgM3(25, 17.03);
    // Exact: 25·17.03/24.45 = 17.41 mg/m³; NIOSH's 18 comes from the rounded factor.
    expect(Math.abs(v - 18) / 18).toBeLessThan(0.05);
  });

  it("is the exact inverse both ways", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-6, max: 1e6, noNaN: true }),
        fc.double({ min: 1, max: 1000, noNaN: true }),
        (v, mw) => {
          expect(mgM3ToPpm(ppmToMgM3(v, mw), mw) / v).toBeCloseTo(1, 12);
          expect(ppmToMgM3(mgM3ToPpm(v, mw), mw) / v).toBeCloseTo(1, 12);
        },
      ),
      runs(200),
    );
  });

  it("is identity at MW = 24.45 g/mol", () => {
    expect(ppmToMgM3(7, 24.45)).toBeCloseTo(7, 12);
  });
});
