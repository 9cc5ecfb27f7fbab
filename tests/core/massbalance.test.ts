/**
 * The plume is a mass balance: for an ongoing release the flux C̄·u through any crosswind plane
 * (all y, z ≥ 0 up to the lid) is the emission rate Q (model.md; Turner 1970 ch. 3 states the
 * Gaussian form conserves mass with the ground as a reflector, from memory). Integrated here by
 * composite Simpson's rule, independently of the code.
 */
import { describe, expect, it } from "vitest";
import { makePlume } from "../../src/core/plume.ts";
import type { PlumeSetup, SigmaScheme, StabilityClass, Terrain } from "../../src/core/types.ts";

function simpsonWeights(n: number): Float64Array {
  const w = new Float64Array(n + 1);
  for (let i = 0; i <= n; i++) w[i] = i === 0 || i === n ? 1 : i % 2 ? 4 : 2;
  return w;
}

/** ∫∫ C̄·u dy dz over y ∈ [−10σy, 10σy], z ∈ [0, lid or H + 10σz] (g/s). */
function flux(s: PlumeSetup, x: number): number {
  const p = makePlume(s, 600);
  const sy = p.sigmaY(x);
  const sz = p.sigmaZ(x);
  const yMax = 10 * sy;
  const zMax = s.mixingHeight ?? s.effectiveHeight + 10 * sz;
  const ny = 400;
  const nz = 800;
  const wy = simpsonWeights(ny);
  const wz = simpsonWeights(nz);
  const hy = (2 * yMax) / ny;
  const hz = zMax / nz;
  let total = 0;
  for (let j = 0; j <= nz; j++) {
    const z = j * hz;
    let row = 0;
    for (let i = 0; i <= ny; i++) row += (wy[i] as number) * p.concentration(x, -yMax + i * hy, z);
    total += (wz[j] as number) * row;
  }
  return ((total * hy) / 3) * (hz / 3) * s.windSpeed;
}

const Q = 250;
function setup(
  c: StabilityClass,
  H: number,
  lid: number | null,
  scheme: SigmaScheme = "briggs",
  terrain: Terrain = "open",
): PlumeSetup {
  return {
    release: { kind: "continuous", rate: Q, duration: null },
    height: H,
    windSpeed: 4,
    stability: c,
    terrain,
    scheme,
    mixingHeight: lid,
    effectiveHeight: H,
  };
}

const CASES: [string, PlumeSetup][] = [
  ["ground source, D, no lid", setup("D", 0, null)],
  ["ground source, D, lid 300 m", setup("D", 0, 300)],
  ["elevated 50 m, D, no lid", setup("D", 50, null)],
  ["elevated 50 m, D, lid 200 m", setup("D", 50, 200)],
  ["elevated 120 m, B, lid 150 m (close under the lid)", setup("B", 120, 150)],
  ["ground source, F, lid 100 m", setup("F", 0, 100)],
  ["elevated 30 m, E, Pasquill–Gifford, lid 400 m", setup("E", 30, 400, "pasquill-gifford")],
  ["ground source, C, urban, no lid", setup("C", 0, null, "briggs", "urban")],
];

describe("mass balance: ∫∫ C̄·u dy dz = Q for an ongoing release", () => {
  for (const [name, s] of CASES) {
    it(`${name}, at 200 m, 1 km, 5 km, to 0.5%`, () => {
      for (const x of [200, 1000, 5000]) {
        const f = flux(s, x);
        expect(Math.abs(f / Q - 1)).toBeLessThan(0.005);
      }
    });
  }

  it("and beyond the well-mixed switch (σz ≥ 1.6 L): D, lid 100 m, at 20 km", () => {
    const f = flux(setup("D", 10, 100), 20_000);
    expect(Math.abs(f / Q - 1)).toBeLessThan(0.005);
  });
});
