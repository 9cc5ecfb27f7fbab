// The installable, offline shell, checked in Debian's chromium against the built app.
// Run: npm run build && npx vitest run -c vitest.browser.config.ts tests/browser/shell.test.ts
import { appendFileSync, cpSync, mkdtempSync, readdirSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, relative, sep } from "node:path";
import type { Request } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startServer } from "../../scripts/serve.mjs";
import { CAUTION } from "../../src/core/caution.ts";
import { launchBrowser, startApp } from "./harness.ts";

type App = Awaited<ReturnType<typeof startApp>>;
type Browser = Awaited<ReturnType<typeof launchBrowser>>;

let app: App;
let browser: Browser;
/** Every request the browser made (pages and service worker), as full URLs. */
const browserRequests: string[] = [];

declare global {
  interface Window {
    __cspViolations?: string[];
    __sameDocument?: boolean;
  }
}

beforeAll(async () => {
  app = await startApp();
  browser = await launchBrowser();
  browser.context.on("request", (req: Request) => browserRequests.push(req.url()));
  // Record Content-Security-Policy violations from the very start of each document.
  await browser.context.addInitScript(() => {
    window.__cspViolations = [];
    document.addEventListener("securitypolicyviolation", (e) => {
      window.__cspViolations?.push(`${e.violatedDirective} ${e.blockedURI}`);
    });
  });
});

afterAll(async () => {
  await browser?.close();
  await app?.close();
});

/** Waits until a service worker controls the page; returns its script URL (or null). */
async function waitForController(page: Browser["page"]): Promise<string | null> {
  return page.evaluate(async () => {
    const sw = navigator.serviceWorker;
    await sw.ready;
    if (!sw.controller) {
      await new Promise((done) => sw.addEventListener("controllerchange", done, { once: true }));
    }
    return sw.controller?.scriptURL ?? null;
  });
}

/** Paths of every file in dist/ except the service worker itself, as "icons/icon-192.png". */
const DIST = join(import.meta.dirname, "..", "..", "dist");

function builtFiles(): string[] {
  const root = DIST;
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const full = join(dir, name);
      if (statSync(full).isDirectory()) walk(full);
      else out.push(relative(root, full).split(sep).join("/"));
    }
  };
  walk(root);
  return out.filter((p) => p !== "sw.js").sort();
}

/** Width and height from a PNG's IHDR chunk (W3C PNG 2nd ed., 2003, §5.2 signature, §11.2.2 IHDR). */
function pngSize(bytes: Uint8Array): { width: number; height: number } {
  const signature = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  expect([...bytes.subarray(0, 8)]).toEqual(signature);
  // The first chunk must be IHDR: length (4) + type "IHDR" (4), then width and height (4 each).
  expect(new TextDecoder().decode(bytes.subarray(12, 16))).toBe("IHDR");
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  return { width: view.getUint32(16), height: view.getUint32(20) };
}

describe("offline shell", () => {
  it("is controlled by its service worker after the first load and reloads offline from it", async ({
    annotate,
  }) => {
    const { page, context } = browser;
    await page.goto(app.url);
    // clients.claim() on activate: the first visit becomes controlled without a second load.
    const controller = await waitForController(page);
    expect(controller).toBe(`${app.url}sw.js`);
    await expect
      .poll(() => page.getByText("Ready to work offline").isVisible(), { timeout: 15_000 })
      .toBe(true);

    // Workbox precache holds every built file (html, js, css, icons, manifest).
    const cached = await page.evaluate(async () => {
      const urls: string[] = [];
      for (const name of await caches.keys()) {
        for (const req of await (await caches.open(name)).keys()) {
          const u = new URL(req.url);
          u.searchParams.delete("__WB_REVISION__");
          urls.push(u.pathname.slice(1));
        }
      }
      return urls.sort();
    });
    expect(cached).toEqual(builtFiles());

    // The honest offline test (stack.md): cut the network, reload, see who answered.
    app.requests.length = 0;
    await context.setOffline(true);
    try {
      const response = await page.reload();
      expect(response?.fromServiceWorker()).toBe(true);
      await expect
        .poll(() => page.getByText(CAUTION).filter({ visible: true }).first().isVisible())
        .toBe(true);

      // A new estimate offline.
      const rate = page.getByLabel("Release rate", { exact: true });
      expect(await rate.count(), 'one field labelled "Release rate"').toBe(1);
      const reach = page.getByTestId("band-reach-0");
      await expect.poll(async () => (await reach.textContent()) ?? "").not.toBe("");
      const before = await reach.textContent();
      const current = Number((await rate.inputValue()) || "1");
      await rate.fill(String((Number.isFinite(current) && current > 0 ? current : 1) * 4));
      await expect.poll(() => reach.textContent(), { timeout: 10_000 }).not.toBe(before);
      const note = `offline estimate checked: band-reach-0 "${before}" -> "${await reach.textContent()}"`;
      console.info(`shell.test: ${note}`);
      await annotate(note, "checked");
      expect(app.requests).toEqual([]);
    } finally {
      await context.setOffline(false);
    }
  });
});

describe("installable", () => {
  it("has no installability errors (CDP Page.getInstallabilityErrors, persistent context)", async () => {
    const { page, context } = browser;
    await page.goto(app.url);
    await waitForController(page);
    const cdp = await context.newCDPSession(page);
    try {
      const { installabilityErrors } = await cdp.send("Page.getInstallabilityErrors");
      expect(installabilityErrors).toEqual([]);
    } finally {
      await cdp.detach();
    }
  });

  it("serves a manifest with the fields and icon sizes it claims", async () => {
    const res = await fetch(`${app.url}manifest.webmanifest`);
    expect(res.status).toBe(200);
    // Media type registered for web app manifests (W3C Web Application Manifest, §"Media type registration").
    expect(res.headers.get("content-type")).toMatch(/^application\/manifest\+json/);
    const manifest = (await res.json()) as Record<string, unknown>;
    // Members from the W3C Web Application Manifest (name, short_name, start_url, scope, display,
    // theme_color, background_color, icons); installability in Chromium needs name or short_name,
    // start_url, display standalone, and 192 px and 512 px icons (web.dev, "Add a web app
    // manifest", 2018–2023; Chromium InstallableManager).
    expect(manifest.name).toBe("Driftmark");
    expect(typeof manifest.short_name).toBe("string");
    expect((manifest.short_name as string).length).toBeGreaterThan(0);
    expect(typeof manifest.description).toBe("string");
    expect(manifest.start_url).toBe(".");
    expect(typeof manifest.scope).toBe("string");
    expect(manifest.display).toBe("standalone");
    expect(manifest.theme_color).toMatch(/^#[0-9a-f]{6}$/i);
    expect(manifest.background_color).toMatch(/^#[0-9a-f]{6}$/i);

    const icons = manifest.icons as Array<{
      src: string;
      sizes: string;
      type: string;
      purpose?: string;
    }>;
    const purposes = (i: { purpose?: string }) => (i.purpose ?? "any").split(/\s+/);
    const has = (size: string, purpose: string) =>
      icons.some((i) => i.sizes.split(/\s+/).includes(size) && purposes(i).includes(purpose));
    expect(has("192x192", "any")).toBe(true);
    expect(has("512x512", "any")).toBe(true);
    expect(has("512x512", "maskable")).toBe(true);

    for (const icon of icons) {
      expect(icon.type).toBe("image/png");
      const img = await fetch(new URL(icon.src, `${app.url}manifest.webmanifest`));
      expect(img.status, icon.src).toBe(200);
      expect(img.headers.get("content-type"), icon.src).toBe("image/png");
      const { width, height } = pngSize(new Uint8Array(await img.arrayBuffer()));
      expect(`${width}x${height}`, icon.src).toBe(icon.sizes);
    }

    // The page's theme-color matches the manifest's (one colour for the browser chrome).
    const html = await (await fetch(app.url)).text();
    const themeMeta = /<meta name="theme-color" content="([^"]+)"/.exec(html);
    expect(themeMeta?.[1]?.toLowerCase()).toBe((manifest.theme_color as string).toLowerCase());
  });
});

describe("no request leaves the device", () => {
  it("declares a Content-Security-Policy with default-src 'self' and nothing from elsewhere", async () => {
    const { page } = browser;
    await page.goto(app.url);
    const csp = await page
      .locator('meta[http-equiv="Content-Security-Policy"]')
      .getAttribute("content");
    expect(csp).not.toBeNull();
    // Directive syntax: "name value value; name value" (W3C Content Security Policy Level 3, §2.2).
    const directives = new Map(
      (csp ?? "")
        .split(";")
        .map((d) => d.trim().split(/\s+/))
        .filter((parts) => parts[0])
        .map((parts) => [parts[0] as string, parts.slice(1)]),
    );
    expect(directives.get("default-src")).toEqual(["'self'"]);
    const allowed = new Set(["'self'", "'none'", "data:", "blob:"]);
    for (const [name, sources] of directives) {
      for (const source of sources) expect(allowed.has(source), `${name} ${source}`).toBe(true);
    }
    // The built page runs under that policy without a single violation.
    expect(await page.evaluate(() => window.__cspViolations ?? ["no recorder"])).toEqual([]);
  });

  it("makes requests only to the app's own origin", async () => {
    const { page } = browser;
    await page.goto(app.url);
    await page.waitForLoadState("networkidle");
    const origin = new URL(app.url).origin;
    expect(browserRequests.length).toBeGreaterThan(0);
    const elsewhere = browserRequests.filter((u) => !u.startsWith(`${origin}/`));
    expect(elsewhere).toEqual([]);
  });
});

describe("update", () => {
  it("offers a waiting new version and switches only when the user taps reload", async () => {
    // A copy of dist/ whose sw.js we change, as a new deployment would.
    const root = mkdtempSync(join(tmpdir(), "driftmark-dist-"));
    cpSync(DIST, root, { recursive: true });
    const server = await startServer({ port: 0, root });
    const own = await launchBrowser();
    try {
      const { page } = own;
      await page.goto(server.url);
      await waitForController(page);
      await expect.poll(() => page.getByText("Ready to work offline").isVisible()).toBe(true);
      const button = page.getByRole("button", { name: "Update available — reload" });
      expect(await button.count()).toBe(0);

      appendFileSync(join(root, "sw.js"), "\n// next version\n");
      await page.evaluate(() => {
        window.__sameDocument = true;
      });
      await page.evaluate(async () => {
        await (await navigator.serviceWorker.getRegistration())?.update();
      });
      // Not while the user is typing: keep typing (one key press per round trip, far closer
      // together than the quiet time) until the new version waits, and 10 presses more; the
      // offer stays back all the while, then comes once typing stops. Between presses the test
      // waits for the waiting state itself (up to 150 ms), never for a fixed time.
      const wind = page.getByLabel("Wind swing", { exact: true });
      const waitingNow = async () =>
        (await navigator.serviceWorker.getRegistration())?.waiting != null;
      let waited = false;
      let pressesAfter = 0;
      const giveUp = Date.now() + 30_000;
      while (pressesAfter < 10 && (waited || Date.now() < giveUp)) {
        await wind.press("End");
        expect(await button.count(), "update offered while typing").toBe(0);
        if (waited) pressesAfter++;
        else
          waited = await page.waitForFunction(waitingNow, null, { timeout: 150, polling: 50 }).then(
            () => true,
            () => false,
          );
      }
      expect(waited, "the new version was waiting while typing went on").toBe(true);
      await expect.poll(() => button.isVisible(), { timeout: 15_000 }).toBe(true);
      // Never forced: the new version waits and the page has not reloaded.
      const waiting = await page.evaluate(async () => {
        const reg = await navigator.serviceWorker.getRegistration();
        return { waiting: reg?.waiting != null, same: window.__sameDocument === true };
      });
      expect(waiting).toEqual({ waiting: true, same: true });

      await Promise.all([page.waitForEvent("load"), button.click()]);
      await expect.poll(() => page.evaluate(() => window.__sameDocument ?? false)).toBe(false);
      const after = await page.evaluate(async () => {
        const reg = await navigator.serviceWorker.getRegistration();
        return {
          waiting: reg?.waiting != null,
          controlled: navigator.serviceWorker.controller != null,
        };
      });
      expect(after).toEqual({ waiting: false, controlled: true });
      expect(await button.count()).toBe(0);
    } finally {
      await own.close();
      await server.close();
      rmSync(root, { recursive: true, force: true });
    }
  });
});
