// Test data for the storage tests: the invented demo scenario (examples/demo.json) and its estimate.
import demo from "../../examples/demo.json" with { type: "json" };
import { estimate } from "../../src/core/index.ts";
import type { Scenario } from "../../src/core/types.ts";
import { newEntry } from "../../src/storage/log.ts";
import type { LogEntry } from "../../src/storage/schema.ts";

export const demoScenario = demo as unknown as Scenario;
export const demoResult = estimate(demoScenario);

let dbCounter = 0;
/** A fresh database name per test (fake-indexeddb keeps them in memory). */
export function dbName(): string {
  dbCounter++;
  return `driftmark-test-${dbCounter}-${Math.random().toString(36).slice(2)}`;
}

/** An entry at a given UTC time (ms), with a note. */
export function entryAt(ms: number, note = "", id?: string): LogEntry {
  return newEntry({
    scenario: demoScenario,
    result: demoResult,
    place: { lat: 47, lon: 8, accuracy_m: 12 },
    note,
    now: new Date(ms),
    ...(id ? { id } : {}),
  });
}
