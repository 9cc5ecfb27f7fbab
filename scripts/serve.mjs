// A small static server for the built app (dist/), on 127.0.0.1 only. No packages.
// Run: node scripts/serve.mjs   (PORT=8080 node scripts/serve.mjs for another port)
// Tests import startServer() to run it in-process and record every request path.
import { createReadStream } from "node:fs";
import { stat } from "node:fs/promises";
import { createServer } from "node:http";
import { extname, join, normalize, resolve, sep } from "node:path";
import { fileURLToPath } from "node:url";

const DEFAULT_ROOT = resolve(fileURLToPath(new URL("../dist", import.meta.url)));
const DEFAULT_PORT = 4173;
const HOST = "127.0.0.1";

const MIME = {
  ".html": "text/html; charset=utf-8",
  ".js": "text/javascript; charset=utf-8",
  ".mjs": "text/javascript; charset=utf-8",
  ".css": "text/css; charset=utf-8",
  ".json": "application/json; charset=utf-8",
  ".webmanifest": "application/manifest+json; charset=utf-8",
  ".png": "image/png",
  ".svg": "image/svg+xml",
  ".ico": "image/x-icon",
  ".txt": "text/plain; charset=utf-8",
  ".woff2": "font/woff2",
  ".map": "application/json; charset=utf-8",
};

/** Files that must be revalidated on every load so a new version is noticed. */
const NO_CACHE = new Set(["/sw.js", "/index.html"]);

/** The file under root for a URL path, or null when the path escapes root. */
function fileFor(root, urlPath) {
  let decoded;
  try {
    decoded = decodeURIComponent(urlPath);
  } catch {
    return null;
  }
  const file = normalize(join(root, decoded));
  if (file !== root && !file.startsWith(root + sep)) return null;
  return file;
}

async function isFile(path) {
  try {
    return (await stat(path)).isFile();
  } catch {
    return false;
  }
}

/**
 * Starts the server. Resolves once it listens.
 * @param {{ port?: number, root?: string, host?: string, onRequest?: (path: string) => void }} [opts]
 *   port 0 picks a free port; onRequest receives each request's path (with query) as it arrives.
 * @returns {Promise<{ url: string, port: number, close(): Promise<void> }>}
 */
export function startServer(opts = {}) {
  const root = resolve(opts.root ?? DEFAULT_ROOT);
  const host = opts.host ?? HOST;
  const server = createServer(async (req, res) => {
    const raw = req.url ?? "/";
    opts.onRequest?.(raw);
    if (req.method !== "GET" && req.method !== "HEAD") {
      res.writeHead(405, { Allow: "GET, HEAD" }).end();
      return;
    }
    const urlPath = new URL(raw, "http://localhost").pathname;
    let file = fileFor(root, urlPath.endsWith("/") ? `${urlPath}index.html` : urlPath);
    if (file === null) {
      res.writeHead(400).end("Bad path");
      return;
    }
    let servedPath = urlPath.endsWith("/") ? `${urlPath}index.html` : urlPath;
    if (!(await isFile(file))) {
      // Single-page app: unknown paths without a file extension get index.html; missing files 404.
      if (extname(urlPath) !== "") {
        res.writeHead(404, { "Content-Type": "text/plain; charset=utf-8" }).end("Not found");
        return;
      }
      file = join(root, "index.html");
      servedPath = "/index.html";
    }
    const headers = {
      "Content-Type": MIME[extname(file).toLowerCase()] ?? "application/octet-stream",
      "Cache-Control": NO_CACHE.has(servedPath) ? "no-cache" : "public, max-age=0, must-revalidate",
      "X-Content-Type-Options": "nosniff",
    };
    res.writeHead(200, headers);
    if (req.method === "HEAD") {
      res.end();
      return;
    }
    createReadStream(file)
      .on("error", () => res.destroy())
      .pipe(res);
  });
  return new Promise((resolvePromise, reject) => {
    server.once("error", reject);
    server.listen(opts.port ?? DEFAULT_PORT, host, () => {
      const address = server.address();
      const port = typeof address === "object" && address ? address.port : (opts.port ?? 0);
      resolvePromise({
        url: `http://${host}:${port}/`,
        port,
        close: () =>
          new Promise((done) => {
            server.closeAllConnections?.();
            server.close(() => done());
          }),
      });
    });
  });
}

const isMain = process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (isMain) {
  const port = Number(process.env.PORT ?? DEFAULT_PORT);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    console.error(
      `PORT must be an integer from 0 to 65535; got ${JSON.stringify(process.env.PORT)}`,
    );
    process.exit(1);
  }
  const { url } = await startServer({ port });
  console.log(`Driftmark running at ${url}`);
}
