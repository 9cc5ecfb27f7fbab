/**
 * Browser figures (issue 5, bench): Debian chromium through playwright-core, the page's CPU
 * throttled 4× through CDP `Emulation.setCPUThrottlingRate` (the main thread of the page only;
 * workers and the service worker are not throttled). All times are measured inside the page
 * (performance.now, requestAnimationFrame, performance marks) and printed; nothing is asserted.
 *
 * - Keystroke → repainted footprint: from the keydown event's timeStamp to the first paint after
 *   the footprint (data-testid="footprint") changes (the frame after the DOM change:
 *   requestAnimationFrame, then a message-channel task, which runs after that frame's paint).
 * - Cold start: the browser relaunched on a profile whose service worker has cached the app,
 *   offline, to the first paint with the footprint on screen (ms since navigation start).
 * - 10,000 log entries: seeded into IndexedDB in the page with the schema of
 *   src/storage/schema.ts (database "driftmark", store "estimates"), then the page reloaded and
 *   timed to the painted list ("10000 entries.").
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { BrowserContext, Page } from "playwright-core";
import { estimate } from "../src/core/index.ts";
import type { Scenario } from "../src/core/types.ts";
import { newEntry } from "../src/storage/log.ts";
import { CHROMIUM_PATH, launchBrowser, startApp } from "../tests/browser/harness.ts";
import { type Stats, stats } from "./solve.ts";

export const THROTTLE = 4;

export interface BrowserResults {
  chromium: string;
  cpu_throttling_rate: number;
  keystroke_to_footprint: (Stats & { missed: number; note?: string }) | { missing: string };
  cold_start_from_sw_cache: (Stats & { from_service_worker: boolean }) | { missing: string };
  list_10000_log_entries: (Stats & { entries_shown: string }) | { missing: string };
}

export function chromiumVersion(): string {
  try {
    return execFileSync(CHROMIUM_PATH, ["--version"], {
      encoding: "utf8",
      stdio: ["ignore", "pipe", "ignore"],
    }).trim();
  } catch {
    return "unknown";
  }
}

/** tsx (esbuild keepNames) may wrap functions in __name(…); the page needs that name too. */
const NAME_SHIM = "globalThis.__name = globalThis.__name || ((f) => f);";

async function launch(opts?: { profileDir?: string }) {
  const b = await launchBrowser(opts);
  await b.page.addInitScript(NAME_SHIM);
  return b;
}

async function throttle(context: BrowserContext, page: Page): Promise<void> {
  const cdp = await context.newCDPSession(page);
  await cdp.send("Emulation.setCPUThrottlingRate", { rate: THROTTLE });
}

/** In-page: resolves with ms from the next keydown to the paint after the footprint changes. */
function armKeystrokeProbe(i: number): void {
  const w = window as unknown as { __dmProbe?: Promise<number | null> };
  w.__dmProbe = new Promise((resolve) => {
    let t0: number | null = null;
    const fp = () => document.querySelector('[data-testid="footprint"]');
    const el = fp();
    document.addEventListener(
      "keydown",
      (e) => {
        t0 = e.timeStamp;
        performance.mark(`dm-key-${i}`, { startTime: e.timeStamp });
      },
      { capture: true, once: true },
    );
    const done = (v: number | null) => {
      obs.disconnect();
      clearTimeout(timer);
      resolve(v);
    };
    const obs = new MutationObserver((records) => {
      if (t0 === null) return;
      const now = fp();
      const changed = now !== el || records.some((r) => el?.contains(r.target as Node) === true);
      if (!changed) return;
      obs.disconnect();
      requestAnimationFrame(() => {
        const ch = new MessageChannel();
        ch.port1.onmessage = () => {
          performance.mark(`dm-paint-${i}`);
          done(performance.now() - (t0 as number));
        };
        ch.port2.postMessage(0);
      });
    });
    obs.observe(document.body, {
      subtree: true,
      childList: true,
      attributes: true,
      characterData: true,
    });
    const timer = setTimeout(() => done(null), 10_000);
  });
}

/** In-page, before the app runs: records the first painted footprint (ms since navigation). */
function firstFootprintProbe(): void {
  const w = window as unknown as { __dmFirst?: number };
  const obs = new MutationObserver(() => {
    const el = document.querySelector('[data-testid="footprint"]');
    if (!el || el.childElementCount === 0) return;
    obs.disconnect();
    requestAnimationFrame(() => {
      const ch = new MessageChannel();
      ch.port1.onmessage = () => {
        performance.mark("dm-first-footprint");
        w.__dmFirst = performance.now();
      };
      ch.port2.postMessage(0);
    });
  });
  obs.observe(document, { subtree: true, childList: true });
}

/** In-page: records the first paint with the log listing `count` entries. */
function listProbe(count: number): void {
  const w = window as unknown as { __dmListed?: number; __dmListedText?: string };
  const obs = new MutationObserver(() => {
    const c = document.querySelector('[data-testid="log-count"]');
    const row = document.querySelector('[data-testid="log-window"] li');
    const text = c?.textContent ?? "";
    if (!row || !text.startsWith(`${count} `)) return;
    obs.disconnect();
    requestAnimationFrame(() => {
      const ch = new MessageChannel();
      ch.port1.onmessage = () => {
        performance.mark("dm-log-listed");
        w.__dmListed = performance.now();
        w.__dmListedText = text;
      };
      ch.port2.postMessage(0);
    });
  });
  obs.observe(document, { subtree: true, childList: true, characterData: true });
}

async function keystrokes(
  page: Page,
  n: number,
): Promise<BrowserResults["keystroke_to_footprint"]> {
  const field = page.getByLabel("Release rate", { exact: true });
  if ((await field.count()) === 0) return { missing: 'no field labelled "Release rate"' };
  if ((await page.locator('[data-testid="footprint"]').count()) === 0) {
    return { missing: 'no element data-testid="footprint" on the first screen' };
  }
  await field.click();
  await page.keyboard.press("End");
  const samples: number[] = [];
  let missed = 0;
  for (let i = 0; i < n; i++) {
    await page.evaluate(armKeystrokeProbe, i);
    // Alternate: append a digit (rate ×10 + 1), then take it away again.
    await page.keyboard.press(i % 2 === 0 ? "1" : "Backspace");
    const ms = await page.evaluate(
      () => (window as unknown as { __dmProbe: Promise<number | null> }).__dmProbe,
    );
    if (ms === null) missed++;
    else samples.push(ms);
  }
  if (samples.length === 0) return { missing: "the footprint never changed after a keystroke" };
  return { ...stats(samples), missed };
}

async function waitForSwCache(page: Page): Promise<void> {
  await page.waitForFunction(() => navigator.serviceWorker?.controller !== null, null, {
    timeout: 30_000,
  });
  await page.waitForFunction(async () => (await caches.keys()).length > 0, null, {
    timeout: 30_000,
  });
}

async function coldStarts(
  url: string,
  runs: number,
): Promise<BrowserResults["cold_start_from_sw_cache"]> {
  const profileDir = mkdtempSync(join(tmpdir(), "driftmark-bench-"));
  try {
    {
      const b = await launch({ profileDir });
      await b.page.goto(url);
      await waitForSwCache(b.page);
      await b.close();
    }
    const samples: number[] = [];
    let fromSw = true;
    for (let i = 0; i < runs; i++) {
      const b = await launch({ profileDir });
      try {
        await b.context.setOffline(true);
        await throttle(b.context, b.page);
        await b.page.addInitScript(firstFootprintProbe);
        const resp = await b.page.goto(url);
        fromSw &&= resp?.fromServiceWorker() ?? false;
        const t = await b.page
          .waitForFunction(() => (window as unknown as { __dmFirst?: number }).__dmFirst, null, {
            timeout: 30_000,
          })
          .then((h) => h.jsonValue() as Promise<number>)
          .catch(() => null);
        if (t === null) return { missing: "no footprint appeared within 30 s of a cold start" };
        samples.push(t);
      } finally {
        await b.close();
      }
    }
    return { ...stats(samples), from_service_worker: fromSw };
  } finally {
    rmSync(profileDir, { recursive: true, force: true });
  }
}

/** An invented logged entry as the app writes it (newEntry of src/storage/log.ts). */
function template(): unknown {
  const scenario: Scenario = {
    release: { kind: "continuous", rate_g_s: 400, duration_s: 1200, height_m: 1 },
    weather: { wind_speed_m_s: 3, wind_from_deg: 225, stability: "D" },
    molecular_weight_g_mol: 40,
    limits: [
      { label: "Invented limit low 60 min", value: 5, unit: "ppm", averaging_s: 3600 },
      { label: "Invented limit high 10 min", value: 80, unit: "ppm", averaging_s: 600 },
    ],
    source: { lat: 47, lon: 8 },
  };
  return newEntry({
    scenario,
    result: estimate(scenario, { geojson: false }),
    place: { lat: 47, lon: 8, accuracy_m: 20 },
    note: "bench (invented)",
    now: new Date("2026-01-01T00:00:00Z"),
    id: "template",
  });
}

/** In-page: puts `n` copies of the template, one minute apart, into the app's database. */
async function seed(args: { entry: Record<string, unknown>; n: number }): Promise<number> {
  const db: IDBDatabase = await new Promise((res, rej) => {
    const r = indexedDB.open("driftmark");
    r.onsuccess = () => res(r.result);
    r.onerror = () => rej(r.error);
  });
  if (!db.objectStoreNames.contains("estimates"))
    throw new Error("the app has not created its log store");
  const tx = db.transaction("estimates", "readwrite");
  const store = tx.objectStore("estimates");
  const t0 = Date.parse("2026-01-01T00:00:00Z");
  for (let i = 0; i < args.n; i++) {
    const d = new Date(t0 - i * 60_000);
    const iso = d.toISOString();
    store.put({
      ...args.entry,
      id: `bench-${String(i).padStart(5, "0")}`,
      time_utc: iso,
      time_local: `${iso.slice(0, 19)}+00:00`,
      note: `bench entry ${i} (invented)`,
    });
  }
  await new Promise<void>((res, rej) => {
    tx.oncomplete = () => res();
    tx.onerror = () => rej(tx.error);
  });
  const count: number = await new Promise((res) => {
    const r = db.transaction("estimates").objectStore("estimates").count();
    r.onsuccess = () => res(r.result);
  });
  db.close();
  return count;
}

async function logListing(
  url: string,
  runs: number,
): Promise<BrowserResults["list_10000_log_entries"]> {
  const b = await launch();
  try {
    await b.page.goto(url);
    const count = b.page.locator('[data-testid="log-count"]');
    // The log section loads after the first estimate is on screen.
    await count.waitFor({ timeout: 15_000 }).catch(() => undefined);
    if ((await count.count()) === 0) return { missing: 'no data-testid="log-count" on the page' };
    await b.page.waitForFunction(
      () =>
        !document.querySelector('[data-testid="log-count"]')?.textContent?.startsWith("Reading"),
    );
    const n = 10_000;
    const stored = await b.page.evaluate(seed, { entry: template() as Record<string, unknown>, n });
    if (stored !== n) return { missing: `seeded ${n} entries but the store holds ${stored}` };
    await throttle(b.context, b.page);
    await b.page.addInitScript(listProbe, n);
    const samples: number[] = [];
    let shown = "";
    for (let i = 0; i < runs; i++) {
      await b.page.reload();
      const t = await b.page
        .waitForFunction(() => (window as unknown as { __dmListed?: number }).__dmListed, null, {
          timeout: 120_000,
        })
        .then((h) => h.jsonValue() as Promise<number>)
        .catch(() => null);
      if (t === null) return { missing: "the list of 10,000 entries did not appear within 120 s" };
      samples.push(t);
      shown = await b.page.evaluate(
        () => (window as unknown as { __dmListedText?: string }).__dmListedText ?? "",
      );
    }
    return { ...stats(samples), entries_shown: shown };
  } finally {
    await b.close();
  }
}

export async function browserBench(opts: {
  keystrokes: number;
  coldRuns: number;
  listRuns: number;
}): Promise<BrowserResults> {
  const app = await startApp();
  try {
    const b = await launch();
    let keys: BrowserResults["keystroke_to_footprint"];
    try {
      await throttle(b.context, b.page);
      await b.page.goto(app.url);
      await b.page
        .locator('[data-testid="footprint"]')
        .first()
        .waitFor({ timeout: 30_000 })
        .catch(() => undefined);
      keys = await keystrokes(b.page, opts.keystrokes);
    } finally {
      await b.close();
    }
    const cold = await coldStarts(app.url, opts.coldRuns);
    const list = await logListing(app.url, opts.listRuns);
    return {
      chromium: chromiumVersion(),
      cpu_throttling_rate: THROTTLE,
      keystroke_to_footprint: keys,
      cold_start_from_sw_cache: cold,
      list_10000_log_entries: list,
    };
  } finally {
    await app.close();
  }
}
