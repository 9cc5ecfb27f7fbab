// A small PMTiles v3 writer, after the published specification
// (protomaps/PMTiles, spec/v3/spec.md): a 127-byte header, a root directory of entries sorted by
// Hilbert tile id (delta-coded varints: ids, run lengths, lengths, offsets), JSON metadata, then
// the tile data. Everything fits in the root directory (no leaf directories): enough for test
// fixtures, not meant for whole-planet builds.
import { gzipSync } from "node:zlib";
import { zxyToTileId } from "pmtiles";

export interface TileIn {
  z: number;
  x: number;
  y: number;
  /** The tile as stored (already compressed with `tileCompression`). */
  data: Uint8Array;
}

export interface WriteOptions {
  /** 1 = none, 2 = gzip (spec §3.2, Compression). Applies to the tiles as given. */
  tileCompression: 1 | 2;
  /** 1 = Mapbox Vector Tile (spec §3.2, TileType). */
  tileType: 1;
  /** [west, south, east, north] degrees. */
  bounds: [number, number, number, number];
  center: [number, number, number];
  metadata: Record<string, unknown>;
}

export const HEADER_BYTES = 127;
/** The root directory must lie within the first 16 KiB with the header (spec §2). */
const ROOT_LIMIT = 16_384 - HEADER_BYTES;

function varint(out: number[], v: number): void {
  if (!Number.isSafeInteger(v) || v < 0)
    throw new Error(`varint: not a safe unsigned integer: ${v}`);
  let n = v;
  while (n >= 0x80) {
    out.push((n % 0x80) | 0x80);
    n = Math.floor(n / 0x80);
  }
  out.push(n);
}

interface Entry {
  tileId: number;
  offset: number;
  length: number;
  runLength: number;
}

/** Directory bytes (uncompressed), spec §4. */
export function serializeDirectory(entries: readonly Entry[]): Uint8Array {
  const out: number[] = [];
  varint(out, entries.length);
  let last = 0;
  for (const e of entries) {
    varint(out, e.tileId - last);
    last = e.tileId;
  }
  for (const e of entries) varint(out, e.runLength);
  for (const e of entries) varint(out, e.length);
  entries.forEach((e, i) => {
    const prev = entries[i - 1];
    if (prev && e.offset === prev.offset + prev.length) varint(out, 0);
    else varint(out, e.offset + 1);
  });
  return Uint8Array.from(out);
}

/**
 * The whole archive. Identical tile contents are stored once (run-length for consecutive ids,
 * shared offsets otherwise); tiles are written in tile-id order (clustered).
 */
export function writePMTiles(
  tiles: readonly TileIn[],
  opts: WriteOptions,
): Uint8Array<ArrayBuffer> {
  if (tiles.length === 0) throw new Error("writePMTiles: no tiles");
  const sorted = tiles
    .map((t) => ({ ...t, tileId: zxyToTileId(t.z, t.x, t.y) }))
    .sort((a, b) => a.tileId - b.tileId);
  const entries: Entry[] = [];
  const chunks: Uint8Array[] = [];
  const seen = new Map<string, { offset: number; length: number }>();
  let dataLength = 0;
  let contents = 0;
  for (const t of sorted) {
    const key = Buffer.from(t.data).toString("base64");
    const last = entries[entries.length - 1];
    const known = seen.get(key);
    if (
      known &&
      last &&
      last.offset === known.offset &&
      last.tileId + last.runLength === t.tileId
    ) {
      last.runLength += 1;
      continue;
    }
    if (known) {
      entries.push({ tileId: t.tileId, offset: known.offset, length: known.length, runLength: 1 });
      continue;
    }
    const at = { offset: dataLength, length: t.data.length };
    seen.set(key, at);
    chunks.push(t.data);
    dataLength += t.data.length;
    contents += 1;
    entries.push({ tileId: t.tileId, ...at, runLength: 1 });
  }
  const root = gzipSync(serializeDirectory(entries));
  if (root.length > ROOT_LIMIT) throw new Error("writePMTiles: root directory over 16 KiB");
  const meta = gzipSync(Buffer.from(JSON.stringify(opts.metadata)));

  const rootOffset = HEADER_BYTES;
  const metaOffset = rootOffset + root.length;
  const leafOffset = metaOffset + meta.length;
  const dataOffset = leafOffset; // no leaf directories
  const total = dataOffset + dataLength;

  const out = new Uint8Array(total);
  const dv = new DataView(out.buffer);
  out.set(new TextEncoder().encode("PMTiles"), 0);
  out[7] = 3;
  const u64 = (at: number, v: number) => dv.setBigUint64(at, BigInt(v), true);
  u64(8, rootOffset);
  u64(16, root.length);
  u64(24, metaOffset);
  u64(32, meta.length);
  u64(40, leafOffset);
  u64(48, 0);
  u64(56, dataOffset);
  u64(64, dataLength);
  u64(72, sorted.length); // addressed tiles
  u64(80, entries.length); // tile entries
  u64(88, contents); // tile contents
  out[96] = 1; // clustered
  out[97] = 2; // internal compression: gzip
  out[98] = opts.tileCompression;
  out[99] = opts.tileType;
  const zooms = sorted.map((t) => t.z);
  out[100] = Math.min(...zooms);
  out[101] = Math.max(...zooms);
  const e7 = (v: number) => Math.round(v * 1e7);
  dv.setInt32(102, e7(opts.bounds[0]), true);
  dv.setInt32(106, e7(opts.bounds[1]), true);
  dv.setInt32(110, e7(opts.bounds[2]), true);
  dv.setInt32(114, e7(opts.bounds[3]), true);
  out[118] = opts.center[2];
  dv.setInt32(119, e7(opts.center[0]), true);
  dv.setInt32(123, e7(opts.center[1]), true);
  out.set(root, rootOffset);
  out.set(meta, metaOffset);
  let at = dataOffset;
  for (const c of chunks) {
    out.set(c, at);
    at += c.length;
  }
  return out;
}
