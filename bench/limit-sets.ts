/**
 * Import speed of a limit sets file of 500 invented sets (tests/storage/limit-set-fixtures.ts,
 * about 1,250 limits): reading and checking the CSV, the JSON round trip, and the one-transaction
 * store write (fake-indexeddb in Node: indicative of the code's own cost, not of a browser's disk).
 */
import "fake-indexeddb/auto";
import { LimitSetStore } from "../src/storage/limit-set-store.ts";
import {
  readLimitSetsCsv,
  readLimitSetsJson,
  writeLimitSetsJson,
} from "../src/storage/limit-sets.ts";
import { inventedCsv, inventedSets } from "../tests/storage/limit-set-fixtures.ts";
import { type Stats, stats, time } from "./solve.ts";

export interface LimitSetBench {
  sets: number;
  limits: number;
  csv_bytes: number;
  read_csv: Stats;
  read_json: Stats;
  store_import: Stats;
}

export async function limitSetBench(runs: number): Promise<LimitSetBench> {
  const csv = inventedCsv(inventedSets(500), { bom: true });
  const sets = readLimitSetsCsv(csv);
  const json = writeLimitSetsJson(sets, new Date(0));
  const readCsv = stats(time(() => readLimitSetsCsv(csv), runs));
  const readJson = stats(time(() => readLimitSetsJson(json), runs));
  const store = await LimitSetStore.open("driftmark-bench-limit-sets");
  const samples: number[] = [];
  for (let i = 0; i < Math.max(3, Math.round(runs / 5)); i++) {
    await store.clear();
    const t0 = performance.now();
    await store.importSets(readLimitSetsCsv(csv), "keep-both");
    samples.push(performance.now() - t0);
  }
  return {
    sets: sets.length,
    limits: sets.reduce((n, s) => n + s.limits.length, 0),
    csv_bytes: new TextEncoder().encode(csv).length,
    read_csv: readCsv,
    read_json: readJson,
    store_import: stats(samples),
  };
}
