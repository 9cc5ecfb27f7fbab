/**
 * Which source files make up a built chunk: decodes the chunk's source map (Source Map
 * Revision 3: base64 VLQ "mappings") and attributes every generated character to the source of
 * the segment it falls in. Raw minified bytes, not gzip: a guide to what to trim.
 *
 * Usage: tsx bench/sources.ts <chunk.js> (needs <chunk.js>.map, e.g. from
 * `npx vite build --outDir /tmp/x --emptyOutDir --sourcemap`).
 */
import { readFileSync } from "node:fs";

const B64 = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/";

function decodeVlq(s: string): number[] {
  const out: number[] = [];
  let value = 0;
  let shift = 0;
  for (const ch of s) {
    const d = B64.indexOf(ch);
    value += (d & 31) << shift;
    if (d & 32) shift += 5;
    else {
      out.push(value & 1 ? -(value >>> 1) : value >>> 1);
      value = 0;
      shift = 0;
    }
  }
  return out;
}

/** Bytes of generated code per source file. */
export function bytesBySource(code: string, map: { sources: string[]; mappings: string }) {
  const lines = code.split("\n");
  const bytes = new Map<string, number>();
  let src = 0;
  map.mappings.split(";").forEach((line, li) => {
    const text = lines[li] ?? "";
    let col = 0;
    const segs: [number, number | null][] = [];
    for (const seg of line.split(",")) {
      if (!seg) continue;
      const v = decodeVlq(seg);
      col += v[0] as number;
      if (v.length >= 4) {
        src += v[1] as number;
        segs.push([col, src]);
      } else segs.push([col, null]);
    }
    segs.forEach(([c, s], i) => {
      const end = i + 1 < segs.length ? (segs[i + 1] as [number, number | null])[0] : text.length;
      const name = s === null ? "(unmapped)" : (map.sources[s] ?? "?");
      bytes.set(name, (bytes.get(name) ?? 0) + (end - c));
    });
  });
  return [...bytes.entries()].sort((a, b) => b[1] - a[1]);
}

if (process.argv[1]?.endsWith("sources.ts")) {
  const file = process.argv[2];
  if (!file) throw new Error("usage: tsx bench/sources.ts <chunk.js>");
  const code = readFileSync(file, "utf8");
  const map = JSON.parse(readFileSync(`${file}.map`, "utf8"));
  const rows = bytesBySource(code, map);
  const total = rows.reduce((a, [, n]) => a + n, 0);
  for (const [name, n] of rows.slice(0, 40)) {
    console.log(
      `${(n / 1000).toFixed(1).padStart(7)} kB ${((100 * n) / total).toFixed(1).padStart(5)}%  ${name}`,
    );
  }
  console.log(`${(total / 1000).toFixed(1).padStart(7)} kB total`);
}
