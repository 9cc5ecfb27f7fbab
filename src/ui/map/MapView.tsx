/**
 * The footprint on a map of a kept map area: MapLibre GL JS (WebGL) with the pmtiles protocol
 * reading the area from the device (src/storage/map-areas.ts, in slices). Loaded only when a kept
 * area holds the source, after the first estimate.
 *
 * Follows the footprint: fits it on each new estimate until the user pans or zooms, then leaves the
 * view alone until they tap Fit. North up, with a compass that turns it back.
 *
 * For tests (harmless, documented in DEVELOPERS.md): the map element carries the MapLibre instance
 * as `driftmarkMap`, and `data-drawn` counts the footprint versions the map has finished drawing.
 */
import {
  addProtocol,
  type GeoJSONSource,
  type LngLatBoundsLike,
  Map as MapLibreMap,
  NavigationControl,
  setWorkerUrl,
} from "maplibre-gl";
import "maplibre-gl/dist/maplibre-gl.css";
import type { FeatureCollection, Position } from "geojson";
import workerUrl from "maplibre-gl/dist/maplibre-gl-worker.mjs?url";
import { PMTiles, Protocol } from "pmtiles";
import { useEffect, useRef, useState } from "preact/hooks";
import { BlobSource } from "../../storage/map-areas.ts";
import { mapStyle } from "./basemap-style.ts";
import { FOOTPRINT_SOURCE } from "./footprint-layers.ts";

let protocol: Protocol | null = null;
/** Registers the pmtiles protocol and the worker once, and the area's file under its key. */
function register(key: string, file: Blob): void {
  if (!protocol) {
    // A module worker from the app's own origin: allowed by `worker-src 'self'` (no blob: URL).
    setWorkerUrl(workerUrl);
    protocol = new Protocol({ metadata: true });
    addProtocol("pmtiles", protocol.tile);
  }
  if (!protocol.tiles.has(key)) protocol.add(new PMTiles(new BlobSource(file, key)));
}

/** [west, south, east, north] of every position in the features (degrees). */
export function boundsOf(fc: FeatureCollection, kinds: readonly string[]): LngLatBoundsLike | null {
  let w = Number.POSITIVE_INFINITY;
  let s = Number.POSITIVE_INFINITY;
  let e = Number.NEGATIVE_INFINITY;
  let n = Number.NEGATIVE_INFINITY;
  const visit = (c: unknown): void => {
    if (Array.isArray(c) && typeof c[0] === "number") {
      const p = c as Position;
      w = Math.min(w, p[0] as number);
      e = Math.max(e, p[0] as number);
      s = Math.min(s, p[1] as number);
      n = Math.max(n, p[1] as number);
    } else if (Array.isArray(c)) for (const k of c) visit(k);
  };
  for (const f of fc.features) {
    if (kinds.includes(String(f.properties?.kind)) && "coordinates" in f.geometry) {
      visit(f.geometry.coordinates);
    }
  }
  return Number.isFinite(w) ? [w, s, e, n] : null;
}

const FIT_KINDS = ["band", "near-zone", "source", "place", "wind-arrow"];

export interface MapViewProps {
  areaKey: string;
  areaFile: Blob;
  /** The footprint source's data (mapOverlay: the shared GeoJSON plus map-only features). */
  data: FeatureCollection;
  /** Changes with each new estimate: the map fits again unless the user moved it. */
  estimateKey: unknown;
  night: boolean;
  summary: string;
  onPutSource?: (lat: number, lon: number) => void;
  onAddPlace?: (lat: number, lon: number) => void;
  onShowPosition?: () => void;
  /** The map could not start (no WebGL, or the area cannot be read): show the plain view. */
  onFail: (reason: string) => void;
}

export function MapView(props: MapViewProps) {
  const box = useRef<HTMLElement>(null);
  const map = useRef<MapLibreMap | null>(null);
  const following = useRef(true);
  const drawn = useRef(0);
  const [ready, setReady] = useState(false);
  const [isFollowing, setFollowing] = useState(true);
  const latest = useRef(props);
  latest.current = props;

  const fitFootprint = () => {
    const m = map.current;
    const b = boundsOf(latest.current.data, FIT_KINDS);
    if (!m || !b) return;
    m.fitBounds(b, { padding: 36, animate: false, maxZoom: 17, bearing: m.getBearing() });
  };

  // Start the map once per area.
  useEffect(() => {
    const el = box.current;
    if (!el) return;
    let m: MapLibreMap;
    try {
      register(props.areaKey, props.areaFile);
      const b = boundsOf(props.data, FIT_KINDS);
      m = new MapLibreMap({
        container: el,
        style: mapStyle(props.areaKey, props.night, props.data),
        ...(b ? { bounds: b, fitBoundsOptions: { padding: 36, maxZoom: 17 } } : {}),
        attributionControl: { compact: true },
        maxPitch: 0,
        pitchWithRotate: false,
        dragRotate: true,
        touchPitch: false,
        // Labels appear at once (no fade): the map is idle, and read, sooner after each estimate.
        fadeDuration: 0,
      });
    } catch (e) {
      props.onFail(e instanceof Error ? e.message : String(e));
      return;
    }
    map.current = m;
    (el as HTMLElement & { driftmarkMap?: MapLibreMap }).driftmarkMap = m;
    m.addControl(
      new NavigationControl({ showCompass: true, showZoom: true, visualizePitch: false }),
    );
    m.touchZoomRotate.enable();
    // The basemap style names icons (sprites) that a kept area does not bring: an empty image.
    // The basemap style names icons (sprites) that a kept area does not bring: an empty image.
    m.setMissingStyleImageResolver((id) => {
      if (!m.hasImage(id)) m.addImage(id, { width: 1, height: 1, data: new Uint8Array(4) });
    });
    m.on("movestart", (e: { originalEvent?: Event }) => {
      if (e.originalEvent) {
        following.current = false;
        setFollowing(false);
      }
    });
    m.on("idle", () => {
      el.dataset.drawn = String(drawn.current);
    });
    m.on("load", () => setReady(true));
    m.on("error", (e) => {
      // A WebGL context that cannot be made is fatal; tile errors are not.
      const message = (e as unknown as { error?: Error }).error?.message ?? "";
      if (/webgl/i.test(message)) latest.current.onFail(message);
    });
    return () => {
      // Let go of the area's file, so that removing the area frees its storage.
      protocol?.tiles.delete(props.areaKey);
      m.remove();
      map.current = null;
      delete (el as HTMLElement & { driftmarkMap?: MapLibreMap }).driftmarkMap;
    };
  }, [props.areaKey]);

  // New footprint data: draw it; fit on a new estimate while following.
  useEffect(() => {
    const m = map.current;
    if (!m || !ready) return;
    drawn.current += 1;
    (m.getSource(FOOTPRINT_SOURCE) as GeoJSONSource | undefined)?.setData(props.data);
    if (following.current) fitFootprint();
    m.triggerRepaint();
  }, [props.data, props.estimateKey, ready]);

  // Theme: swap the flavour, keep the view.
  const night = useRef(props.night);
  useEffect(() => {
    const m = map.current;
    if (!m || night.current === props.night) return;
    night.current = props.night;
    m.setStyle(mapStyle(props.areaKey, props.night, latest.current.data));
  }, [props.night]);

  const centre = () => map.current?.getCenter();
  return (
    <div class="dm-map-wrap">
      <div class="dm-map-box">
        <section
          ref={box}
          class="dm-map"
          data-testid="map"
          data-drawn="0"
          aria-label="Map of the footprint"
        />
        <div class="dm-crosshair" aria-hidden="true" />
      </div>
      <p class="hint dm-map-caption">{props.summary}</p>
      <div class="map-tools dm-map-tools">
        {props.onPutSource ? (
          <button
            type="button"
            onClick={() => {
              const c = centre();
              if (c) latest.current.onPutSource?.(c.lat, c.lng);
            }}
          >
            Put the source here
          </button>
        ) : null}
        {props.onAddPlace ? (
          <button
            type="button"
            onClick={() => {
              const c = centre();
              if (c) latest.current.onAddPlace?.(c.lat, c.lng);
            }}
          >
            Add place here
          </button>
        ) : null}
        {props.onShowPosition ? (
          <button type="button" class="secondary" onClick={props.onShowPosition}>
            Show my position
          </button>
        ) : null}
        <button
          type="button"
          class="secondary"
          aria-pressed={isFollowing}
          onClick={() => {
            following.current = true;
            setFollowing(true);
            map.current?.resetNorth({ animate: false });
            fitFootprint();
          }}
        >
          Fit
        </button>
      </div>
    </div>
  );
}
