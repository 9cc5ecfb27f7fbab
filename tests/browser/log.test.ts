// The estimate log in Debian's chromium against the built app: entries survive a reload, going
// offline and back, a service-worker update, and closing the browser right after a write.
// Run: npm run build && npx vitest run -c vitest.browser.config.ts tests/browser/log.test.ts
import { appendFileSync, cpSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import AxeBuilder from "@axe-core/playwright";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startServer } from "../../scripts/serve.mjs";
import { CAUTION } from "../../src/core/caution.ts";
import { expectValidFootprintFile } from "../geo/validate.ts";
import { launchBrowser, startApp, waitForController } from "./harness.ts";

type App = Awaited<ReturnType<typeof startApp>>;
let app: App;
const profiles: string[] = [];

function profile(): string {
  const d = mkdtempSync(join(tmpdir(), "driftmark-log-profile-"));
  profiles.push(d);
  return d;
}

beforeAll(async () => {
  app = await startApp();
});
afterAll(async () => {
  await app?.close();
  for (const d of profiles) rmSync(d, { recursive: true, force: true });
});

/** The entry count the log view shows ("3 entries." → 3). */
async function shownCount(page: Page): Promise<number> {
  const t = (await page.getByTestId("log-count").textContent()) ?? "";
  const m = /^(\d+) (entry|entries)\./.exec(t);
  return m ? Number(m[1]) : -1;
}

/** Loads the demo and logs it with a note; resolves when the app says it was logged. */
async function logDemo(page: Page, note: string): Promise<void> {
  await page.getByRole("button", { name: "Demo" }).click();
  const log = page.getByRole("button", { name: "Log this estimate" });
  await expect.poll(() => log.isEnabled(), { timeout: 15_000 }).toBe(true);
  await page.getByLabel("Note (optional)").fill(note);
  await log.click();
  await expect
    .poll(() => page.getByText(/^Logged: estimate of/).isVisible(), { timeout: 10_000 })
    .toBe(true);
}

async function rowTexts(page: Page): Promise<string[]> {
  return page.locator(".dm-log-rowbtn").allTextContents();
}

describe("the log in the browser", () => {
  it("keeps entries across a reload and offline, newest first", async () => {
    const b = await launchBrowser({ profileDir: profile() });
    try {
      const { page, context } = b;
      await page.goto(app.url);
      await expect.poll(() => shownCount(page), { timeout: 15_000 }).toBe(0);
      await logDemo(page, "first note");
      expect(await shownCount(page)).toBe(1);

      await page.reload();
      await expect.poll(() => shownCount(page), { timeout: 15_000 }).toBe(1);
      expect((await rowTexts(page))[0]).toContain("first note");

      await waitForController(page);
      await context.setOffline(true);
      const resp = await page.reload();
      expect(resp?.fromServiceWorker()).toBe(true);
      await expect.poll(() => shownCount(page), { timeout: 15_000 }).toBe(1);
      await logDemo(page, "written offline");
      await context.setOffline(false);
      await page.reload();
      await expect.poll(() => shownCount(page), { timeout: 15_000 }).toBe(2);
      const rows = await rowTexts(page);
      expect(rows[0]).toContain("written offline");
      expect(rows[1]).toContain("first note");
    } finally {
      await b.close();
    }
  });

  it("keeps the device's position accuracy with an entry logged from that position", async () => {
    const b = await launchBrowser({ profileDir: profile() });
    try {
      const { page, context } = b;
      await context.grantPermissions(["geolocation"], { origin: new URL(app.url).origin });
      await context.setGeolocation({ latitude: 46.5, longitude: 7.25, accuracy: 35 });
      await page.goto(app.url);
      await expect.poll(() => shownCount(page), { timeout: 15_000 }).toBe(0);
      await page.getByRole("button", { name: "Use my position" }).click();
      await expect
        .poll(() => page.getByText(/^Position found, accurate to about/).isVisible(), {
          timeout: 10_000,
        })
        .toBe(true);
      expect(await page.getByLabel("Latitude").inputValue()).toBe("46.5");
      // The estimate on screen (the one logged) follows the new place.
      await expect
        .poll(() => page.getByText(/Source at 46\.5° N, 7\.25° E/).isVisible(), { timeout: 10_000 })
        .toBe(true);
      const log = page.getByRole("button", { name: "Log this estimate" });
      await expect.poll(() => log.isEnabled(), { timeout: 15_000 }).toBe(true);
      await log.click();
      await expect
        .poll(() => page.getByText(/^Logged: estimate of/).isVisible(), { timeout: 10_000 })
        .toBe(true);
      // Read the stored entry straight from IndexedDB (schema: src/storage/schema.ts).
      const place = await page.evaluate(
        () =>
          new Promise<unknown>((done, fail) => {
            const req = indexedDB.open("driftmark");
            req.onerror = () => fail(req.error);
            req.onsuccess = () => {
              const all = req.result.transaction("estimates").objectStore("estimates").getAll();
              all.onsuccess = () => done((all.result[0] as { place: unknown }).place);
              all.onerror = () => fail(all.error);
            };
          }),
      );
      expect(place).toEqual({ lat: 46.5, lon: 7.25, accuracy_m: 35 });
    } finally {
      await b.close();
    }
  });

  it("has an entry written just before the browser is closed on the next open", async () => {
    const dir = profile();
    const first = await launchBrowser({ profileDir: dir });
    await first.page.goto(app.url);
    await expect.poll(() => shownCount(first.page), { timeout: 15_000 }).toBe(0);
    await logDemo(first.page, "last words");
    await first.close(); // straight after the app reported the write

    const second = await launchBrowser({ profileDir: dir });
    try {
      await second.page.goto(app.url);
      await expect.poll(() => shownCount(second.page), { timeout: 15_000 }).toBe(1);
      expect((await rowTexts(second.page))[0]).toContain("last words");
    } finally {
      await second.close();
    }
  });

  it("deletes one entry with undo, and deletes all only after the typed word", async () => {
    const b = await launchBrowser({ profileDir: profile() });
    try {
      const { page } = b;
      await page.goto(app.url);
      await logDemo(page, "one");
      await page.getByLabel("Note (optional)").fill("two");
      await page.getByRole("button", { name: "Log this estimate" }).click();
      await expect.poll(() => shownCount(page)).toBe(2);

      await page.locator(".dm-log-rowbtn", { hasText: "one" }).click();
      await page.getByRole("button", { name: "Delete entry" }).click();
      await expect.poll(() => shownCount(page)).toBe(1);
      await page.getByRole("button", { name: "Undo delete" }).click();
      await expect.poll(() => shownCount(page)).toBe(2);
      await page.reload();
      await expect.poll(() => shownCount(page), { timeout: 15_000 }).toBe(2);

      await page.getByRole("button", { name: "Delete all entries…" }).click();
      const confirm = page.getByRole("button", { name: "Delete all", exact: true });
      expect(await confirm.isDisabled()).toBe(true);
      await page.getByLabel(/Type DELETE to delete all/).fill("delete");
      expect(await confirm.isDisabled()).toBe(true);
      await page.getByLabel(/Type DELETE to delete all/).fill("DELETE");
      await confirm.click();
      await expect.poll(() => shownCount(page)).toBe(0);
    } finally {
      await b.close();
    }
  });

  it("keeps entries through a service-worker update", async () => {
    const root = mkdtempSync(join(tmpdir(), "driftmark-log-dist-"));
    cpSync(join(import.meta.dirname, "..", "..", "dist"), root, { recursive: true });
    const server = await startServer({ port: 0, root });
    const b = await launchBrowser({ profileDir: profile() });
    try {
      const { page } = b;
      await page.goto(server.url);
      await waitForController(page);
      await logDemo(page, "before update");
      appendFileSync(join(root, "sw.js"), "\n// next version\n");
      await page.evaluate(async () => {
        await (await navigator.serviceWorker.getRegistration())?.update();
      });
      const button = page.getByRole("button", { name: "Update available — reload" });
      await expect.poll(() => button.isVisible(), { timeout: 15_000 }).toBe(true);
      await Promise.all([page.waitForEvent("load"), button.click()]);
      await expect.poll(() => shownCount(page), { timeout: 15_000 }).toBe(1);
      expect((await rowTexts(page))[0]).toContain("before update");
      const waiting = await page.evaluate(
        async () => (await navigator.serviceWorker.getRegistration())?.waiting != null,
      );
      expect(waiting).toBe(false);
    } finally {
      await b.close();
      await server.close();
      rmSync(root, { recursive: true, force: true });
    }
  });

  it("shares the footprint as a file (download here: headless chromium cannot share files) and logs it", async () => {
    const b = await launchBrowser({ profileDir: profile() });
    try {
      const { page } = b;
      await page.goto(app.url);
      await page.getByRole("button", { name: "Demo" }).click();
      const share = page.getByRole("button", { name: "Share footprint" }).first();
      await expect.poll(() => share.isEnabled(), { timeout: 15_000 }).toBe(true);
      const [download] = await Promise.all([page.waitForEvent("download"), share.click()]);
      expect(download.suggestedFilename()).toMatch(/^driftmark-footprint-\d{8}-\d{6}\.geojson$/);
      const fc = JSON.parse(readFileSync((await download.path()) as string, "utf8"));
      expectValidFootprintFile(fc);
      expect(fc.caution).toBe(CAUTION);
      await expect.poll(() => shownCount(page)).toBe(1); // sharing logged the estimate
    } finally {
      await b.close();
    }
  });

  it("imports 10,000 entries, renders only the visible rows, and reports rejected ones", async () => {
    const b = await launchBrowser({ profileDir: profile() });
    try {
      const { page } = b;
      await page.goto(app.url);
      await logDemo(page, "template");
      // Build a backup in the page from the logged entry: 10,000 copies an hour apart, plus one bad.
      const texts = await page.evaluate(async () => {
        const db: IDBDatabase = await new Promise((ok, no) => {
          const r = indexedDB.open("driftmark");
          r.onsuccess = () => ok(r.result);
          r.onerror = () => no(r.error);
        });
        const all: Record<string, unknown>[] = await new Promise((ok) => {
          const r = db.transaction("estimates").objectStore("estimates").getAll();
          r.onsuccess = () => ok(r.result);
        });
        db.close();
        // Keep each copy small (no points) so that 10,000 fit in the 20 MB limit.
        const full = all[0] as Record<string, Record<string, unknown>>;
        const { points: _p, ...scenario } = full.scenario as Record<string, unknown>;
        const t = { ...full, scenario, results: { ...full.results, points: [] } };
        const t0 = Date.UTC(2024, 0, 1);
        const entries: unknown[] = [];
        for (let i = 0; i < 10_000; i++) {
          const d = new Date(t0 + i * 3_600_000).toISOString();
          entries.push({
            ...t,
            id: `bulk-${i}`,
            time_utc: d,
            time_local: d.replace(".000Z", "Z"),
            note: `bulk ${i}`,
          });
        }
        const bad = { ...t, id: "bad-1", place: { lat: "north", lon: 8 } };
        const wrap = (list: unknown[]) =>
          JSON.stringify({
            format: "driftmark-log",
            version: 1,
            exported_utc: new Date().toISOString(),
            entries: list,
          });
        // Two files (each under 20 MB) that overlap by 2,000 entries.
        return [wrap(entries.slice(0, 6000)), wrap([...entries.slice(4000), bad])];
      });
      const summary = page.getByTestId("import-summary");
      const input = page.getByTestId("log-import");
      for (const [i, text] of texts.entries()) {
        expect(text.length).toBeLessThan(20 * 1024 * 1024);
        const started = performance.now();
        await input.setInputFiles({
          name: `bulk-${i}.json`,
          mimeType: "application/json",
          buffer: Buffer.from(text),
        });
        const want =
          i === 0
            ? "Added 6000; already in the log 0; rejected 0"
            : "Added 4000; already in the log 2000; rejected 1";
        await expect
          .poll(async () => (await summary.isVisible()) && (await summary.textContent()), {
            timeout: 30_000,
          })
          .toContain(want)
          .catch(async (e: unknown) => {
            throw new Error(
              `${String(e)}; status: ${await page.locator(".dm-log-status").textContent()}`,
            );
          });
        // A figure to read, not a check (tests never assert on time).
        console.log(`import ${i + 1}: ${Math.round(performance.now() - started)} ms`);
      }
      expect(await summary.textContent()).toContain("place.lat: must be a finite number");
      await expect.poll(() => shownCount(page), { timeout: 30_000 }).toBe(10_001);
      const rendered = await page.locator(".dm-log-row").count();
      expect(rendered).toBeGreaterThan(0);
      expect(rendered).toBeLessThan(40);
      // Scroll to the end: the oldest entry is rendered there, still only a window of rows.
      await page.getByTestId("log-window").evaluate((el) => {
        el.scrollTop = el.scrollHeight;
      });
      await expect
        .poll(() => page.locator(".dm-log-rowbtn", { hasText: "bulk 0" }).count())
        .toBe(1);
      expect(await page.locator(".dm-log-row").count()).toBeLessThan(40);
      // Filter by text and by day.
      await page.getByLabel("Filter by text").fill("bulk 9999");
      await expect.poll(() => page.getByTestId("log-count").textContent()).toMatch(/^1 of 10001/);
      await page.getByLabel("Filter by text").fill("");
      await page.getByLabel("Day").fill("2024-01-02");
      await expect.poll(() => page.getByTestId("log-count").textContent()).toMatch(/^24 of 10001/);
    } finally {
      await b.close();
    }
  });

  it("has no axe-core violations in the log section (entry open, delete-all asked) and 44 px targets", async () => {
    const b = await launchBrowser({ profileDir: profile() });
    try {
      const { page } = b;
      await page.goto(app.url);
      await logDemo(page, "<img src=x onerror=alert(1)> checked as text");
      await page.locator(".dm-log-rowbtn").first().click();
      await expect.poll(() => page.getByTestId("log-detail").isVisible()).toBe(true);
      // The note is shown as text, not turned into an element.
      expect(await page.locator(".dm-log img").count()).toBe(0);
      expect(await page.getByTestId("log-detail").textContent()).toContain("<img src=x");
      await page.getByRole("button", { name: "Delete all entries…" }).click();
      for (const theme of ["day", "night"]) {
        if (theme === "night") await page.getByRole("button", { name: "Night theme" }).click();
        const result = await new AxeBuilder({ page }).include(".dm-log").analyze();
        expect(
          result.violations.map(
            (v) => `${theme} ${v.id}: ${v.nodes.map((n) => n.target).join(" | ")}`,
          ),
        ).toEqual([]);
      }
      // WCAG 2.2 SC 2.5.5 (AAA) target size 44 × 44 CSS px, the project's rule for every control.
      const small = await page
        .locator(".dm-log button, .dm-log input:not(.dm-visually-hidden), .dm-log .button-link")
        .evaluateAll((els) =>
          els
            .map((el) => ({ el, r: el.getBoundingClientRect() }))
            .filter(({ r }) => r.width > 0 && (r.width < 44 || r.height < 44))
            .map(
              ({ el, r }) =>
                `${el.textContent || el.id}: ${Math.round(r.width)}×${Math.round(r.height)}`,
            ),
        );
      expect(small).toEqual([]);
    } finally {
      await b.close();
    }
  });
});
