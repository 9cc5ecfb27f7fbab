/**
 * The footprint area's deferred part (loaded after the first estimate): the kept map areas
 * ("Map area file" input, each area's name, bounds and size, Remove), and the choice between the
 * map and the plain drawing. The map itself (MapLibre) is a further chunk, loaded only when a kept
 * area holds the source and the device has WebGL.
 */
import type { Feature } from "geojson";
import type { ComponentChildren, ComponentType } from "preact";
import { useEffect, useMemo, useState } from "preact/hooks";
import type { EstimateOutput, Scenario } from "../../core/types.ts";
import { footprintCollection } from "../../export/files.ts";
import {
  addMapArea,
  areaContaining,
  listMapAreas,
  MapAreaError,
  type MapAreaInfo,
  mapAreaFile,
  removeMapArea,
} from "../../storage/map-areas.ts";
import type { BandStyle } from "../palette.ts";
import type { UnitSystem } from "../units.ts";
import "./map.css";
import { mapOverlay } from "./footprint-layers.ts";
import { formatBounds, formatBytes } from "./format.ts";
import type { MapViewProps } from "./MapView.tsx";

export interface MapPartProps {
  /** For the plain drawing (FootprintView). */
  styles: readonly BandStyle[];
  scenario: Scenario;
  output: EstimateOutput;
  units: UnitSystem;
  night: boolean;
  /** Where the source is, in words (the plain drawing's caption). */
  placeText: string;
  /** The plain (SVG) drawing, shown when there is no map to draw on. */
  plain: ComponentChildren;
  position?: { lat: number; lon: number; accuracyM: number } | null;
  /** Puts the source at a place: latitude and longitude (degrees) as the Place fields take them. */
  onPutSource?: (lat: string, lon: string) => void;
  onAddPlace?: (lat: number, lon: number) => void;
  /** Told of the device's position when the user asks for it on the map (shown as a dot). */
  onFix?: (fix: { lat: number; lon: number; accuracyM: number }) => void;
  /** Extra features drawn with the footprint (e.g. places as GeoJSON Points with `kind: "place"`). */
  extraFeatures?: Feature[];
}

let mapView: Promise<ComponentType<MapViewProps>> | null = null;
const loadMapView = () => {
  mapView ??= import("./MapView.tsx").then((m) => m.MapView);
  return mapView;
};

function hasWebGL(): boolean {
  try {
    const c = document.createElement("canvas");
    return !!(c.getContext("webgl2") ?? c.getContext("webgl"));
  } catch {
    return false;
  }
}

type Status = { kind: "idle" } | { kind: "busy"; text: string } | { kind: "said"; text: string };

export function MapPart(props: MapPartProps) {
  const [areas, setAreas] = useState<MapAreaInfo[] | null>(null);
  const [status, setStatus] = useState<Status>({ kind: "idle" });
  const [file, setFile] = useState<{ id: string; blob: Blob } | null>(null);
  const [View, setView] = useState<ComponentType<MapViewProps> | null>(null);
  const [failed, setFailed] = useState<string | null>(null);
  const [webgl] = useState(hasWebGL);

  const refresh = () =>
    listMapAreas().then(setAreas, () => {
      setAreas([]);
      setStatus({ kind: "said", text: "The kept map areas cannot be read on this device." });
    });
  useEffect(() => {
    void refresh();
  }, []);

  const src = props.scenario.source;
  const area = areas && src ? areaContaining(areas, src.lat, src.lon) : null;
  useEffect(() => {
    let live = true;
    if (!area || !webgl) return;
    if (file?.id !== area.id) {
      mapAreaFile(area.id).then((blob) => live && blob && setFile({ id: area.id, blob }));
    }
    if (!View) loadMapView().then((C) => live && setView(() => C));
    return () => {
      live = false;
    };
  }, [area?.id, webgl]);

  const data = useMemo(() => {
    if (!src) return null;
    // The same collection Share exports (without a time stamp until the estimate is logged).
    const shared = footprintCollection(props.scenario, props.output, null);
    if (!shared) return null;
    const footprint = props.extraFeatures?.length
      ? { ...shared, features: [...shared.features, ...props.extraFeatures] }
      : shared;
    return mapOverlay({ footprint, units: props.units, position: props.position ?? null });
  }, [props.output, props.scenario, props.units, props.position, props.extraFeatures]);

  const locate = props.onFix
    ? () => {
        if (!("geolocation" in navigator)) {
          setStatus({ kind: "said", text: "This device offers no position." });
          return;
        }
        navigator.geolocation.getCurrentPosition(
          (p) =>
            props.onFix?.({
              lat: p.coords.latitude,
              lon: p.coords.longitude,
              accuracyM: p.coords.accuracy,
            }),
          () =>
            setStatus({
              kind: "said",
              text: "Position not available: permission refused or no fix.",
            }),
          { enableHighAccuracy: true, timeout: 20_000, maximumAge: 60_000 },
        );
      }
    : undefined;

  async function add(input: HTMLInputElement) {
    const picked = input.files?.[0];
    if (!picked) return;
    setStatus({ kind: "busy", text: `Checking and keeping "${picked.name}"…` });
    try {
      const a = await addMapArea(picked, new Date());
      setStatus({
        kind: "said",
        text: `Kept "${a.name}" (${formatBytes(a.bytes)}) on this device.`,
      });
    } catch (e) {
      setStatus({
        kind: "said",
        text:
          e instanceof MapAreaError
            ? e.message
            : `"${picked.name}" could not be kept on this device.`,
      });
    }
    input.value = "";
    await refresh();
  }

  async function remove(a: MapAreaInfo) {
    await removeMapArea(a.id);
    if (file?.id === a.id) setFile(null);
    setStatus({ kind: "said", text: `Removed "${a.name}": ${formatBytes(a.bytes)} freed.` });
    await refresh();
  }

  const canMap = area && webgl && !failed && View && file?.id === area.id && data;
  let hint: string | null = null;
  if (!canMap && areas) {
    if (!webgl || failed)
      hint = "This device cannot draw maps (no WebGL): showing the plain drawing.";
    else if (!src) hint = "Give the source's latitude and longitude to see the footprint on a map.";
    else if (areas.length === 0)
      hint =
        "To see streets under the footprint, add a map area file of your district (Map areas, below).";
    else if (!area)
      hint = "The source is outside every kept map area: add a map area file that covers it.";
  }
  const total = (areas ?? []).reduce((s, a) => s + a.bytes, 0);
  return (
    <>
      {canMap ? (
        <View
          areaKey={area.id}
          areaFile={file.blob}
          data={data}
          estimateKey={props.output}
          night={props.night}
          summary={`Bands of each limit over the map area, labelled at their far ends; the crosshair marks the map centre. ${props.placeText}`}
          onPutSource={
            props.onPutSource &&
            ((lat, lon) => props.onPutSource?.(String(+lat.toFixed(6)), String(+lon.toFixed(6))))
          }
          onAddPlace={props.onAddPlace}
          onShowPosition={locate}
          onFail={(reason) => setFailed(reason)}
        />
      ) : (
        props.plain
      )}
      {hint ? (
        <p class="hint dm-map-hint" data-testid="map-hint">
          {hint}
        </p>
      ) : null}
      <details class="dm-areas" data-testid="map-areas">
        <summary>Map areas ({areas?.length ?? 0} kept)</summary>
        <p class="hint">
          A map area is a .pmtiles extract of your district, kept on this device to use with no
          network. <span data-testid="map-areas-total">Map areas use {formatBytes(total)}</span>.
        </p>
        <label class="button-link dm-map-file">
          Map area file
          <input
            type="file"
            class="dm-map-hidden"
            accept=".pmtiles,application/vnd.pmtiles,application/octet-stream"
            disabled={status.kind === "busy"}
            onChange={(e) => void add(e.currentTarget)}
          />
        </label>
        <p role="status" data-testid="map-area-status">
          {status.kind === "idle" ? "" : status.text}
        </p>
        <ul>
          {(areas ?? []).map((a) => (
            <li key={a.id} data-testid="map-area">
              <span>
                <strong>{a.name}</strong> — {formatBounds(a.bounds)}, {formatBytes(a.bytes)}
              </span>
              <button type="button" class="secondary" onClick={() => void remove(a)}>
                Remove {a.name}
              </button>
            </li>
          ))}
        </ul>
      </details>
    </>
  );
}
