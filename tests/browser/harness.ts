// Shared helpers for the browser tests: serve the built app and drive Debian's chromium.
// API used by every browser test file — keep these signatures stable.
import { existsSync, mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { type BrowserContext, chromium, type Page } from "playwright-core";
import { startServer } from "../../scripts/serve.mjs";

const REPO = resolve(dirname(fileURLToPath(import.meta.url)), "..", "..");
const DIST = join(REPO, "dist");

/** Where browser tests write files for people to look at (screenshots); ignored by git. Created
 * when this module loads, so `join(OUTPUT_DIR, "x.png")` can be written straight away. */
export const OUTPUT_DIR = join(REPO, "tests", "output");
mkdirSync(OUTPUT_DIR, { recursive: true });

/** Creates OUTPUT_DIR if needed (e.g. after a clean) and returns it. */
export function ensureOutputDir(): string {
  mkdirSync(OUTPUT_DIR, { recursive: true });
  return OUTPUT_DIR;
}

/** Flags from the project brief: no sandbox in containers, no GPU, no background traffic. */
export const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--no-first-run",
];

/**
 * For map tests: WebGL drawn in software by SwiftShader instead of `--disable-gpu` (which leaves
 * chromium without WebGL, so the app shows its plain drawing instead of the map).
 */
export const WEBGL_ARGS = [
  ...CHROMIUM_ARGS.filter((a) => a !== "--disable-gpu"),
  "--use-angle=swiftshader",
  "--enable-unsafe-swiftshader",
  "--ignore-gpu-blocklist",
];

export const CHROMIUM_PATH = "/usr/bin/chromium";

/**
 * Serves dist/ on 127.0.0.1 at a free port. `requests` collects every request path the server
 * receives (e.g. "/", "/assets/index-abc.js"), in arrival order; clear it with
 * `requests.length = 0` to watch a later phase.
 */
export async function startApp(): Promise<{
  url: string;
  requests: string[];
  close(): Promise<void>;
}> {
  if (!existsSync(join(DIST, "index.html")) || !existsSync(join(DIST, "sw.js"))) {
    throw new Error(`dist/ is missing or incomplete (${DIST}): run npm run build first`);
  }
  const requests: string[] = [];
  const server = await startServer({
    port: 0,
    root: DIST,
    onRequest: (path) => requests.push(path),
  });
  return { url: server.url, requests, close: () => server.close() };
}

/**
 * Launches headless chromium with a persistent profile (needed for installability checks and a
 * realistic service worker). profileDir defaults to a fresh temporary folder, removed on close.
 */
export async function launchBrowser(opts?: {
  profileDir?: string;
  viewport?: { width: number; height: number };
  colorScheme?: "light" | "dark";
  /** WebGL through SwiftShader (WEBGL_ARGS), for tests that draw the map. */
  webgl?: boolean;
}): Promise<{ context: BrowserContext; page: Page; close(): Promise<void> }> {
  if (!existsSync(CHROMIUM_PATH)) {
    throw new Error(`chromium not found at ${CHROMIUM_PATH} (Debian package "chromium")`);
  }
  const ownDir = opts?.profileDir === undefined;
  const dir = opts?.profileDir ?? mkdtempSync(join(tmpdir(), "driftmark-profile-"));
  const context = await chromium.launchPersistentContext(dir, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: opts?.webgl ? WEBGL_ARGS : CHROMIUM_ARGS,
    viewport: opts?.viewport ?? { width: 360, height: 640 },
    colorScheme: opts?.colorScheme ?? "light",
    serviceWorkers: "allow",
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      if (ownDir) rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Resolves once the page is controlled by the service worker (so an offline reload works). */
export async function waitForController(page: Page): Promise<void> {
  await page.evaluate(async () => {
    const sw = navigator.serviceWorker;
    await sw.ready;
    if (!sw.controller) {
      await new Promise((done) => sw.addEventListener("controllerchange", done, { once: true }));
    }
  });
}
