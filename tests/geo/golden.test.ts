// Golden fixture: the invented demo scenario's footprint as a file a person can drop into any
// GeoJSON viewer (tests/fixtures/demo-footprint.geojson). Regenerate with UPDATE_GOLDEN=1.
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import demo from "../../examples/demo.json" with { type: "json" };
import { estimate } from "../../src/core/index.ts";
import type { Scenario } from "../../src/core/types.ts";
import { footprintFile } from "../../src/export/files.ts";
import { expectValidFootprintFile } from "./validate.ts";

const GOLDEN = fileURLToPath(new URL("../fixtures/demo-footprint.geojson", import.meta.url));
// An invented time stamp so that the file does not change from run to run.
const STAMP = "2024-05-01T14:00:00+02:00";

/** Compares two JSON values; numbers within `tol` (absolute for coordinates, relative otherwise). */
function close(a: unknown, b: unknown, path: string, diffs: string[]): void {
  if (diffs.length > 20) return;
  if (typeof a === "number" && typeof b === "number") {
    const coord = /coordinates/.test(path);
    const tol = coord ? 1e-6 : 1e-6 * Math.max(1, Math.abs(b));
    if (Math.abs(a - b) > tol) diffs.push(`${path}: ${a} vs golden ${b}`);
    return;
  }
  if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) {
      diffs.push(`${path}: length ${a.length} vs golden ${b.length}`);
      return;
    }
    for (let i = 0; i < a.length; i++) close(a[i], b[i], `${path}[${i}]`, diffs);
    return;
  }
  if (a && b && typeof a === "object" && typeof b === "object") {
    const ka = Object.keys(a).sort();
    const kb = Object.keys(b).sort();
    if (ka.join() !== kb.join()) diffs.push(`${path}: keys ${ka} vs golden ${kb}`);
    for (const k of ka) close((a as never)[k], (b as never)[k], `${path}.${k}`, diffs);
    return;
  }
  if (a !== b) diffs.push(`${path}: ${JSON.stringify(a)} vs golden ${JSON.stringify(b)}`);
}

describe("golden demo footprint", () => {
  const scenario = demo as unknown as Scenario;
  const out = footprintFile(scenario, estimate(scenario), STAMP);

  it("is a valid file", () => {
    expect(out).not.toBeNull();
    expectValidFootprintFile(JSON.parse((out as NonNullable<typeof out>).file.text));
  });

  it("matches tests/fixtures/demo-footprint.geojson (coordinates within 1e-6°)", () => {
    const text = (out as NonNullable<typeof out>).file.text;
    if (process.env.UPDATE_GOLDEN === "1") writeFileSync(GOLDEN, text);
    expect(existsSync(GOLDEN), "golden missing: run with UPDATE_GOLDEN=1").toBe(true);
    const diffs: string[] = [];
    close(JSON.parse(text), JSON.parse(readFileSync(GOLDEN, "utf8")), "$", diffs);
    expect(diffs).toEqual([]);
  });
});
