/**
 * Model performance measures for paired observed / predicted concentrations, as defined in
 * Chang, J. C. & Hanna, S. R. (2004), "Air quality model performance evaluation",
 * *Meteorology and Atmospheric Physics* 87, 167–196 (section 3). Angle brackets are means over
 * the n pairs; Co observed, Cp predicted (any one concentration unit, the same for both):
 *
 * - FAC2 = fraction of pairs with 0.5 ≤ Cp/Co ≤ 2
 * - MG   = exp(⟨ln Co⟩ − ⟨ln Cp⟩)            geometric mean bias; MG < 1 means over-prediction
 * - VG   = exp(⟨(ln Co − ln Cp)²⟩)           geometric variance; 1 for a perfect model
 * - FB   = (⟨Co⟩ − ⟨Cp⟩) / (0.5 (⟨Co⟩ + ⟨Cp⟩))  fractional bias; FB < 0 means over-prediction
 * - NMSE = ⟨(Co − Cp)²⟩ / (⟨Co⟩ ⟨Cp⟩)        normalised mean square error
 *
 * A perfect model gives FAC2 = 1, MG = 1, VG = 1, FB = 0, NMSE = 0. A model that predicts
 * twice every observation gives FAC2 = 1, MG = 0.5, VG = exp((ln 2)²) ≈ 1.62, FB = −2/3.
 *
 * The logarithmic measures need strictly positive values: a pair with a zero, negative or
 * non-finite value is refused with a RangeError naming the pair (the caller decides what to
 * exclude before scoring, and says so).
 */

export interface Pair {
  /** Observed concentration (> 0). */
  observed: number;
  /** Predicted concentration (> 0), same unit as `observed`. */
  predicted: number;
}

export interface Metrics {
  count: number;
  /** The five measures; null when there are no pairs (never NaN). */
  fac2: number | null;
  mg: number | null;
  vg: number | null;
  fb: number | null;
  nmse: number | null;
}

const mean = (xs: number[]): number => xs.reduce((s, x) => s + x, 0) / xs.length;

function checkPairs(pairs: readonly Pair[]): void {
  pairs.forEach((p, i) => {
    for (const key of ["observed", "predicted"] as const) {
      const v = p[key];
      if (!(Number.isFinite(v) && v > 0)) {
        throw new RangeError(`pairs[${i}].${key}: must be a finite number > 0 (got ${v})`);
      }
    }
  });
}

/** Fraction of pairs with 0.5 ≤ Cp/Co ≤ 2 (Chang & Hanna 2004). */
export function fac2(pairs: readonly Pair[]): number {
  checkPairs(pairs);
  const inside = pairs.filter((p) => {
    const r = p.predicted / p.observed;
    return r >= 0.5 && r <= 2;
  }).length;
  return inside / pairs.length;
}

/** Geometric mean bias MG = exp(⟨ln Co⟩ − ⟨ln Cp⟩) (Chang & Hanna 2004). */
export function geometricMeanBias(pairs: readonly Pair[]): number {
  checkPairs(pairs);
  return Math.exp(mean(pairs.map((p) => Math.log(p.observed) - Math.log(p.predicted))));
}

/** Geometric variance VG = exp(⟨(ln Co − ln Cp)²⟩) (Chang & Hanna 2004). */
export function geometricVariance(pairs: readonly Pair[]): number {
  checkPairs(pairs);
  return Math.exp(mean(pairs.map((p) => (Math.log(p.observed) - Math.log(p.predicted)) ** 2)));
}

/** Fractional bias FB = (⟨Co⟩ − ⟨Cp⟩)/(0.5(⟨Co⟩ + ⟨Cp⟩)) (Chang & Hanna 2004). */
export function fractionalBias(pairs: readonly Pair[]): number {
  checkPairs(pairs);
  const co = mean(pairs.map((p) => p.observed));
  const cp = mean(pairs.map((p) => p.predicted));
  return (co - cp) / (0.5 * (co + cp));
}

/** Normalised mean square error NMSE = ⟨(Co − Cp)²⟩/(⟨Co⟩⟨Cp⟩) (Chang & Hanna 2004). */
export function normalisedMeanSquareError(pairs: readonly Pair[]): number {
  checkPairs(pairs);
  const co = mean(pairs.map((p) => p.observed));
  const cp = mean(pairs.map((p) => p.predicted));
  return mean(pairs.map((p) => (p.observed - p.predicted) ** 2)) / (co * cp);
}

/** All five measures at once; the measures are null when `pairs` is empty. */
export function computeMetrics(pairs: readonly Pair[]): Metrics {
  if (pairs.length === 0) {
    return { count: 0, fac2: null, mg: null, vg: null, fb: null, nmse: null };
  }
  return {
    count: pairs.length,
    fac2: fac2(pairs),
    mg: geometricMeanBias(pairs),
    vg: geometricVariance(pairs),
    fb: fractionalBias(pairs),
    nmse: normalisedMeanSquareError(pairs),
  };
}
