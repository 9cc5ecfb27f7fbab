// The footprint on a map of a kept map area (issue: the footprint on a real map that works with no
// network), in Debian's chromium with WebGL drawn by SwiftShader (harness `webgl: true`), against
// the built app, with the invented town fixture (scripts/map-fixture) as the map area file.
// Run: npm run build && npx vitest run -c vitest.browser.config.ts tests/browser/map.test.ts
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import AxeBuilder from "@axe-core/playwright";
import { DARK, LIGHT } from "@protomaps/basemaps";
import type { FeatureCollection, Position } from "geojson";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { buildTownPMTiles } from "../../scripts/map-fixture/build.ts";
import { launchBrowser, OUTPUT_DIR, startApp } from "./harness.ts";
import { colourDistance, countNear, decodePng, hexRgb, type Pixels } from "./png.ts";

type App = Awaited<ReturnType<typeof startApp>>;
type Browser = Awaited<ReturnType<typeof launchBrowser>>;

let app: App;
let browser: Browser;
const profile = mkdtempSync(join(tmpdir(), "driftmark-map-profile-"));
const fixture = join(OUTPUT_DIR, "town.pmtiles");
const VIEWPORT = { width: 400, height: 900 };
/** WebGL in software on a shared 2-core machine: a map start can take tens of seconds. */
const MAP_TIMEOUT = 180_000;
/** Requests for anything outside the app's origin, over the whole file. */
const foreign: string[] = [];

function watch(b: Browser): void {
  b.context.on("request", (r) => {
    const u = r.url();
    if (!u.startsWith(app.url) && !u.startsWith("blob:") && !u.startsWith("data:")) foreign.push(u);
  });
}

beforeAll(async () => {
  writeFileSync(fixture, buildTownPMTiles().bytes);
  app = await startApp();
  browser = await launchBrowser({ profileDir: profile, webgl: true, viewport: VIEWPORT });
  watch(browser);
  await browser.page.goto(app.url);
}, MAP_TIMEOUT);

afterAll(async () => {
  await browser?.close();
  await app?.close();
  rmSync(profile, { recursive: true, force: true });
  expect(foreign).toEqual([]);
}, MAP_TIMEOUT);

const mapBox = (page: Page) => page.getByTestId("map");

/** Waits until the map has drawn at least `n` footprint versions; returns the count. */
async function drawn(page: Page, n = 1): Promise<number> {
  await page.waitForFunction(
    (min) => Number(document.querySelector("[data-testid=map]")?.getAttribute("data-drawn")) >= min,
    n,
    { timeout: 100_000 },
  );
  return Number(await mapBox(page).getAttribute("data-drawn"));
}

async function openAreas(page: Page): Promise<void> {
  const details = page.getByTestId("map-areas");
  if ((await details.getAttribute("open")) === null) {
    await details.locator("summary").click();
  }
}

/** A screenshot of the map's box, away from the sticky caution banner. */
async function shot(page: Page, name: string): Promise<Pixels> {
  await mapBox(page).evaluate((el) => el.scrollIntoView({ block: "center" }));
  const png = await mapBox(page).screenshot({ path: join(OUTPUT_DIR, name) });
  return decodePng(png);
}

/** Runs code against the MapLibre instance the map element carries (`driftmarkMap`). */
// biome-ignore lint/suspicious/noExplicitAny: the page's MapLibre instance, used as in its docs
function onMap<T, A>(page: Page, fn: (map: any, arg: A) => T | Promise<T>, arg: A): Promise<T> {
  return page.evaluate(
    ([src, a]) => {
      const map = (
        document.querySelector("[data-testid=map]") as unknown as { driftmarkMap: unknown }
      ).driftmarkMap;
      return new Function("map", "arg", `return (${src})(map, arg);`)(map, a);
    },
    [fn.toString(), arg] as const,
  ) as Promise<T>;
}

async function footprintData(page: Page): Promise<FeatureCollection> {
  return onMap(page, (map) => map.getSource("driftmark-footprint").getData(), null);
}

/** The source's [lon, lat] in a footprint collection. */
function sourceOf(fc: FeatureCollection): Position {
  const g = fc.features.find((f) => f.properties?.kind === "source")?.geometry;
  if (g?.type !== "Point") throw new Error("no source point in the footprint");
  return g.coordinates;
}

/** Distance (px) from a point to a polyline. */
function distanceToLine(x: number, y: number, pts: readonly [number, number][]): number {
  let best = Number.POSITIVE_INFINITY;
  for (let i = 0; i + 1 < pts.length; i++) {
    const [ax, ay] = pts[i] as [number, number];
    const [bx, by] = pts[i + 1] as [number, number];
    const dx = bx - ax;
    const dy = by - ay;
    const len2 = dx * dx + dy * dy;
    const t = len2 > 0 ? Math.max(0, Math.min(1, ((x - ax) * dx + (y - ay) * dy) / len2)) : 0;
    best = Math.min(best, Math.hypot(x - (ax + t * dx), y - (ay + t * dy)));
  }
  return best;
}

/** Over earth, a half-transparent fill of `top` (alpha a) shows as this colour. */
function over(top: string, under: string, a: number): number[] {
  const t = hexRgb(top);
  const u = hexRgb(under);
  return t.map((v, i) => v * a + (u[i] as number) * (1 - a));
}

describe("map area file", { timeout: MAP_TIMEOUT }, () => {
  it("keeps a PMTiles extract, lists its name, bounds and size, and draws the footprint on it", async () => {
    const { page } = browser;
    await openAreas(page);
    await expect
      .poll(() => page.getByTestId("map-hint").textContent())
      .toMatch(/add a map area file/);
    await page.getByLabel("Map area file").setInputFiles(fixture);
    const item = page.getByTestId("map-area");
    await expect.poll(() => item.count(), { timeout: 15_000 }).toBe(1);
    const text = (await item.textContent()) ?? "";
    expect(text).toContain("Ostervale");
    expect(text).toMatch(/N – .*N, .*E – .*E/);
    expect(text).toMatch(/\d+(\.\d+)? kB/);
    await drawn(page);
    expect(await page.getByTestId("footprint").count()).toBe(0); // the map replaced the drawing
  });

  it("refuses a corrupt or non-PMTiles file with a plain message, and keeps what it had", async () => {
    const { page } = browser;
    await openAreas(page);
    const before = await page.getByTestId("map-areas-total").textContent();
    await page.getByLabel("Map area file").setInputFiles({
      name: "notes.pmtiles",
      mimeType: "application/octet-stream",
      buffer: Buffer.from("This is not a map at all. ".repeat(20)),
    });
    await expect
      .poll(() => page.getByTestId("map-area-status").textContent())
      .toMatch(/"notes.pmtiles" is not a map area file/);
    const damaged = buildTownPMTiles().bytes;
    damaged.fill(0xff, 127, 600);
    await page.getByLabel("Map area file").setInputFiles({
      name: "damaged.pmtiles",
      mimeType: "application/octet-stream",
      buffer: Buffer.from(damaged),
    });
    await expect
      .poll(() => page.getByTestId("map-area-status").textContent())
      .toMatch(/"damaged.pmtiles" is damaged/);
    expect(await page.getByTestId("map-area").count()).toBe(1);
    expect(await page.getByTestId("map-areas-total").textContent()).toBe(before);
    expect(await mapBox(page).count()).toBe(1);
  });
});

describe("the footprint on the map", { timeout: MAP_TIMEOUT }, () => {
  it("draws each band where map.project() puts its GeoJSON vertices (within 2 px, two zooms)", async () => {
    const { page } = browser;
    await drawn(page);
    const fc = await footprintData(page);
    const bands = fc.features.filter((f) => f.properties?.kind === "band");
    expect(bands.length).toBeGreaterThan(0);
    const source = fc.features.find((f) => f.properties?.kind === "source")?.geometry as {
      coordinates: Position;
    };
    for (const zoom of [14, 15.5]) {
      const n = Number(await mapBox(page).getAttribute("data-drawn"));
      // Hide the base map so the band outline is judged on its own, and centre on the source.
      await onMap(
        page,
        (map, a: { zoom: number; centre: Position }) => {
          for (const l of map.getStyle().layers) {
            if (!l.id.startsWith("fp-")) map.setLayoutProperty(l.id, "visibility", "none");
          }
          for (const id of ["fp-band-fill", "fp-near-zone-fill", "fp-labels", "fp-point-labels"]) {
            map.setLayoutProperty(id, "visibility", "none");
          }
          map.jumpTo({ center: a.centre, zoom: a.zoom });
        },
        { zoom, centre: source.coordinates },
      );
      // Each change of view ends in an idle map; wait for a fresh draw of the footprint too.
      await page.evaluate(() => {
        (document.querySelector("[data-testid=map]") as HTMLElement).dataset.drawn = "-1";
      });
      await onMap(page, (map) => map.triggerRepaint(), null);
      await page.waitForFunction(
        () => document.querySelector("[data-testid=map]")?.getAttribute("data-drawn") !== "-1",
      );
      const px = await shot(page, `map-align-z${zoom}.png`);
      // Every drawn outline in screen pixels: bands, near zone, centreline.
      const lines: { label: string; pts: [number, number][] }[] = [];
      for (const f of fc.features) {
        const k = f.properties?.kind;
        if (k !== "band" && k !== "near-zone" && k !== "centreline") continue;
        const g = f.geometry as { type: string; coordinates: Position[] | Position[][] };
        const coords = (g.type === "LineString" ? g.coordinates : g.coordinates[0]) as Position[];
        const pts = await onMap(
          page,
          (map, r: Position[]) =>
            r.map((p) => map.project(p)).map((p: { x: number; y: number }) => [p.x, p.y]),
          coords,
        );
        lines.push({ label: String(f.properties?.label ?? k), pts: pts as [number, number][] });
      }
      let checked = 0;
      for (const band of bands) {
        const label = String(band.properties?.label);
        const colour = hexRgb(String(band.properties?.stroke));
        const own = lines.find((l) => l.label === label) as (typeof lines)[number];
        const others = lines.filter((l) => l !== own);
        for (const [x, y] of own.pts) {
          // Vertices well inside the box, away from the crosshair, the controls, other outlines.
          const inside = x > 10 && x < px.width - 60 && y > 10 && y < px.height - 40;
          const offCentre = Math.hypot(x - px.width / 2, y - px.height / 2) > 30;
          const alone = others.every((l) => distanceToLine(x, y, l.pts) > 8);
          if (!inside || !offCentre || !alone) continue;
          let best = Number.POSITIVE_INFINITY;
          for (let dx = -2; dx <= 2; dx++) {
            for (let dy = -2; dy <= 2; dy++) {
              best = Math.min(best, colourDistance(px.at(x + dx, y + dy), colour));
            }
          }
          expect(
            best,
            `band "${label}" vertex at ${x.toFixed(1)},${y.toFixed(1)} z${zoom}`,
          ).toBeLessThanOrEqual(40);
          checked++;
        }
      }
      console.info(
        `map.test: ${checked} band vertices within 2 px of their outline at zoom ${zoom}`,
      );
      expect(checked, `vertices checked at zoom ${zoom}`).toBeGreaterThanOrEqual(3);
      expect(n).toBeGreaterThan(0);
    }
    // Back to the full map for the next checks.
    await onMap(
      page,
      (map) => {
        for (const l of map.getStyle().layers) map.setLayoutProperty(l.id, "visibility", "visible");
      },
      null,
    );
  });

  it("puts the source at the crosshair: the footprint follows and the logged entry keeps it", async () => {
    const { page } = browser;
    const before = await drawn(page);
    const target = { lat: 47.0021, lon: 8.0043 };
    await onMap(
      page,
      (map, t: { lat: number; lon: number }) => map.jumpTo({ center: [t.lon, t.lat] }),
      target,
    );
    await page.getByRole("button", { name: "Put the source here" }).click();
    await expect
      .poll(() => page.getByLabel("Latitude", { exact: true }).inputValue())
      .toBe("47.0021");
    expect(await page.getByLabel("Longitude", { exact: true }).inputValue()).toBe("8.0043");
    await drawn(page, before + 1);
    await expect
      .poll(
        async () => {
          const fc = await footprintData(page);
          const src = fc.features.find((f) => f.properties?.kind === "source")?.geometry as {
            coordinates: Position;
          };
          return src.coordinates;
        },
        { timeout: 15_000 },
      )
      .toEqual([8.0043, 47.0021]);
    // The near zone is centred on the new source.
    const fc = await footprintData(page);
    const near = fc.features.find((f) => f.properties?.kind === "near-zone")?.geometry as {
      coordinates: Position[][];
    };
    const ring = near.coordinates[0] as Position[];
    const mean = (k: 0 | 1) =>
      ring.slice(0, -1).reduce((s, p) => s + (p[k] as number), 0) / (ring.length - 1);
    expect(Math.abs(mean(0) - 8.0043)).toBeLessThan(1e-5);
    expect(Math.abs(mean(1) - 47.0021)).toBeLessThan(1e-5);

    const log = page.getByRole("button", { name: "Log this estimate" });
    await expect.poll(() => log.isEnabled(), { timeout: 15_000 }).toBe(true);
    await log.click();
    await expect
      .poll(() => page.getByText(/^Logged: estimate of/).isVisible(), { timeout: 10_000 })
      .toBe(true);
    const sources = await page.evaluate(
      () =>
        new Promise<unknown[]>((done, fail) => {
          const req = indexedDB.open("driftmark");
          req.onerror = () => fail(req.error);
          req.onsuccess = () => {
            const all = req.result.transaction("estimates").objectStore("estimates").getAll();
            all.onsuccess = () =>
              done(
                (all.result as { scenario: { source?: unknown } }[]).map((e) => e.scenario.source),
              );
            all.onerror = () => fail(all.error);
          };
        }),
    );
    expect(sources).toEqual([{ lat: 47.0021, lon: 8.0043 }]);
  });

  it("shows the device position as a dot with its accuracy circle, without moving the source", async () => {
    const { page, context } = browser;
    await context.grantPermissions(["geolocation"], { origin: new URL(app.url).origin });
    await context.setGeolocation({ latitude: 47.0012, longitude: 8.0021, accuracy: 40 });
    const lat = await page.getByLabel("Latitude", { exact: true }).inputValue();
    await page.getByRole("button", { name: "Show my position" }).click();
    await expect
      .poll(
        async () => {
          const fc = await footprintData(page);
          const dot = fc.features.find((f) => f.properties?.kind === "position");
          const circle = fc.features.find((f) => f.properties?.kind === "position-accuracy");
          return [
            dot?.geometry.type === "Point" ? dot.geometry.coordinates : null,
            circle?.properties?.radius_m ?? null,
          ];
        },
        { timeout: 30_000 },
      )
      .toEqual([[8.0021, 47.0012], 40]);
    expect(await page.getByLabel("Latitude", { exact: true }).inputValue()).toBe(lat);
  });

  it("has no axe-core violations with the map and the map areas open, day and night", async () => {
    const { page } = browser;
    await openAreas(page);
    const axe = async () =>
      (await new AxeBuilder({ page }).analyze()).violations.map(
        (v) => `${v.id}: ${v.nodes.map((n) => n.target).join(" | ")}`,
      );
    expect(await axe()).toEqual([]);
    // Every target on and under the map is at least 44 × 44 CSS px (WCAG 2.5.5, AAA).
    const small = await page.evaluate(() =>
      Array.from(
        document.querySelectorAll<HTMLElement>(
          ".dm-map-wrap button, .dm-map-wrap a[href], .dm-areas button, .dm-areas summary, .dm-map-file",
        ),
      )
        .filter((el) => el.getClientRects().length > 0)
        .map((el) => {
          const r = el.getBoundingClientRect();
          return {
            what: el.getAttribute("aria-label") ?? el.textContent?.trim(),
            w: r.width,
            h: r.height,
          };
        })
        .filter((t) => t.w < 44 || t.h < 44),
    );
    expect(small).toEqual([]);
    const before = await drawn(page);
    await page.getByRole("button", { name: "Night theme" }).click();
    // The dark flavour replaces the light one.
    await expect
      .poll(
        async () => {
          await drawn(page, before);
          const px = await shot(page, "map-night.png");
          return countNear(px, hexRgb(DARK.earth), 6) > px.width * px.height * 0.02;
        },
        { timeout: 60_000 },
      )
      .toBe(true);
    expect(await axe()).toEqual([]);
    await page.getByRole("button", { name: "Night theme" }).click(); // a toggle: back to day
    await expect
      .poll(
        async () => {
          const px = await shot(page, "map-day.png");
          return countNear(px, hexRgb(LIGHT.earth), 6) > px.width * px.height * 0.02;
        },
        { timeout: 60_000 },
      )
      .toBe(true);
  });

  it("draws the town and the bands after an offline reload, with no request to the server", async () => {
    const { page, context } = browser;
    await page.evaluate(async () => {
      const sw = navigator.serviceWorker;
      await sw.ready;
      if (!sw.controller) {
        await new Promise((done) => sw.addEventListener("controllerchange", done, { once: true }));
      }
    });
    const failed: string[] = [];
    page.on("requestfailed", (r) => failed.push(r.url()));
    const problems: string[] = [];
    page.on("console", (m) => {
      if (m.type() === "error" || m.type() === "warning") problems.push(m.text());
    });
    app.requests.length = 0;
    await context.setOffline(true);
    try {
      const response = await page.reload();
      expect(response?.fromServiceWorker()).toBe(true);
      await drawn(page);
      // A view west of the source: the river (about 1 km west of it) and the near bands in it.
      const src = sourceOf(await footprintData(page));
      await onMap(page, (map, c: Position) => map.jumpTo({ center: c, zoom: 13.5 }), [
        (src[0] as number) - 0.004,
        src[1] as number,
      ]);
      await page.evaluate(() => {
        (document.querySelector("[data-testid=map]") as HTMLElement).dataset.drawn = "-1";
      });
      await onMap(page, (map) => map.triggerRepaint(), null);
      await page.waitForFunction(
        () => document.querySelector("[data-testid=map]")?.getAttribute("data-drawn") !== "-1",
      );
      const px = await shot(page, "map-offline-town.png");
      const total = px.width * px.height;
      const land = countNear(px, hexRgb(LIGHT.earth), 6);
      const water = countNear(px, hexRgb(LIGHT.water), 10);
      const buildings = countNear(px, over(LIGHT.buildings, LIGHT.earth, 0.5), 6);
      console.info(
        `map.test: of ${total} px, land ${land}, water ${water}, buildings ${buildings} (light flavour colours)`,
      );
      expect(land).toBeGreaterThan(total * 0.02);
      expect(water).toBeGreaterThan(total * 0.005);
      expect(buildings).toBeGreaterThan(total * 0.02);
      // The bands are over the town: each band's outline colour is on screen.
      const fc = await footprintData(page);
      for (const band of fc.features.filter((f) => f.properties?.kind === "band")) {
        expect(countNear(px, hexRgb(String(band.properties?.stroke)), 30)).toBeGreaterThan(20);
      }
      // The browser re-checks the service worker script on navigation outside the page's offline
      // emulation (stack.md): that request is the browser's own, not the app's.
      expect(app.requests.filter((r) => r !== "/sw.js")).toEqual([]);
      expect(failed).toEqual([]);
      expect(problems).toEqual([]);
    } finally {
      await context.setOffline(false);
    }
  });

  it("still lists and draws the kept area after the browser is closed and reopened", async () => {
    await browser.close();
    browser = await launchBrowser({ profileDir: profile, webgl: true, viewport: VIEWPORT });
    watch(browser);
    const { page } = browser;
    await page.goto(app.url);
    await openAreas(page);
    await expect.poll(() => page.getByTestId("map-area").count(), { timeout: 15_000 }).toBe(1);
    await drawn(page);
    const px = await shot(page, "map-reopened.png");
    expect(countNear(px, hexRgb(LIGHT.earth), 6)).toBeGreaterThan(px.width * px.height * 0.02);
  });

  it("removes the area, frees the storage shown, and falls back to the drawing with a hint", async () => {
    const { page } = browser;
    await openAreas(page);
    const total = page.getByTestId("map-areas-total");
    expect(await total.textContent()).toMatch(/Map areas use \d+(\.\d+)? kB/);
    await page.getByRole("button", { name: /^Remove Ostervale/ }).click();
    await expect.poll(() => page.getByTestId("map-area").count()).toBe(0);
    expect(await total.textContent()).toBe("Map areas use 0 bytes");
    await expect.poll(() => page.getByTestId("footprint").isVisible()).toBe(true);
    expect(await page.getByTestId("map-hint").textContent()).toMatch(/add a map area file/);
  });
});
