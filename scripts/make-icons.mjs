// Draws Driftmark's app icons (a dark disc with three curved drift lines leaving a source dot)
// and writes them as PNG files using node:zlib alone. Run: node scripts/make-icons.mjs
// Output (committed): public/icons/icon-192.png, icon-512.png, icon-maskable-512.png.
import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { crc32, deflateSync } from "node:zlib";

const OUT_DIR = join(dirname(fileURLToPath(import.meta.url)), "..", "public", "icons");

/** Colours as [r, g, b] (0–255). Disc: the manifest's theme colour; lines: pale cividis yellow. */
const DISC = [16, 32, 44];
const LINE = [253, 231, 140];
const SOURCE = [255, 255, 255];

/**
 * Drift lines in unit coordinates (the disc is centred at 0,0 with radius 1): each is the graph
 * y = y0 + k * (x - x0) + amp * sin(freq * (x - x0)) for x in [x0, x1], stroked with half-width
 * hw. The three lines fan out downwind from the source dot, like a widening plume.
 */
const LINES = [
  { x0: -0.42, x1: 0.58, y0: -0.07, k: -0.38, amp: 0.06, freq: 4.5, hw: 0.05 },
  { x0: -0.42, x1: 0.72, y0: 0.0, k: 0.0, amp: 0.06, freq: 4.5, hw: 0.05 },
  { x0: -0.42, x1: 0.58, y0: 0.07, k: 0.38, amp: 0.06, freq: 4.5, hw: 0.05 },
];
const SOURCE_DOT = { x: -0.55, y: 0, r: 0.13 };

/** Distance from (x, y) to a drift line (vertical distance scaled by the slope; round caps). */
function lineDistance(line, x, y) {
  const cx = Math.min(Math.max(x, line.x0), line.x1);
  const t = cx - line.x0;
  const fy = line.y0 + line.k * t + line.amp * Math.sin(line.freq * t);
  const slope = line.k + line.amp * line.freq * Math.cos(line.freq * t);
  if (cx !== x) return Math.hypot(x - cx, y - fy);
  return Math.abs(y - fy) / Math.sqrt(1 + slope * slope);
}

/** Colour and coverage of one sample point, or null outside the design. */
function sample(x, y, discRadius) {
  for (const line of LINES) {
    if (lineDistance(line, x / discRadius, y / discRadius) <= line.hw) return LINE;
  }
  if (Math.hypot(x / discRadius - SOURCE_DOT.x, y / discRadius - SOURCE_DOT.y) <= SOURCE_DOT.r) {
    return SOURCE;
  }
  if (Math.hypot(x, y) <= discRadius) return DISC;
  return null;
}

/**
 * Renders an RGBA image of size×size pixels with 4×4 supersampling.
 * discRadius is in unit coordinates where the image spans -1..1; fullBleed paints the
 * background in the disc colour (maskable icons must have no transparent corners).
 */
function render(size, { discRadius, fullBleed }) {
  const rgba = Buffer.alloc(size * size * 4);
  const n = 4;
  for (let py = 0; py < size; py++) {
    for (let px = 0; px < size; px++) {
      let r = 0;
      let g = 0;
      let b = 0;
      let a = 0;
      for (let sy = 0; sy < n; sy++) {
        for (let sx = 0; sx < n; sx++) {
          const x = ((px + (sx + 0.5) / n) / size) * 2 - 1;
          const y = ((py + (sy + 0.5) / n) / size) * 2 - 1;
          const c = sample(x, y, discRadius) ?? (fullBleed ? DISC : null);
          if (c) {
            r += c[0];
            g += c[1];
            b += c[2];
            a += 1;
          }
        }
      }
      const i = (py * size + px) * 4;
      // Colour averaged over covered samples (straight alpha), coverage as alpha.
      rgba[i] = a ? Math.round(r / a) : 0;
      rgba[i + 1] = a ? Math.round(g / a) : 0;
      rgba[i + 2] = a ? Math.round(b / a) : 0;
      rgba[i + 3] = Math.round((a / (n * n)) * 255);
    }
  }
  return rgba;
}

function chunk(type, data) {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, "ascii"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}

/** Encodes RGBA pixels as a PNG (8-bit truecolour with alpha, filter 0 on every row). */
function encodePng(size, rgba) {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(size, 0);
  ihdr.writeUInt32BE(size, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 6; // colour type: RGBA
  ihdr[10] = 0; // compression
  ihdr[11] = 0; // filter method
  ihdr[12] = 0; // no interlace
  const raw = Buffer.alloc(size * (size * 4 + 1));
  for (let y = 0; y < size; y++) {
    raw[y * (size * 4 + 1)] = 0;
    rgba.copy(raw, y * (size * 4 + 1) + 1, y * size * 4, (y + 1) * size * 4);
  }
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([
    signature,
    chunk("IHDR", ihdr),
    chunk("IDAT", deflateSync(raw, { level: 9 })),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}

const ICONS = [
  { file: "icon-192.png", size: 192, discRadius: 0.96, fullBleed: false },
  { file: "icon-512.png", size: 512, discRadius: 0.96, fullBleed: false },
  // Maskable: the whole design inside the central 80 % safe zone (radius 0.8 of the half-size).
  { file: "icon-maskable-512.png", size: 512, discRadius: 0.78, fullBleed: true },
];

mkdirSync(OUT_DIR, { recursive: true });
for (const icon of ICONS) {
  const png = encodePng(icon.size, render(icon.size, icon));
  writeFileSync(join(OUT_DIR, icon.file), png);
  console.log(`${icon.file}: ${icon.size}×${icon.size}, ${png.length} bytes`);
}
