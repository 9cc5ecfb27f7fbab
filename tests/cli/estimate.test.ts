/**
 * The command-line estimator, run as a user runs it: `tsx scripts/estimate.ts FILE`.
 *
 * Contract (issue 2, "The command-line estimator"): one JSON object on stdout and nothing else;
 * a bad scenario or file exits with status 2 and one line per problem on stderr naming the
 * field, the value and what is allowed; never a stack trace.
 *
 * Golden output: tests/cli/demo.golden.json holds the estimate of examples/demo.json. Numbers
 * are compared to a relative 1e-9. Regenerate (after a deliberate model change, with a
 * MODEL_VERSION bump) with:
 *   UPDATE_GOLDEN=1 npx vitest run tests/cli/estimate.test.ts
 * The golden file is written only when UPDATE_GOLDEN=1 is set.
 */
import { execFile } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { CAUTION, MODEL_VERSION } from "../../src/core/caution.ts";
import { BAD_CASES, badScenarioJson } from "./bad-scenarios.ts";

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), "../..");
const TSX = join(ROOT, "node_modules/.bin/tsx");
const SCRIPT = "scripts/estimate.ts";
const DEMO = "examples/demo.json";
const GOLDEN = join(ROOT, "tests/cli/demo.golden.json");
const RELATIVE_TOLERANCE = 1e-9;
const TIMEOUT_MS = 60_000;

interface Run {
  status: number | null;
  stdout: string;
  stderr: string;
}

function run(args: string[]): Promise<Run> {
  return new Promise((done) => {
    execFile(TSX, [SCRIPT, ...args], { cwd: ROOT, timeout: TIMEOUT_MS }, (err, stdout, stderr) => {
      const status = err ? (typeof err.code === "number" ? err.code : null) : 0;
      done({ status, stdout, stderr });
    });
  });
}

/** A stack trace line ("    at fn (file:1:2)") or a thrown-error dump. */
const STACK_LINE = /^\s+at\s|node:internal|\.[cm]?[jt]s:\d+:\d+/m;

function expectCleanFailure(r: Run): string[] {
  expect(r.stdout).toBe("");
  expect(r.stderr).not.toMatch(STACK_LINE);
  expect(r.stderr.endsWith("\n")).toBe(true);
  return r.stderr.trimEnd().split("\n");
}

let dir = "";
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "driftmark-cli-"));
});
afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
});

function writeCase(name: string, text: string): string {
  const file = join(dir, `${name}.json`);
  writeFileSync(file, text);
  return file;
}

// ---------------------------------------------------------------------------
// Golden output on the invented demo scenario
// ---------------------------------------------------------------------------

/** Differences between `got` and `want`, numbers to a relative tolerance, as "path: …" lines. */
function diff(got: unknown, want: unknown, path: string, out: string[]): void {
  if (out.length >= 20) return;
  if (typeof want === "number" && typeof got === "number") {
    const scale = Math.max(Math.abs(want), Math.abs(got));
    if (!(got === want || Math.abs(got - want) <= RELATIVE_TOLERANCE * scale)) {
      out.push(`${path}: got ${got}, golden ${want}`);
    }
    return;
  }
  if (Array.isArray(want)) {
    if (!Array.isArray(got))
      out.push(`${path}: got ${JSON.stringify(got)?.slice(0, 60)}, golden an array`);
    else if (got.length !== want.length)
      out.push(`${path}: ${got.length} items, golden ${want.length}`);
    else
      want.forEach((w, i) => {
        diff(got[i], w, `${path}[${i}]`, out);
      });
    return;
  }
  if (typeof want === "object" && want !== null) {
    if (typeof got !== "object" || got === null || Array.isArray(got)) {
      out.push(`${path}: got ${JSON.stringify(got)?.slice(0, 60)}, golden an object`);
      return;
    }
    const g = got as Record<string, unknown>;
    const w = want as Record<string, unknown>;
    const keys = new Set([...Object.keys(g), ...Object.keys(w)]);
    for (const k of keys) {
      if (!(k in w)) out.push(`${path}.${k}: not in the golden output`);
      else if (!(k in g)) out.push(`${path}.${k}: missing`);
      else diff(g[k], w[k], `${path}.${k}`, out);
    }
    return;
  }
  if (got !== want) out.push(`${path}: got ${JSON.stringify(got)}, golden ${JSON.stringify(want)}`);
}

describe("estimate on the invented demo scenario", () => {
  test(
    "prints one JSON object that matches the golden output",
    async () => {
      const r = await run([DEMO]);
      expect(r.stderr).toBe("");
      expect(r.status).toBe(0);
      const out = JSON.parse(r.stdout) as Record<string, unknown>;
      expect(typeof out === "object" && out !== null && !Array.isArray(out)).toBe(true);
      // Exactly JSON.stringify(result, null, 2) plus a newline: nothing else on stdout.
      expect(r.stdout).toBe(`${JSON.stringify(out, null, 2)}\n`);
      expect(out.caution).toBe(CAUTION);
      expect(out.model_version).toBe(MODEL_VERSION);
      const demo = JSON.parse(readFileSync(join(ROOT, DEMO), "utf8"));
      const labels = (out.bands as { label: string }[]).map((b) => b.label);
      expect(labels).toEqual(demo.limits.map((l: { label: string }) => l.label));

      // The golden output is not taken on trust: two figures recomputed by hand.
      // ppm → mg/m³ at 24.45 L/mol (NIOSH Pocket Guide convention, 25 °C and 1 atm).
      const bands = out.bands as { limit_mg_m3: number }[];
      demo.limits.forEach((l: { value: number }, i: number) => {
        expect(bands[i]?.limit_mg_m3).toBeCloseTo((l.value * 34.1) / 24.45, 9);
      });
      // Point (1000 m, 0, 1.5 m), 600 s average, inside the 900 s plateau (Palazzi F ≈ 1): the
      // reflected Gaussian plume C = Q/(2π u σy σz)·[exp(−(z−H)²/2σz²) + exp(−(z+H)²/2σz²)]
      // (Turner 1970, eq. 3.1 with ground reflection) with Briggs open-country class D
      // σy = 0.08x(1+0.0001x)^-½, σz = 0.06x(1+0.0015x)^-½ (Hanna, Briggs & Hosker 1982);
      // the 800 m lid adds nothing at σz ≈ 38 m.
      const x = 1000;
      const sy = (0.08 * x) / Math.sqrt(1 + 0.0001 * x);
      const sz = (0.06 * x) / Math.sqrt(1 + 0.0015 * x);
      const v =
        Math.exp(-((1.5 - 2) ** 2) / (2 * sz * sz)) + Math.exp(-((1.5 + 2) ** 2) / (2 * sz * sz));
      const handMgM3 = (500 / (2 * Math.PI * 3 * sy * sz)) * v * 1000;
      const point = (out.points as { concentration_mg_m3: number }[])[0];
      expect(Math.abs((point?.concentration_mg_m3 ?? 0) / handMgM3 - 1)).toBeLessThan(1e-3);

      if (process.env.UPDATE_GOLDEN === "1") {
        mkdirSync(dirname(GOLDEN), { recursive: true });
        writeFileSync(GOLDEN, r.stdout);
        return;
      }
      if (!existsSync(GOLDEN)) {
        throw new Error(
          `golden file missing: ${GOLDEN}. Generate it from the real estimate with ` +
            "UPDATE_GOLDEN=1 npx vitest run tests/cli/estimate.test.ts, look at it, and commit it.",
        );
      }
      const golden = JSON.parse(readFileSync(GOLDEN, "utf8"));
      const differences: string[] = [];
      diff(out, golden, "(output)", differences);
      expect(differences, `differs from ${GOLDEN}`).toEqual([]);
    },
    TIMEOUT_MS,
  );
});

// ---------------------------------------------------------------------------
// Bad scenarios: one per rule (cases shared with tests/core/scenario.test.ts)
// ---------------------------------------------------------------------------

function shown(value: unknown): string {
  return value === undefined ? "nothing" : JSON.stringify(value).slice(0, 57);
}

describe.concurrent("a bad scenario exits 2 with one line naming the field, value and what is allowed", () => {
  const cases = BAD_CASES.filter((c) => c.cli);
  test.each(cases.map((c, i) => [c.rule, c, i] as const))(
    "%s",
    async (_rule, c, i) => {
      const file = writeCase(`bad-${i}`, badScenarioJson(c));
      const r = await run([file]);
      expect(r.status).toBe(2);
      const lines = expectCleanFailure(r);
      expect(lines).toHaveLength(1);
      const line = lines[0] as string;
      expect(line.startsWith(`${c.field}: `)).toBe(true);
      expect(line).toContain(c.allowed);
      expect(line).toContain(`(got ${shown(c.value)}`);
    },
    TIMEOUT_MS,
  );

  test(
    "several problems give one line each",
    async () => {
      const text = JSON.stringify({
        release: { kind: "continuous", rate_g_s: -1 },
        weather: { wind_speed_m_s: 3, wind_from_deg: 400, stability: "G" },
        limits: [],
      });
      const r = await run([writeCase("several", text)]);
      expect(r.status).toBe(2);
      const lines = expectCleanFailure(r);
      expect(lines.map((l) => l.slice(0, l.indexOf(":")))).toEqual([
        "release.rate_g_s",
        "weather.wind_from_deg",
        "weather.stability",
      ]);
    },
    TIMEOUT_MS,
  );
});

// ---------------------------------------------------------------------------
// Bad files and bad command lines
// ---------------------------------------------------------------------------

describe.concurrent("a file or command line that cannot be used exits 2 with one plain line", () => {
  test.each([
    ["a file that is not JSON", "not-json", '{ "release": { "kind": "continuous", '],
    ["an empty file", "empty", ""],
  ])(
    "%s",
    async (_name, caseName, text) => {
      const file = writeCase(caseName, text);
      const r = await run([file]);
      expect(r.status).toBe(2);
      const lines = expectCleanFailure(r);
      expect(lines).toHaveLength(1);
      expect(lines[0]).toContain(file);
      expect(lines[0]).toContain("not valid JSON");
    },
    TIMEOUT_MS,
  );

  // Bad files are the user's to fix: exit 2 with one line naming the file and what is wrong,
  // never an internal error (exit 1). Limits: SCENARIO_FILE_LIMITS in scripts/estimate.ts.
  const scenarioWith = (extra: string) =>
    `{"release": {"kind": "continuous", "rate_g_s": 5${extra}}, "weather": {"wind_speed_m_s": 3, "wind_from_deg": 270, "stability": "D"}, "limits": [{"label": "A", "value": 1, "unit": "mg/m3", "averaging_s": 600}]}`;
  test.each([
    [
      "100,000 nested arrays",
      "deep",
      `${"[".repeat(100_000)}${"]".repeat(100_000)}`,
      "the file is nested deeper than 8 levels (at line 1, column 9)",
    ],
    [
      "nesting just over the limit inside a scenario",
      "deep-9",
      scenarioWith(`, "note": [[[[[[[[1]]]]]]]]`),
      "the file is nested deeper than 8 levels",
    ],
    [
      'a "__proto__" key',
      "proto",
      scenarioWith(`, "__proto__": {"polluted": true}`),
      'the key "__proto__" is not allowed (in release)',
    ],
    [
      'a "constructor" key',
      "constructor",
      scenarioWith(`, "constructor": {"prototype": {}}`),
      'the key "constructor" is not allowed (in release)',
    ],
    [
      "a string of a megabyte",
      "long-string",
      scenarioWith(`, "note": "${"x".repeat(1_000_000)}"`),
      "the file holds a text of 1000000 characters at line 1, column 59; at most 10000",
    ],
    [
      "a string over 10,000 characters",
      "long-label",
      scenarioWith(`, "note": "${"x".repeat(10_001)}"`),
      "the file holds a text of 10001 characters at line 1, column 59; at most 10000",
    ],
    [
      "a file over 4 MB",
      "huge",
      `[${"0,".repeat(2 * 1024 * 1024)}0]`,
      "the file is too large (4.0 MB; at most 1.0 MB)",
    ],
  ])(
    "%s",
    async (_name, caseName, text, message) => {
      const file = writeCase(caseName, text);
      const r = await run([file]);
      expect(r.status).toBe(2);
      const lines = expectCleanFailure(r);
      expect(lines).toHaveLength(1);
      expect(lines[0]).toContain(`${file}: ${message}`);
    },
    TIMEOUT_MS,
  );

  test(
    "a number written as a string is named with its field",
    async () => {
      const text = scenarioWith("").replace('"rate_g_s": 5', '"rate_g_s": "500"');
      const r = await run([writeCase("number-as-string", text)]);
      expect(r.status).toBe(2);
      const lines = expectCleanFailure(r);
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(/^release\.rate_g_s: .*without quotes.*\(got "500"\)$/);
    },
    TIMEOUT_MS,
  );

  test(
    "a missing file",
    async () => {
      const file = join(dir, "no-such-scenario.json");
      const r = await run([file]);
      expect(r.status).toBe(2);
      const lines = expectCleanFailure(r);
      expect(lines).toEqual([`${file}: cannot read the file: no such file`]);
    },
    TIMEOUT_MS,
  );

  test(
    "a folder instead of a file",
    async () => {
      const r = await run([dir]);
      expect(r.status).toBe(2);
      const lines = expectCleanFailure(r);
      expect(lines).toEqual([`${dir}: cannot read the file: is a directory, not a file`]);
    },
    TIMEOUT_MS,
  );

  test(
    "no file given prints the usage line",
    async () => {
      const r = await run([]);
      expect(r.status).toBe(2);
      const lines = expectCleanFailure(r);
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(/^usage: npm run --silent estimate -- FILE\.json/);
    },
    TIMEOUT_MS,
  );

  test(
    "--help prints the usage line on stdout and succeeds",
    async () => {
      const r = await run(["--help"]);
      expect(r.status).toBe(0);
      expect(r.stderr).toBe("");
      expect(r.stdout).toMatch(/^usage: npm run --silent estimate -- FILE\.json.*\n$/);
    },
    TIMEOUT_MS,
  );

  test(
    "two files given prints the usage line",
    async () => {
      const r = await run([DEMO, DEMO]);
      expect(r.status).toBe(2);
      const lines = expectCleanFailure(r);
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(/^usage: .*exactly one file/);
    },
    TIMEOUT_MS,
  );
});
