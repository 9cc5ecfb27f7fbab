/**
 * Vertical term V(z) of the Gaussian plume with ground reflection (image source) and, with a
 * mixing lid L, multiple reflection between ground and lid; once σz ≥ 1.6·L the well-mixed form
 * V = √(2π)·σz/L (model.md, "Concentration"). Dimensionless.
 */

const SQRT_2PI = Math.sqrt(2 * Math.PI);

/** σz/L at and above which the well-mixed form is used. */
export const WELL_MIXED_RATIO = 1.6;

/**
 * V(z) for receptor height z (m), effective source height H (m), vertical spread σz (m) and lid
 * L (m, null for none). σz = 0 gives 0 unless z = H (a delta; treated as 0).
 */
export function verticalTerm(z: number, H: number, sigmaZ: number, lid: number | null): number {
  if (!(sigmaZ > 0)) return 0;
  const k = 1 / (2 * sigmaZ * sigmaZ);
  if (lid === null) {
    return Math.exp(-(z - H) * (z - H) * k) + Math.exp(-(z + H) * (z + H) * k);
  }
  if (H > lid) return 0;
  if (sigmaZ >= WELL_MIXED_RATIO * lid) return (SQRT_2PI * sigmaZ) / lid;
  let sum = Math.exp(-(z - H) * (z - H) * k) + Math.exp(-(z + H) * (z + H) * k);
  for (let n = 1; n < 1000; n++) {
    const s = 2 * n * lid;
    const t =
      Math.exp(-((z - H + s) ** 2) * k) +
      Math.exp(-((z + H + s) ** 2) * k) +
      Math.exp(-((z - H - s) ** 2) * k) +
      Math.exp(-((z + H - s) ** 2) * k);
    sum += t;
    if (t <= 1e-17 * sum && s > z + H + 8 * sigmaZ) break;
  }
  return sum;
}
