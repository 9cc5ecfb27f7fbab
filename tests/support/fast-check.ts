/**
 * fast-check settings for the whole unit suite, set here and nowhere else (vitest `setupFiles`
 * loads this module before every test file; tests import `runs` and `timeout` from it).
 *
 * - `npm test`: every property runs with the fixed seed `FC_SEED` (default {@link DEFAULT_SEED})
 *   and its stated number of runs, so a run gives the same verdict every time.
 * - `npm run fuzz` (`FC_FUZZ=1`): a fresh random seed for each property and `FC_SCALE` (default
 *   {@link FUZZ_SCALE}) times as many runs. fast-check's failure message carries the seed, the
 *   path and the shrunk counterexample; replay it with
 *   `FC_SEED=<seed> FC_SCALE=<scale> npx vitest run <file> -t "<test name>"`
 *   (add `FC_PATH=<path>` to go straight to the counterexample).
 *
 * Environment: FC_SEED (32-bit integer), FC_SCALE (number > 0), FC_FUZZ ("1"), FC_PATH.
 */
import fc from "fast-check";

/** The suite's fixed seed. */
export const DEFAULT_SEED = 20_261_203;
/** Run multiplier of `npm run fuzz` when FC_SCALE is not given. */
export const FUZZ_SCALE = 10;
/** Runs of a property that does not state its own. */
const DEFAULT_RUNS = 100;

function envNumber(name: string, ok: (v: number) => boolean, allowed: string): number | undefined {
  const raw = process.env[name];
  if (raw === undefined || raw === "") return undefined;
  const v = Number(raw);
  if (!ok(v)) throw new Error(`${name}=${raw}: must be ${allowed}`);
  return v;
}

/** True under `npm run fuzz`. */
export const FUZZ = process.env.FC_FUZZ === "1";
/** Multiplier on every property's number of runs. */
export const SCALE =
  envNumber("FC_SCALE", (v) => Number.isFinite(v) && v > 0, "a number above 0") ??
  (FUZZ ? FUZZ_SCALE : 1);
/** The seed every property uses; undefined under fuzz without FC_SEED (fresh per property). */
export const SEED: number | undefined =
  envNumber(
    "FC_SEED",
    (v) => Number.isInteger(v) && v >= -(2 ** 31) && v < 2 ** 32,
    "a 32-bit integer",
  ) ?? (FUZZ ? undefined : DEFAULT_SEED);
const PATH = process.env.FC_PATH || undefined;

/** fast-check parameters for a property of `n` runs in `npm test` (scaled under fuzz). */
export function runs(n: number): { numRuns: number } {
  return { numRuns: Math.max(1, Math.round(n * SCALE)) };
}

/** A test's timeout (ms): `ms` in `npm test`, scaled with the runs under fuzz. */
export function timeout(ms: number): number {
  return Math.round(ms * Math.max(1, SCALE));
}

fc.configureGlobal({
  ...runs(DEFAULT_RUNS),
  ...(SEED === undefined ? {} : { seed: SEED }),
  ...(PATH === undefined ? {} : { path: PATH }),
});
