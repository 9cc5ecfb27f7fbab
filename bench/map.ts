/**
 * Map figures (the footprint on a map of a kept map area): chromium with WebGL through SwiftShader
 * (harness `webgl: true`), the page's main thread throttled 4× (CDP
 * `Emulation.setCPUThrottlingRate`; SwiftShader draws in the GPU process, which is not throttled),
 * the invented town fixture (scripts/map-fixture) kept as the map area. Printed, never asserted.
 *
 * - Offline cold start → footprint drawn on the map: the browser relaunched on a profile whose
 *   service worker has cached the app and which keeps the map area, offline, to the first time
 *   the map reports the footprint drawn (`data-drawn` ≥ 1, set on MapLibre's `idle`), in ms since
 *   navigation start.
 * - Keystroke → footprint repainted on the map: from the keydown's timeStamp to the map's next
 *   `data-drawn` (the app's typing pause included).
 * - Map chunk sizes: the map part, MapLibre's chunk, its CSS and its worker (raw and gzip).
 */
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { gzipSync } from "node:zlib";
import type { BrowserContext, Page } from "playwright-core";
import { buildTownPMTiles } from "../scripts/map-fixture/build.ts";
import { launchBrowser, OUTPUT_DIR, startApp } from "../tests/browser/harness.ts";
import { DIST } from "./bundle.ts";
import { type Stats, stats } from "./solve.ts";

export const MAP_THROTTLE = 4;

export interface MapResults {
  cold_start_to_map_footprint: (Stats & { from_service_worker: boolean }) | { missing: string };
  keystroke_to_map_footprint: (Stats & { missed: number }) | { missing: string };
  chunks: { file: string; raw: number; gzip: number }[];
}

const NAME_SHIM = "globalThis.__name = globalThis.__name || ((f) => f);";

async function launch(profileDir: string) {
  const b = await launchBrowser({ profileDir, webgl: true, viewport: { width: 400, height: 900 } });
  await b.page.addInitScript(NAME_SHIM);
  return b;
}

async function throttle(context: BrowserContext, page: Page): Promise<void> {
  const cdp = await context.newCDPSession(page);
  await cdp.send("Emulation.setCPUThrottlingRate", { rate: MAP_THROTTLE });
}

/** In-page, before the app runs: the first time the map says the footprint is drawn. */
function firstMapProbe(): void {
  const w = window as unknown as { __dmMap?: number };
  const obs = new MutationObserver(() => {
    const el = document.querySelector('[data-testid="map"]');
    if (!el || Number(el.getAttribute("data-drawn")) < 1) return;
    obs.disconnect();
    w.__dmMap = performance.now();
  });
  obs.observe(document, { subtree: true, childList: true, attributes: true });
}

/** In-page: resolves with ms from the next keydown to the map's next drawn footprint. */
function armMapKeyProbe(): void {
  const w = window as unknown as { __dmMapKey?: Promise<number | null> };
  w.__dmMapKey = new Promise((resolve) => {
    const el = document.querySelector('[data-testid="map"]');
    if (!el) return resolve(null);
    let t0: number | null = null;
    const from = el.getAttribute("data-drawn");
    document.addEventListener("keydown", (e) => (t0 = e.timeStamp), { capture: true, once: true });
    const obs = new MutationObserver(() => {
      if (t0 === null || el.getAttribute("data-drawn") === from) return;
      obs.disconnect();
      clearTimeout(timer);
      resolve(performance.now() - t0);
    });
    obs.observe(el, { attributes: true, attributeFilter: ["data-drawn"] });
    const timer = setTimeout(() => {
      obs.disconnect();
      resolve(null);
    }, 20_000);
  });
}

async function waitDrawn(page: Page, timeout: number): Promise<boolean> {
  return page
    .waitForFunction(
      () => Number(document.querySelector('[data-testid="map"]')?.getAttribute("data-drawn")) >= 1,
      null,
      { timeout },
    )
    .then(() => true)
    .catch(() => false);
}

function chunkSizes(): MapResults["chunks"] {
  const dir = join(DIST, "assets");
  return readdirSync(dir)
    .filter((f) => /^(MapView|MapPart|maplibre-gl-worker)-/.test(f))
    .map((f) => {
      const bytes = readFileSync(join(dir, f));
      return { file: `assets/${f}`, raw: bytes.length, gzip: gzipSync(bytes).length };
    });
}

export async function mapBench(opts: {
  coldRuns: number;
  keystrokes: number;
}): Promise<MapResults> {
  const chunks = chunkSizes();
  const app = await startApp();
  const profileDir = mkdtempSync(join(tmpdir(), "driftmark-map-bench-"));
  const fixture = join(OUTPUT_DIR, "bench-town.pmtiles");
  writeFileSync(fixture, buildTownPMTiles().bytes);
  try {
    // Set-up, online: keep the map area, let the service worker cache the app.
    {
      const b = await launch(profileDir);
      try {
        await b.page.goto(app.url);
        await b.page.locator('[data-testid="map-areas"] summary').click({ timeout: 60_000 });
        await b.page.getByLabel("Map area file").setInputFiles(fixture);
        if (!(await waitDrawn(b.page, 120_000))) {
          return {
            cold_start_to_map_footprint: { missing: "the map never drew after adding the area" },
            keystroke_to_map_footprint: { missing: "no map" },
            chunks,
          };
        }
        await b.page.waitForFunction(() => navigator.serviceWorker?.controller !== null);
      } finally {
        await b.close();
      }
    }
    const samples: number[] = [];
    let fromSw = true;
    let keys: MapResults["keystroke_to_map_footprint"] = { missing: "not run" };
    for (let i = 0; i < opts.coldRuns; i++) {
      const b = await launch(profileDir);
      try {
        await b.context.setOffline(true);
        await throttle(b.context, b.page);
        await b.page.addInitScript(firstMapProbe);
        const resp = await b.page.goto(app.url);
        fromSw &&= resp?.fromServiceWorker() ?? false;
        const t = await b.page
          .waitForFunction(() => (window as unknown as { __dmMap?: number }).__dmMap, null, {
            timeout: 120_000,
          })
          .then((h) => h.jsonValue() as Promise<number>)
          .catch(() => null);
        if (t === null) {
          keys = { missing: "no cold start drew the map" };
          return {
            cold_start_to_map_footprint: { missing: "no map footprint within 120 s" },
            keystroke_to_map_footprint: keys,
            chunks,
          };
        }
        samples.push(t);
        if (i === opts.coldRuns - 1) {
          // Keystrokes on the last, warm page (still offline, still throttled).
          const field = b.page.getByLabel("Release rate", { exact: true });
          await field.click();
          await b.page.keyboard.press("End");
          const ks: number[] = [];
          let missed = 0;
          for (let k = 0; k < opts.keystrokes; k++) {
            await b.page.evaluate(armMapKeyProbe);
            await b.page.keyboard.press(k % 2 === 0 ? "1" : "Backspace");
            const ms = await b.page.evaluate(
              () => (window as unknown as { __dmMapKey: Promise<number | null> }).__dmMapKey,
            );
            if (ms === null) missed++;
            else ks.push(ms);
          }
          keys = ks.length ? { ...stats(ks), missed } : { missing: "the map never redrew" };
        }
      } finally {
        await b.close();
      }
    }
    return {
      cold_start_to_map_footprint: { ...stats(samples), from_service_worker: fromSw },
      keystroke_to_map_footprint: keys,
      chunks,
    };
  } finally {
    rmSync(profileDir, { recursive: true, force: true });
    rmSync(fixture, { force: true });
    await app.close();
  }
}

if (process.argv[1]?.endsWith("bench/map.ts")) {
  const quick = process.argv.includes("--quick");
  mapBench({ coldRuns: quick ? 2 : 5, keystrokes: quick ? 10 : 20 }).then(
    (r) => console.log(JSON.stringify(r, null, 2)),
    (e) => {
      console.error(e);
      process.exit(1);
    },
  );
}
