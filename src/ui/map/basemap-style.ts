/**
 * The map's style: the Protomaps basemap layers (@protomaps/basemaps, light flavour by day, dark
 * at night) over a kept map area, then the footprint layers. No `glyphs` and no `sprite`: with no
 * glyph URL MapLibre draws label glyphs on the device (TinySDF, from the device's fonts), so no
 * request ever leaves the app; a missing icon is answered with an empty image (MapView).
 */
import { layers, namedFlavor } from "@protomaps/basemaps";
import type { FeatureCollection } from "geojson";
import type { StyleSpecification } from "maplibre-gl";
import { FOOTPRINT_SOURCE, footprintLayers } from "./footprint-layers.ts";

export const BASEMAP_SOURCE = "protomaps";

/**
 * @param areaKey the kept area's key, registered with the pmtiles protocol
 * @param night night theme (dark flavour)
 * @param data the footprint source's data
 */
export function mapStyle(
  areaKey: string,
  night: boolean,
  data: FeatureCollection,
): StyleSpecification {
  const flavor = namedFlavor(night ? "dark" : "light");
  return {
    version: 8,
    sources: {
      [BASEMAP_SOURCE]: { type: "vector", url: `pmtiles://${areaKey}` },
      [FOOTPRINT_SOURCE]: { type: "geojson", data },
    },
    layers: [...layers(BASEMAP_SOURCE, flavor, { lang: "en" }), ...footprintLayers(night)],
  };
}
