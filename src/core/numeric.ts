/**
 * Small numerical helpers. Each says how it treats NaN, ±Infinity and zero.
 * Pure functions; no allocation in the hot paths beyond what the caller asks for.
 */

const TWO_OVER_SQRT_PI = 1.1283791670955126;

/**
 * Error function erf(x), absolute error below about 1e-15.
 * |x| < 3: the everywhere-positive series erf(x) = 2/√π · e^(−x²) · Σ 2ⁿ x^(2n+1) / (1·3·…·(2n+1))
 * (Abramowitz & Stegun 1964, eq. 7.1.6); |x| ≥ 3: 1 − erfc(x) with erfc from its continued fraction
 * (A&S 7.1.14), evaluated by the modified Lentz method.
 * erf(±Infinity) = ±1; erf(NaN) = NaN.
 */
export function erf(x: number): number {
  if (Number.isNaN(x)) return Number.NaN;
  const ax = Math.abs(x);
  if (ax >= 6) return x > 0 ? 1 : -1;
  if (ax < 3) {
    const x2 = x * x;
    let term = ax;
    let sum = ax;
    for (let n = 1; n < 200; n++) {
      term *= (2 * x2) / (2 * n + 1);
      sum += term;
      if (term < 1e-17 * sum) break;
    }
    const r = TWO_OVER_SQRT_PI * Math.exp(-x2) * sum;
    return x < 0 ? -r : r;
  }
  const r = 1 - erfcLarge(ax);
  return x < 0 ? -r : r;
}

/** erfc(x) for x ≥ 3 by the continued fraction erfc(x) = e^(−x²)/√π · 1/(x + ½/(x + 1/(x + 3/2/(x + …)))). */
function erfcLarge(x: number): number {
  // Lentz's method on b0 + a1/(b1 + a2/(b2 + ...)) with b = x, a_n = n/2.
  const tiny = 1e-300;
  let f = x;
  let c = x;
  let d = 0;
  for (let n = 1; n < 300; n++) {
    const a = n / 2;
    d = x + a * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = x + a / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(-x * x) / (Math.sqrt(Math.PI) * f);
}

/** Clamp v to [lo, hi]. NaN stays NaN. */
export function clamp(v: number, lo: number, hi: number): number {
  return Math.min(hi, Math.max(lo, v));
}

/**
 * Brent's method (Brent 1973, *Algorithms for Minimization without Derivatives*, ch. 4):
 * a root of f in [a, b] where f(a) and f(b) have opposite signs (or one is zero).
 * Returns the root to within `tol` (absolute, in the units of x). Throws if the bracket is not valid
 * (that is a programming error in the caller, never user input).
 */
export function brent(f: (x: number) => number, a: number, b: number, tol: number): number {
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0 || Number.isNaN(fa) || Number.isNaN(fb)) {
    throw new Error(`brent: root not bracketed in [${a}, ${b}]`);
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < 200; iter++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      const min1 = 3 * xm * q - Math.abs(tol1 * q);
      const min2 = Math.abs(e * q);
      if (2 * p < Math.min(min1, min2)) {
        e = d;
        d = p / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : xm > 0 ? tol1 : -tol1;
    fb = f(b);
  }
  return b;
}

/**
 * Golden-section search for a maximum of f on [a, b] (f assumed unimodal there).
 * Returns [x, f(x)]. `tol` is absolute in x.
 */
export function goldenMax(
  f: (x: number) => number,
  a: number,
  b: number,
  tol: number,
): [number, number] {
  const g = 0.6180339887498949;
  let x1 = b - g * (b - a);
  let x2 = a + g * (b - a);
  let f1 = f(x1);
  let f2 = f(x2);
  for (let i = 0; i < 200 && b - a > tol; i++) {
    if (f1 < f2) {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + g * (b - a);
      f2 = f(x2);
    } else {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - g * (b - a);
      f1 = f(x1);
    }
  }
  return f1 > f2 ? [x1, f1] : [x2, f2];
}

/** Signed area of a closed ring (shoelace); positive when counter-clockwise. Empty ring → 0. */
export function ringArea(ring: readonly (readonly [number, number])[]): number {
  let s = 0;
  const n = ring.length;
  for (let i = 0; i < n; i++) {
    const p = ring[i] as readonly [number, number];
    const q = ring[(i + 1) % n] as readonly [number, number];
    s += p[0] * q[1] - q[0] * p[1];
  }
  return s / 2;
}
