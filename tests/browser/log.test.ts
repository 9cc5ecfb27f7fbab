// The estimate log in Debian's chromium against the built app: entries survive a reload, going
// offline and back, a service-worker update, and closing the browser right after a write.
// Run: npm run build && npx vitest run -c vitest.browser.config.ts tests/browser/log.test.ts
import { appendFileSync, cpSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startServer } from "../../scripts/serve.mjs";
import { launchBrowser, startApp } from "./harness.ts";

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

async function waitForController(page: Page): Promise<void> {
  await page.evaluate(async () => {
    const sw = navigator.serviceWorker;
    await sw.ready;
    if (!sw.controller) {
      await new Promise((done) => sw.addEventListener("controllerchange", done, { once: true }));
    }
  });
}

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
});
