/**
 * `npm run bench`: prints figures and writes bench/results.json and the table in
 * bench/README.md. Never a pass/fail on time.
 *
 * Options: --quick (fewer runs), --no-browser, --build (run `npm run build` first; it is also
 * run when dist/ is missing).
 */
import { execSync } from "node:child_process";
import { existsSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { cpus, loadavg } from "node:os";
import { join } from "node:path";
import { type BrowserResults, browserBench, chromiumVersion } from "./browser.ts";
import { bundleReport, DIST, FIRST_SCREEN_JS_GZIP_BUDGET, REPO } from "./bundle.ts";
import { limitSetBench } from "./limit-sets.ts";
import { type MapResults, mapBench } from "./map.ts";
import { compare, compareCases, solveTimings } from "./solve.ts";
import { spreadBench } from "./spread.ts";

const args = new Set(process.argv.slice(2));
const quick = args.has("--quick");

function machine() {
  const info = readFileSync("/proc/cpuinfo", "utf8");
  const model = /model name\s*:\s*(.+)/.exec(info)?.[1]?.trim() ?? cpus()[0]?.model ?? "unknown";
  const nproc = execSync("nproc", { encoding: "utf8" }).trim();
  let commit = "unknown";
  try {
    commit = execSync("git rev-parse --short HEAD", { cwd: REPO, encoding: "utf8" }).trim();
  } catch {}
  return {
    nproc: Number(nproc),
    cpu_model: model,
    node: process.version,
    chromium: chromiumVersion(),
    commit,
    note: `load average ${(loadavg()[0] ?? 0).toFixed(2)} on ${nproc} cores at the start; figures are indicative, compare runs on one machine only`,
  };
}

const ms = (v: number) => (v >= 100 ? v.toFixed(0) : v >= 10 ? v.toFixed(1) : v.toFixed(2));
const kB = (n: number) => (n / 1000).toFixed(1);
const sci = (v: number) => (v === 0 ? "0" : v.toExponential(1));

async function main() {
  const m = machine();
  console.log(
    `machine: ${m.nproc} × ${m.cpu_model}, node ${m.node}, ${m.chromium}, commit ${m.commit}`,
  );

  // --- footprint solve -------------------------------------------------------------------
  const runs = quick ? 20 : 100;
  console.log(`\nfootprint solve: estimate(scenario, { geojson: false }), ${runs} runs each (ms)`);
  const solve = solveTimings(runs);
  console.log("limits release       lid  swing terrain   median    p95 | with GeoJSON median");
  for (const r of solve) {
    const c = r.case;
    console.log(
      `${String(c.limits).padStart(6)} ${c.release.padEnd(12)} ${(c.lid ? "300" : "-").padEnd(4)} ${String(c.swing).padStart(5)} ${c.terrain.padEnd(7)} ${ms(r.estimate.median_ms).padStart(8)} ${ms(r.estimate.p95_ms).padStart(6)} | ${ms(r.estimate_with_geojson.median_ms)}`,
    );
  }
  const all = solve.map((r) => r.estimate.p95_ms);
  console.log(`worst p95 ${ms(Math.max(...all))} ms`);

  // --- spread and the analytic floor -----------------------------------------------------------
  const spread = spreadBench(runs);
  console.log(`\nspread (3 limits, ongoing, open, swing 20°; ${runs} runs, ms)`);
  for (const [label, v] of [
    ["plain solve (spread: false)", spread.plain_swing20],
    ["with the spread (9 weathers + envelopes)", spread.spread_swing20],
    ["plain 3-limit solve, no swing", spread.plain_3_limits],
    ["bare analytic floor (scan + root + 129-station profile)", spread.floor_3_limits],
  ] as const) {
    console.log(`  ${label.padEnd(54)} median ${ms(v.median_ms).padStart(7)}  p95 ${ms(v.p95_ms)}`);
  }
  console.log(`  plain / floor (medians): ${spread.plain_over_floor.toFixed(2)}×`);

  // --- analytic against brute force ----------------------------------------------------------
  console.log("\nanalytic band vs brute force (400×400 grid + marching squares, d3-contour)");
  const cmp = compareCases().map((c) => compare(c, 400, quick ? 5 : 20));
  console.log(
    "case                              analytic ms  brute ms  ratio | reach err: analytic  brute | area err: analytic  outline  brute",
  );
  for (const r of cmp) {
    console.log(
      `${r.name.padEnd(34)} ${ms(r.analytic.time.median_ms).padStart(10)} ${ms(r.brute_force.time.median_ms).padStart(9)} ${r.speed_ratio.toFixed(0).padStart(6)} | ${sci(r.analytic.reach_rel_error).padStart(18)} ${sci(r.brute_force.reach_rel_error).padStart(6)} | ${sci(r.analytic.area_rel_error).padStart(17)} ${sci(r.analytic.outline_polygon_area_rel_error).padStart(8)} ${sci(r.brute_force.area_rel_error).padStart(6)}`,
    );
  }

  // --- limit sets import ---------------------------------------------------------------------
  const sets = await limitSetBench(quick ? 10 : 30);
  console.log(
    `\nlimit sets file: ${sets.sets} invented sets, ${sets.limits} limits, ${kB(sets.csv_bytes)} kB CSV (ms)`,
  );
  for (const [label, v] of [
    ["read + check CSV", sets.read_csv],
    ["read + check JSON", sets.read_json],
    ["CSV read + store in one transaction (fake-indexeddb)", sets.store_import],
  ] as const) {
    console.log(`  ${label.padEnd(54)} median ${ms(v.median_ms).padStart(7)}  p95 ${ms(v.p95_ms)}`);
  }

  // --- bundle ------------------------------------------------------------------------------
  let built = "existing dist/";
  if (args.has("--build") || !existsSync(join(DIST, "index.html"))) {
    console.log("\nbuilding (npm run build) …");
    execSync("npm run build", { cwd: REPO, stdio: "inherit" });
    built = "built by this run";
  }
  const bundle = bundleReport(DIST);
  const builtAt = statSync(join(DIST, "index.html")).mtime.toISOString();
  console.log(`\nbundle (${built}, ${builtAt}); gzip = node:zlib default level`);
  for (const f of bundle.files) {
    const tag =
      bundle.firstScreen.js.some((x) => x.file === f.file) ||
      bundle.firstScreen.css.some((x) => x.file === f.file)
        ? " (first screen)"
        : "";
    console.log(
      `  ${f.file.padEnd(40)} ${kB(f.raw).padStart(7)} kB raw ${kB(f.gzip).padStart(6)} kB gzip${tag}`,
    );
  }
  console.log(`  total JS+CSS: ${kB(bundle.total.raw)} kB raw, ${kB(bundle.total.gzip)} kB gzip`);
  console.log(
    `  first-screen JS: ${kB(bundle.firstScreen.jsGzip)} kB gzip (budget ${kB(FIRST_SCREEN_JS_GZIP_BUDGET)} kB), CSS ${kB(bundle.firstScreen.cssGzip)} kB gzip`,
  );
  if (bundle.serviceWorker) {
    console.log(
      `  service worker sw.js: ${kB(bundle.serviceWorker.raw)} kB raw, ${kB(bundle.serviceWorker.gzip)} kB gzip`,
    );
  } else console.log("  service worker: dist/sw.js missing");

  // --- browser -----------------------------------------------------------------------------
  let browser: BrowserResults | { skipped: string } = { skipped: "--no-browser" };
  if (!args.has("--no-browser")) {
    console.log("\nbrowser (chromium, CPU throttled 4×) …");
    try {
      browser = await browserBench({
        keystrokes: 50,
        coldRuns: quick ? 2 : 5,
        listRuns: quick ? 1 : 3,
      });
      console.log(JSON.stringify(browser, null, 2));
    } catch (err) {
      browser = { skipped: `failed: ${err instanceof Error ? err.message : String(err)}` };
      console.log(browser.skipped);
    }
  }

  // --- map (WebGL through SwiftShader) ----------------------------------------------------
  let map: MapResults | { skipped: string } = { skipped: "--no-browser" };
  if (!args.has("--no-browser")) {
    console.log("\nmap (chromium with SwiftShader WebGL, main thread throttled 4×) …");
    try {
      map = await mapBench({ coldRuns: quick ? 2 : 5, keystrokes: quick ? 10 : 20 });
      console.log(JSON.stringify(map, null, 2));
    } catch (err) {
      map = { skipped: `failed: ${err instanceof Error ? err.message : String(err)}` };
      console.log(map.skipped);
    }
  }

  const results = {
    generated: new Date().toISOString(),
    machine: m,
    quick,
    footprint_solve: solve,
    spread,
    analytic_vs_brute_force: cmp,
    limit_sets_import: sets,
    bundle: {
      built,
      built_at: builtAt,
      budget_first_screen_js_gzip: FIRST_SCREEN_JS_GZIP_BUDGET,
      ...bundle,
      dist: "dist",
    },
    browser,
    map,
  };
  writeFileSync(join(REPO, "bench", "results.json"), `${JSON.stringify(results, null, 2)}\n`);
  writeReadmeTable(results);
  console.log("\nwrote bench/results.json and the table in bench/README.md");
}

// biome-ignore lint/suspicious/noExplicitAny: the results object is built just above
function writeReadmeTable(r: any): void {
  const path = join(REPO, "bench", "README.md");
  const begin = "<!-- results:begin (written by npm run bench) -->";
  const end = "<!-- results:end -->";
  const text = existsSync(path) ? readFileSync(path, "utf8") : `# Benchmarks\n\n${begin}\n${end}\n`;
  const mm = r.machine;
  const rows: string[] = [];
  rows.push(
    `Machine: ${mm.nproc} × ${mm.cpu_model}; Node ${mm.node}; ${mm.chromium}; commit ${mm.commit}; ${r.generated.slice(0, 10)}${r.quick ? " (quick run)" : ""}. ${mm.note}.`,
    "",
    "| measure | median | p95 |",
    "|---|---|---|",
  );
  // biome-ignore lint/suspicious/noExplicitAny: see above
  const pick = (f: (c: any) => boolean) => r.footprint_solve.filter((x: any) => f(x.case));
  // biome-ignore lint/suspicious/noExplicitAny: see above
  const agg = (xs: any[], label: string) => {
    const med = Math.max(...xs.map((x) => x.estimate.median_ms));
    const p95 = Math.max(...xs.map((x) => x.estimate.p95_ms));
    rows.push(`| ${label} (slowest of ${xs.length} cases) | ${ms(med)} ms | ${ms(p95)} ms |`);
  };
  for (const n of [1, 3, 5])
    agg(
      pick((c) => c.limits === n),
      `solve, ${n} limit${n > 1 ? "s" : ""}`,
    );
  agg(
    pick((c) => c.swing === 20),
    "solve, wind swing 20°",
  );
  agg(
    pick((c) => c.lid),
    "solve, mixing lid 300 m",
  );
  agg(
    pick((c) => c.terrain === "urban"),
    "solve, built-up",
  );
  const b = r.browser;
  const brow = (
    label: string,
    v: { median_ms?: number; p95_ms?: number; missing?: string } | undefined,
  ) =>
    rows.push(
      v && v.median_ms !== undefined
        ? `| ${label} | ${ms(v.median_ms)} ms | ${ms(v.p95_ms ?? Number.NaN)} ms |`
        : `| ${label} | not measured: ${v?.missing ?? b?.skipped ?? "?"} | |`,
    );
  brow(
    "keystroke in Release rate → repainted footprint (4× throttle, 50 keys)",
    b?.keystroke_to_footprint,
  );
  brow(
    "cold start from the SW cache, offline → first footprint (4× throttle)",
    b?.cold_start_from_sw_cache,
  );
  brow("reload → 10,000 log entries listed (4× throttle)", b?.list_10000_log_entries);
  const ls = r.limit_sets_import;
  if (ls) {
    rows.push(
      `| limit sets CSV, ${ls.sets} sets / ${ls.limits} limits: read + check | ${ms(ls.read_csv.median_ms)} ms | ${ms(ls.read_csv.p95_ms)} ms |`,
      `| limit sets CSV: read + check + store (fake-indexeddb, Node) | ${ms(ls.store_import.median_ms)} ms | ${ms(ls.store_import.p95_ms)} ms |`,
    );
  }
  brow(
    "map: cold start from the SW cache, offline → footprint drawn on the map (4× throttle)",
    r.map?.cold_start_to_map_footprint ?? { missing: r.map?.skipped },
  );
  brow(
    "map: keystroke in Release rate → footprint redrawn on the map (4× throttle)",
    r.map?.keystroke_to_map_footprint ?? { missing: r.map?.skipped },
  );
  rows.push(
    "",
    "| analytic vs brute force (one band, 400×400) | speed ratio | reach error analytic / brute | area error analytic / outline / brute |",
    "|---|---|---|---|",
  );
  for (const c of r.analytic_vs_brute_force) {
    rows.push(
      `| ${c.name} | ${c.speed_ratio.toFixed(0)}× (${ms(c.analytic.time.median_ms)} vs ${ms(c.brute_force.time.median_ms)} ms) | ${sci(c.analytic.reach_rel_error)} / ${sci(c.brute_force.reach_rel_error)} | ${sci(c.analytic.area_rel_error)} / ${sci(c.analytic.outline_polygon_area_rel_error)} / ${sci(c.brute_force.area_rel_error)} |`,
    );
  }
  const bu = r.bundle;
  rows.push("", "| bundle (gzip, node:zlib default level) | raw | gzip |", "|---|---|---|");
  // biome-ignore lint/suspicious/noExplicitAny: see above
  for (const f of bu.files as any[])
    rows.push(`| ${f.file} | ${kB(f.raw)} kB | ${kB(f.gzip)} kB |`);
  rows.push(`| **total JS + CSS** | ${kB(bu.total.raw)} kB | ${kB(bu.total.gzip)} kB |`);
  rows.push(
    `| **first-screen JS** (budget ${kB(bu.budget_first_screen_js_gzip)} kB) | | ${kB(bu.firstScreen.jsGzip)} kB${bu.firstScreen.jsGzip > bu.budget_first_screen_js_gzip ? " — over budget" : ""} |`,
  );
  if (bu.serviceWorker)
    rows.push(
      `| service worker sw.js | ${kB(bu.serviceWorker.raw)} kB | ${kB(bu.serviceWorker.gzip)} kB |`,
    );
  const i = text.indexOf(begin);
  const j = text.indexOf(end);
  const table = `${begin}\n${rows.join("\n")}\n${end}`;
  const out =
    i >= 0 && j > i ? text.slice(0, i) + table + text.slice(j + end.length) : `${text}\n${table}\n`;
  writeFileSync(path, out);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
