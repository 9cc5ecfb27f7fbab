// Reads the pixels of a PNG screenshot (8-bit RGB or RGBA, not interlaced: what chromium writes),
// with node:zlib only (PNG specification, W3C 2003, §9 filters, §11 chunks).
import { inflateSync } from "node:zlib";

export interface Pixels {
  width: number;
  height: number;
  /** RGBA, row by row. */
  data: Uint8Array;
  at(x: number, y: number): [number, number, number];
}

export function decodePng(png: Uint8Array): Pixels {
  const dv = new DataView(png.buffer, png.byteOffset, png.byteLength);
  let pos = 8;
  let width = 0;
  let height = 0;
  let channels = 0;
  const idat: Uint8Array[] = [];
  while (pos < png.length) {
    const len = dv.getUint32(pos);
    const type = String.fromCharCode(...png.subarray(pos + 4, pos + 8));
    const body = png.subarray(pos + 8, pos + 8 + len);
    if (type === "IHDR") {
      width = dv.getUint32(pos + 8);
      height = dv.getUint32(pos + 12);
      const depth = body[8];
      const colour = body[9];
      const interlace = body[12];
      if (depth !== 8 || interlace !== 0 || (colour !== 2 && colour !== 6)) {
        throw new Error(`decodePng: unsupported PNG (depth ${depth}, colour ${colour})`);
      }
      channels = colour === 6 ? 4 : 3;
    } else if (type === "IDAT") idat.push(body);
    else if (type === "IEND") break;
    pos += 12 + len;
  }
  const raw = inflateSync(Buffer.concat(idat));
  const stride = width * channels;
  const out = new Uint8Array(width * height * 4);
  const prev = new Uint8Array(stride);
  const cur = new Uint8Array(stride);
  for (let y = 0; y < height; y++) {
    const filter = raw[y * (stride + 1)];
    const line = raw.subarray(y * (stride + 1) + 1, (y + 1) * (stride + 1));
    for (let i = 0; i < stride; i++) {
      const a = i >= channels ? (cur[i - channels] as number) : 0;
      const b = prev[i] as number;
      const c = i >= channels ? (prev[i - channels] as number) : 0;
      let v = line[i] as number;
      if (filter === 1) v += a;
      else if (filter === 2) v += b;
      else if (filter === 3) v += (a + b) >> 1;
      else if (filter === 4) {
        const p = a + b - c;
        const pa = Math.abs(p - a);
        const pb = Math.abs(p - b);
        const pc = Math.abs(p - c);
        v += pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
      }
      cur[i] = v & 255;
    }
    for (let x = 0; x < width; x++) {
      for (let k = 0; k < 4; k++) {
        out[(y * width + x) * 4 + k] = k < channels ? (cur[x * channels + k] as number) : 255;
      }
    }
    prev.set(cur);
  }
  return {
    width,
    height,
    data: out,
    at(x, y) {
      const i = (Math.round(y) * width + Math.round(x)) * 4;
      return [out[i] as number, out[i + 1] as number, out[i + 2] as number];
    },
  };
}

/** "#rrggbb" → [r, g, b]. */
export function hexRgb(hex: string): [number, number, number] {
  const n = Number.parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

/** Largest channel difference between two colours. */
export function colourDistance(a: readonly number[], b: readonly number[]): number {
  return Math.max(...a.slice(0, 3).map((v, i) => Math.abs(v - (b[i] as number))));
}

/** How many pixels are within `tolerance` (per channel) of a colour. */
export function countNear(p: Pixels, rgb: readonly number[], tolerance: number): number {
  let n = 0;
  for (let i = 0; i < p.data.length; i += 4) {
    if (colourDistance([p.data[i], p.data[i + 1], p.data[i + 2]] as number[], rgb) <= tolerance)
      n++;
  }
  return n;
}
