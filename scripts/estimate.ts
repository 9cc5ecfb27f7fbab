/**
 * Command-line estimator: `npm run --silent estimate -- FILE.json`.
 *
 * Reads a Scenario JSON file (issue 2's contract, `Scenario` in src/core/types.ts), runs
 * `estimate` from the core and prints ONE JSON object (the EstimateOutput) to stdout.
 *
 * Exit status:
 * - 0: the estimate was printed on stdout.
 * - 2: the input could not be used: no file given, file missing/unreadable, too large, not JSON,
 *   nested too deep, a text too long, a forbidden key (`__proto__`, `constructor`, `prototype`)
 *   — one line naming the file and what is wrong — or an invalid scenario (one line per
 *   problem on stderr: `field: what is allowed (got VALUE)`). Any input file is the user's to
 *   fix; the file is read through src/storage/safe-json.ts.
 * - 1: an unexpected internal error (one line on stderr).
 * Nothing but the estimate ever goes to stdout, and no stack trace is ever printed.
 */

import { readFileSync, statSync } from "node:fs";
import type { ScenarioProblem } from "../src/core/types.ts";
import { describeSize, type JsonLimits, readJsonText } from "../src/storage/safe-json.ts";

const USAGE = "usage: npm run --silent estimate -- FILE.json   (FILE.json: a Driftmark scenario)";

function fail(status: number, lines: string[]): void {
  process.stderr.write(`${lines.join("\n")}\n`);
  process.exitCode = status;
}

/** One line from anything thrown. */
function oneLine(err: unknown): string {
  const text = err instanceof Error ? err.message : String(err);
  return text.split("\n")[0]?.trim() || "unknown error";
}

function readProblems(err: unknown): ScenarioProblem[] | null {
  if (typeof err !== "object" || err === null) return null;
  const e = err as { name?: unknown; problems?: unknown };
  if (e.name !== "ScenarioError" || !Array.isArray(e.problems)) return null;
  return e.problems as ScenarioProblem[];
}

/**
 * What a scenario file may be: a scenario is a few hundred bytes and three levels deep; labels
 * and notes are short.
 */
export const SCENARIO_FILE_LIMITS = {
  maxChars: 1024 * 1024,
  maxDepth: 8,
  maxStringLength: 10_000,
} satisfies Partial<JsonLimits>;

const READ_ERRORS: Record<string, string> = {
  ENOENT: "no such file",
  EACCES: "permission denied",
  EPERM: "permission denied",
  EISDIR: "is a directory, not a file",
  ENOTDIR: "a part of the path is not a folder",
  ENAMETOOLONG: "the file name is too long",
};

/** Path of the first value that is a number but not finite (the output must never hold NaN). */
function findNonFinite(v: unknown, path: string): string | null {
  if (typeof v === "number") return Number.isFinite(v) ? null : path;
  if (Array.isArray(v)) {
    for (let i = 0; i < v.length; i++) {
      const p = findNonFinite(v[i], `${path}[${i}]`);
      if (p) return p;
    }
    return null;
  }
  if (typeof v === "object" && v !== null) {
    for (const [k, x] of Object.entries(v)) {
      const p = findNonFinite(x, path ? `${path}.${k}` : k);
      if (p) return p;
    }
  }
  return null;
}

async function main(argv: string[]): Promise<void> {
  if (argv.length === 1 && (argv[0] === "-h" || argv[0] === "--help")) {
    process.stdout.write(`${USAGE}\n`);
    return;
  }
  const file = argv[0];
  if (argv.length !== 1 || file === undefined || file === "") {
    fail(2, [argv.length > 1 ? `${USAGE} — give exactly one file` : USAGE]);
    return;
  }

  let text: string;
  try {
    // Checked before reading, so a huge file is not read into memory (UTF-8 takes at most 3
    // bytes per UTF-16 unit; the character count is checked again after reading).
    const bytes = statSync(file).size;
    if (bytes > 3 * SCENARIO_FILE_LIMITS.maxChars) {
      fail(2, [
        `${file}: the file is too large (${describeSize(bytes)}; at most ${describeSize(SCENARIO_FILE_LIMITS.maxChars)})`,
      ]);
      return;
    }
    text = readFileSync(file, "utf8");
  } catch (err) {
    const code = (err as { code?: unknown }).code;
    const why = (typeof code === "string" && READ_ERRORS[code]) || oneLine(err);
    fail(2, [`${file}: cannot read the file: ${why}`]);
    return;
  }

  const read = readJsonText(text, SCENARIO_FILE_LIMITS);
  if (!read.ok) {
    fail(2, [`${file}: ${read.message}`]);
    return;
  }
  const raw = read.value;

  let core: typeof import("../src/core/index.ts");
  let formatProblem: typeof import("../src/core/errors.ts").formatProblem;
  try {
    core = await import("../src/core/index.ts");
    ({ formatProblem } = await import("../src/core/errors.ts"));
  } catch (err) {
    fail(1, [`internal error: cannot load the estimating core: ${oneLine(err)}`]);
    return;
  }

  let result: unknown;
  try {
    result = core.estimate(raw as Parameters<typeof core.estimate>[0]);
  } catch (err) {
    const problems = readProblems(err);
    if (problems) {
      fail(
        2,
        problems.length > 0 ? problems.map((p) => formatProblem(p)) : [`${file}: invalid scenario`],
      );
      return;
    }
    fail(1, [`internal error while estimating: ${oneLine(err)}`]);
    return;
  }

  const bad = findNonFinite(result, "");
  if (bad !== null) {
    fail(1, [`internal error: the estimate holds a non-finite number at ${bad || "(top level)"}`]);
    return;
  }
  process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
}

// A closed pipe (e.g. `| head`) is not an error worth a stack trace.
process.stdout.on("error", () => {
  process.exitCode ??= 1;
});

main(process.argv.slice(2)).catch((err: unknown) => {
  fail(1, [`internal error: ${oneLine(err)}`]);
});
