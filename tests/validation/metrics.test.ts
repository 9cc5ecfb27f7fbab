/**
 * Performance measures as defined by Chang & Hanna (2004), Meteorol. Atmos. Phys. 87, 167–196,
 * section 3: checked on small cases worked by hand (closed form) and on the invariants the
 * paper states (a perfect model gives FAC2 = 1, MG = VG = 1, FB = NMSE = 0).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  computeMetrics,
  fac2,
  fractionalBias,
  geometricMeanBias,
  geometricVariance,
  normalisedMeanSquareError,
  type Pair,
} from "../../scripts/validation/metrics.ts";

const pairs = (obs: number[], pred: number[]): Pair[] =>
  obs.map((o, i) => ({ observed: o, predicted: pred[i] as number }));

const positive = fc.double({ min: 1e-3, max: 1e3, noNaN: true });
const sample = fc.array(positive, { minLength: 1, maxLength: 30 });

describe("perfect model (Chang & Hanna 2004: FAC2 1, MG 1, VG 1, FB 0, NMSE 0)", () => {
  it("gives the ideal value of every measure for any positive observations", () => {
    fc.assert(
      fc.property(sample, (obs) => {
        const m = computeMetrics(pairs(obs, obs));
        expect(m.count).toBe(obs.length);
        expect(m.fac2).toBe(1);
        expect(m.mg).toBeCloseTo(1, 12);
        expect(m.vg).toBeCloseTo(1, 12);
        expect(m.fb).toBeCloseTo(0, 12);
        expect(m.nmse).toBeCloseTo(0, 12);
      }),
    );
  });
});

describe("uniform over-prediction by a factor of two (closed form)", () => {
  // Cp = 2 Co: MG = exp(-ln 2) = 1/2; VG = exp((ln 2)^2); FB = (1 - 2)/(0.5 * 3) = -2/3;
  // FAC2 = 1 (the ratio 2 is inside the closed interval [0.5, 2]).
  it("gives MG 0.5, VG exp((ln 2)²), FB −2/3 and FAC2 1 for any observations", () => {
    fc.assert(
      fc.property(sample, (obs) => {
        const p = pairs(
          obs,
          obs.map((o) => 2 * o),
        );
        expect(geometricMeanBias(p)).toBeCloseTo(0.5, 12);
        expect(geometricVariance(p)).toBeCloseTo(Math.exp(Math.LN2 ** 2), 12);
        expect(fractionalBias(p)).toBeCloseTo(-2 / 3, 12);
        expect(fac2(p)).toBe(1);
      }),
    );
  });

  it("gives NMSE 1/2 when every observation is the same (⟨Co²⟩/(2⟨Co⟩²) = 1/2)", () => {
    const p = pairs([3, 3, 3], [6, 6, 6]);
    expect(normalisedMeanSquareError(p)).toBeCloseTo(0.5, 12);
  });

  it("mirrors for under-prediction by two: MG 2, FB +2/3, same VG", () => {
    const p = pairs([2, 4, 8], [1, 2, 4]);
    expect(geometricMeanBias(p)).toBeCloseTo(2, 12);
    expect(fractionalBias(p)).toBeCloseTo(2 / 3, 12);
    expect(geometricVariance(p)).toBeCloseTo(Math.exp(Math.LN2 ** 2), 12);
  });
});

describe("hand-worked mixed case", () => {
  // Co = [1, 2, 4], Cp = [2, 2, 1]
  // ratios Cp/Co = 2, 1, 0.25 -> FAC2 = 2/3
  // ln Co - ln Cp = -ln2, 0, 2 ln2 -> mean = ln2/3 -> MG = 2^(1/3)
  // squares: ln2², 0, 4 ln2² -> mean 5 ln2²/3 -> VG = exp(5 ln2²/3)
  // <Co> = 7/3, <Cp> = 5/3 -> FB = (2/3)/(0.5 * 4) = 1/3
  // <(Co-Cp)²> = (1 + 0 + 9)/3 = 10/3 -> NMSE = (10/3)/((7/3)(5/3)) = 30/35 = 6/7
  const p = pairs([1, 2, 4], [2, 2, 1]);
  it("FAC2 = 2/3", () => expect(fac2(p)).toBeCloseTo(2 / 3, 12));
  it("MG = 2^(1/3)", () => expect(geometricMeanBias(p)).toBeCloseTo(2 ** (1 / 3), 12));
  it("VG = exp(5 (ln 2)² / 3)", () =>
    expect(geometricVariance(p)).toBeCloseTo(Math.exp((5 * Math.LN2 ** 2) / 3), 12));
  it("FB = 1/3", () => expect(fractionalBias(p)).toBeCloseTo(1 / 3, 12));
  it("NMSE = 6/7", () => expect(normalisedMeanSquareError(p)).toBeCloseTo(6 / 7, 12));
});

describe("edges", () => {
  it("counts a ratio just outside two as outside", () => {
    expect(fac2(pairs([1, 1], [2.0000001, 0.4999999]))).toBe(0);
  });

  it("returns nulls, not NaN, for no pairs", () => {
    expect(computeMetrics([])).toEqual({
      count: 0,
      fac2: null,
      mg: null,
      vg: null,
      fb: null,
      nmse: null,
    });
  });

  it("refuses a zero or negative value, naming the pair and the value", () => {
    expect(() => computeMetrics(pairs([1, 0], [1, 1]))).toThrow(
      "pairs[1].observed: must be a finite number > 0 (got 0)",
    );
    expect(() => computeMetrics(pairs([1], [Number.NaN]))).toThrow(
      "pairs[0].predicted: must be a finite number > 0 (got NaN)",
    );
  });

  it("MG and VG are unchanged by scaling both series by the same factor (unit invariance)", () => {
    fc.assert(
      fc.property(sample, sample, positive, (obs, pred, k) => {
        const n = Math.min(obs.length, pred.length);
        const a = pairs(obs.slice(0, n), pred.slice(0, n));
        const b = a.map((q) => ({ observed: q.observed * k, predicted: q.predicted * k }));
        expect(geometricMeanBias(b)).toBeCloseTo(geometricMeanBias(a), 8);
        expect(geometricVariance(b) / geometricVariance(a)).toBeCloseTo(1, 8);
        expect(fractionalBias(b)).toBeCloseTo(fractionalBias(a), 8);
      }),
    );
  });

  it("VG ≥ MG-implied minimum exp((ln MG)²) (Jensen; Chang & Hanna 2004 VG–MG parabola)", () => {
    fc.assert(
      fc.property(sample, sample, (obs, pred) => {
        const n = Math.min(obs.length, pred.length);
        const p = pairs(obs.slice(0, n), pred.slice(0, n));
        const mg = geometricMeanBias(p);
        expect(geometricVariance(p)).toBeGreaterThanOrEqual(
          Math.exp(Math.log(mg) ** 2) * (1 - 1e-12),
        );
      }),
    );
  });
});
