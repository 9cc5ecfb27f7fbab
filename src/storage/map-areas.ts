/**
 * Map areas: vector map extracts (`.pmtiles`, PMTiles v3) the user keeps on the device for offline
 * use. Each is kept whole as a Blob in its own small IndexedDB database (`driftmark-map-areas`,
 * apart from the log's), with its name, bounds, zooms and size, so that the file and what is known
 * about it are added and removed in one transaction. The map reads an area in ranges through
 * `BlobSource` (pmtiles' `Source` interface on `Blob.slice`): never the whole file in memory.
 *
 * Contract: `addMapArea` inspects the file first and throws `MapAreaError` (a plain message for the
 * user) when it is not a PMTiles v3 vector extract; nothing is written then, and nothing already
 * kept is touched. Transactions are short: the file is inspected before one is opened.
 */
import { type DBSchema, type IDBPDatabase, openDB } from "idb";
import { PMTiles, type RangeResponse, type Source, TileType } from "pmtiles";

export const MAP_AREAS_DB = "driftmark-map-areas";
const VERSION = 1;

/** What is shown about a kept map area (everything but the file). */
export interface MapAreaInfo {
  id: string;
  /** The extract's own name (its metadata `name`), else the file name without `.pmtiles`. */
  name: string;
  fileName: string;
  /** Size of the kept file (bytes). */
  bytes: number;
  /** [west, south, east, north] (degrees, WGS 84). */
  bounds: [number, number, number, number];
  minZoom: number;
  maxZoom: number;
  /** ISO 8601 time it was added. */
  addedAt: string;
}

export interface MapAreaRecord extends MapAreaInfo {
  file: Blob;
}

interface MapAreasSchema extends DBSchema {
  areas: { key: string; value: MapAreaRecord };
}

/** A file refused as a map area; `message` is for the user. */
export class MapAreaError extends Error {
  override name = "MapAreaError";
}

/** pmtiles `Source` over a Blob (a File, or a Blob read back from IndexedDB): reads ranges only. */
export class BlobSource implements Source {
  constructor(
    private readonly blob: Blob,
    private readonly key: string,
  ) {}
  getKey(): string {
    return this.key;
  }
  async getBytes(offset: number, length: number): Promise<RangeResponse> {
    const data = await this.blob.slice(offset, offset + length).arrayBuffer();
    return { data };
  }
}

const HEADER_BYTES = 127;

/** What `inspectMapArea` learns about a file. */
export type MapAreaFacts = Omit<MapAreaInfo, "id" | "addedAt">;

function plainName(fileName: string): string {
  return fileName.replace(/\.pmtiles$/i, "") || "Map area";
}

/**
 * Reads a file's header, metadata and root directory and says whether it can be a map area.
 * Throws `MapAreaError` with a plain message when it cannot.
 *
 * @param file the picked file
 * @param fileName its name (for the message and the default name)
 */
export async function inspectMapArea(file: Blob, fileName: string): Promise<MapAreaFacts> {
  const notMap = `"${fileName}" is not a map area file: pick a .pmtiles map extract (PMTiles version 3).`;
  if (file.size < HEADER_BYTES) throw new MapAreaError(notMap);
  const head = new Uint8Array(await file.slice(0, 8).arrayBuffer());
  if (new TextDecoder().decode(head.subarray(0, 7)) !== "PMTiles") throw new MapAreaError(notMap);
  if (head[7] !== 3) {
    throw new MapAreaError(
      `"${fileName}" is a PMTiles file of version ${head[7]}; Driftmark reads version 3. Convert it with the pmtiles tool (pmtiles convert).`,
    );
  }
  const pm = new PMTiles(new BlobSource(file, `inspect-${fileName}`));
  let name = plainName(fileName);
  try {
    const h = await pm.getHeader();
    if (h.tileType !== TileType.Mvt) {
      throw new MapAreaError(
        `"${fileName}" holds map pictures, not vector map data: pick a vector extract (Protomaps basemap).`,
      );
    }
    const bounds: [number, number, number, number] = [h.minLon, h.minLat, h.maxLon, h.maxLat];
    const sane =
      bounds.every(Number.isFinite) &&
      h.minLon >= -180 &&
      h.maxLon <= 180 &&
      h.minLat >= -90 &&
      h.maxLat <= 90 &&
      h.minLon < h.maxLon &&
      h.minLat < h.maxLat &&
      h.minZoom <= h.maxZoom;
    if (!sane)
      throw new MapAreaError(`"${fileName}" is damaged: its bounds or zooms make no sense.`);
    if (h.tileDataOffset + (h.tileDataLength ?? 0) > file.size) {
      throw new MapAreaError(`"${fileName}" is damaged or cut short: it ends before its map data.`);
    }
    const meta = (await pm.getMetadata()) as { name?: unknown } | null;
    if (meta && typeof meta.name === "string" && meta.name.trim()) name = meta.name.trim();
    // Read the root directory (and a tile through it) so a damaged directory is caught now.
    await pm.getZxy(h.minZoom, 0, 0);
    return {
      name,
      fileName,
      bytes: file.size,
      bounds,
      minZoom: h.minZoom,
      maxZoom: h.maxZoom,
    };
  } catch (e) {
    if (e instanceof MapAreaError) throw e;
    throw new MapAreaError(`"${fileName}" is damaged and cannot be read as a map area.`);
  }
}

let dbPromise: Promise<IDBPDatabase<MapAreasSchema>> | null = null;

function db(): Promise<IDBPDatabase<MapAreasSchema>> {
  dbPromise ??= openDB<MapAreasSchema>(MAP_AREAS_DB, VERSION, {
    upgrade(d, oldVersion) {
      if (oldVersion < 1) d.createObjectStore("areas", { keyPath: "id" });
    },
  });
  return dbPromise;
}

function info(r: MapAreaRecord): MapAreaInfo {
  const { file: _file, ...rest } = r;
  return rest;
}

/** Every kept map area, oldest first (without the files). */
export async function listMapAreas(): Promise<MapAreaInfo[]> {
  const all = await (await db()).getAll("areas");
  return all.map(info).sort((a, b) => a.addedAt.localeCompare(b.addedAt));
}

/**
 * Inspects and keeps a file as a map area. Throws `MapAreaError` (nothing written) when refused.
 * @param now time stamp for `addedAt`
 */
export async function addMapArea(file: File, now: Date): Promise<MapAreaInfo> {
  const facts = await inspectMapArea(file, file.name);
  const record: MapAreaRecord = {
    ...facts,
    id: crypto.randomUUID(),
    addedAt: now.toISOString(),
    file,
  };
  try {
    await (await db()).put("areas", record);
  } catch (e) {
    const quota = e instanceof DOMException && e.name === "QuotaExceededError";
    throw new MapAreaError(
      quota
        ? `No room on this device for "${file.name}" (${facts.bytes} bytes): remove a map area or pick a smaller extract.`
        : `"${file.name}" could not be kept on this device.`,
    );
  }
  // Ask the browser to keep the data under storage pressure (best effort).
  void globalThis.navigator?.storage?.persist?.().catch(() => false);
  return info(record);
}

/** Removes a kept map area and its file. */
export async function removeMapArea(id: string): Promise<void> {
  await (await db()).delete("areas", id);
}

/** The kept file of an area (a Blob backed by the browser's storage, read in slices). */
export async function mapAreaFile(id: string): Promise<Blob | null> {
  return (await (await db()).get("areas", id))?.file ?? null;
}

/**
 * The kept area to draw a place on: the most recently added one whose bounds hold it.
 * @param lat latitude (degrees), lon longitude (degrees)
 */
export function areaContaining(
  areas: readonly MapAreaInfo[],
  lat: number,
  lon: number,
): MapAreaInfo | null {
  for (let i = areas.length - 1; i >= 0; i--) {
    const a = areas[i] as MapAreaInfo;
    const [w, s, e, n] = a.bounds;
    if (lat >= s && lat <= n && lon >= w && lon <= e) return a;
  }
  return null;
}
