/**
 * `npm run validate` as a command: a bad folder exits 2 with one plain line (no stack trace);
 * a good one prints the table and writes the SVG and JSON it is asked for.
 */
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";

const repoRoot = path.resolve(import.meta.dirname, "../..");
const DATA_DIR = path.resolve(repoRoot, "../shared/data/prairie_grass");
const exists = existsSync(path.join(DATA_DIR, "PGARCS.txt"));
if (!exists)
  console.warn(`SKIPPED: ${DATA_DIR} not found; the validate command run did not happen`);

const run = (args: string[]) =>
  spawnSync(process.execPath, ["--import", "tsx", "scripts/validate.ts", ...args], {
    cwd: repoRoot,
    encoding: "utf8",
  });

describe("npm run validate", () => {
  it("exits 2 with one plain line for a missing folder", () => {
    const r = run([path.join(repoRoot, "no-such-folder")]);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split("\n")).toEqual([
      `Prairie Grass data: data folder not found: ${path.join(repoRoot, "no-such-folder")}`,
    ]);
    expect(r.stdout).toBe("");
  });

  it("exits 2 with one plain line when no folder is given", () => {
    const r = run([]);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split("\n")).toHaveLength(1);
    expect(r.stderr).toContain("no data folder given");
  });

  it.skipIf(!exists)(
    exists
      ? "prints the table and writes the SVG and JSON"
      : "SKIPPED: ../shared/data/prairie_grass not found",
    () => {
      const out = mkdtempSync(path.join(tmpdir(), "driftmark-validate-"));
      const svg = path.join(out, "scatter.svg");
      const json = path.join(out, "figures.json");
      const r = run([DATA_DIR, "--svg", svg, "--json", json]);
      expect(r.stderr).toBe("");
      expect(r.status).toBe(0);
      expect(r.stdout).toContain("Briggs open-country curves (default)");
      expect(r.stdout).toContain("Pasquill–Gifford curves");
      expect(readFileSync(svg, "utf8")).toMatch(/^<svg[\s\S]*<\/svg>\n$/);
      const figures = JSON.parse(readFileSync(json, "utf8"));
      expect(figures.arcs_compared).toBe(263);
      expect(figures.pairs).toHaveLength(263);
    },
  );
});
