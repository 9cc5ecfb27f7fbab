// An INVENTED town (Ostervale: every name is made up) laid out on a grid around 47.0° N, 8.0° E,
// where the demo scenario's source is, in the Protomaps basemap layer schema (earth, water,
// landuse, roads, buildings, places, pois). Not real map data: no survey, no imported source.
// Each feature carries `layer` (the vector-tile layer it goes to) and the schema's properties.
//
// Regenerate tests/fixtures/map/town.geojson: npx tsx scripts/map-fixture/town.ts
import { writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import type { Feature, FeatureCollection, Geometry, Position } from "geojson";

export const TOWN_CENTRE = { lat: 47.0, lon: 8.0 };
/** Metres per degree near 47° N (spherical, R = 6,371,008.8 m): good enough for an invented town. */
const M_PER_DEG_LAT = 111_195;
const M_PER_DEG_LON = M_PER_DEG_LAT * Math.cos((TOWN_CENTRE.lat * Math.PI) / 180);

/** Local metres east/north of the centre → [lon, lat], 7 decimals. */
function ll(x: number, y: number): Position {
  const r = (v: number) => Math.round(v * 1e7) / 1e7;
  return [r(TOWN_CENTRE.lon + x / M_PER_DEG_LON), r(TOWN_CENTRE.lat + y / M_PER_DEG_LAT)];
}

function rect(x0: number, y0: number, x1: number, y1: number): Position[][] {
  return [[ll(x0, y0), ll(x1, y0), ll(x1, y1), ll(x0, y1), ll(x0, y0)]];
}

type Props = Record<string, string | number | boolean>;
const features: Feature<Geometry, Props>[] = [];
function add(layer: string, geometry: Geometry, props: Props): void {
  features.push({ type: "Feature", geometry, properties: { layer, ...props } });
}

// Extent of the extract (m from the centre).
export const EXTENT_M = { west: -3500, east: 4000, south: -2500, north: 2500 };
add("earth", { type: "Polygon", coordinates: rect(-3500, -2500, 4000, 2500) }, { kind: "earth" });

// The Sallow, a river running north to south west of the centre, about 80 m wide.
const riverX = (y: number) => -700 + 160 * Math.sin(y / 450);
const RIVER_HALF = 40;
const left: Position[] = [];
const right: Position[] = [];
const centre: Position[] = [];
for (let y = 2500; y >= -2500; y -= 100) {
  left.push(ll(riverX(y) - RIVER_HALF, y));
  right.push(ll(riverX(y) + RIVER_HALF, y));
  centre.push(ll(riverX(y), y));
}
add(
  "water",
  { type: "Polygon", coordinates: [[...left, ...right.reverse(), left[0] as Position]] },
  { kind: "water", kind_detail: "river", name: "Sallow", min_zoom: 9, sort_rank: 200 },
);
add(
  "water",
  { type: "LineString", coordinates: centre },
  { kind: "river", name: "Sallow", min_zoom: 9 },
);
// A pond in the park.
const pond: Position[] = [];
for (let k = 0; k <= 24; k++) {
  const a = (2 * Math.PI * k) / 24;
  pond.push(ll(450 + 70 * Math.cos(a), -700 + 45 * Math.sin(a)));
}
pond[24] = pond[0] as Position;
add(
  "water",
  { type: "Polygon", coordinates: [pond] },
  { kind: "water", kind_detail: "pond", min_zoom: 12 },
);

// Landuse: Fenwick Park, Harrowgate School's grounds, a wood and a works yard.
const PARK = [150, -1000, 800, -450] as const;
const SCHOOL = [1050, 250, 1400, 550] as const;
const WOOD = [-3200, 900, -1900, 2200] as const;
const WORKS = [2600, -1300, 3500, -600] as const;
add(
  "landuse",
  { type: "Polygon", coordinates: rect(...PARK) },
  { kind: "park", name: "Fenwick Park", min_zoom: 11, sort_rank: 60 },
);
add(
  "landuse",
  { type: "Polygon", coordinates: rect(...SCHOOL) },
  { kind: "school", name: "Harrowgate School", min_zoom: 12, sort_rank: 70 },
);
add(
  "landuse",
  { type: "Polygon", coordinates: rect(...WOOD) },
  { kind: "wood", min_zoom: 9, sort_rank: 40 },
);
add(
  "landuse",
  { type: "Polygon", coordinates: rect(...WORKS) },
  { kind: "industrial", name: "Brindle Works", min_zoom: 12, sort_rank: 50 },
);

// Streets: east–west every 200 m, north–south every 250 m; two main roads.
const EW_NAMES = [
  "Corvane Street",
  "Tilbury Row",
  "Almsgate Street",
  "Wickerby Lane",
  "Osprey Street",
  "Market Road",
  "Hollin Street",
  "Pellow Lane",
  "Skarn Street",
  "Quillet Row",
  "Bramwick Street",
];
const NS_NAMES = [
  "Anvil Way",
  "Dovecote Street",
  "Ferrow Street",
  "Gannet Lane",
  "Hasp Street",
  "Ivel Street",
  "Jessop Way",
  "Quarry Road",
  "Larkhill Street",
  "Mottram Lane",
  "Nettleby Street",
  "Orrin Way",
  "Pargeter Street",
  "Rushen Lane",
  "Sedley Street",
  "Tamsin Way",
  "Umber Street",
];
const X0 = -1750;
const X1 = 2250;
const Y0 = -1000;
const Y1 = 1000;
const ewYs: number[] = [];
for (let i = 0, y = Y0; y <= Y1; y += 200, i++) {
  ewYs.push(y);
  const major = y === 0;
  add(
    "roads",
    { type: "LineString", coordinates: [ll(major ? -3500 : X0, y), ll(major ? 4000 : X1, y)] },
    {
      kind: major ? "major_road" : "minor_road",
      kind_detail: major ? "primary" : "residential",
      name: EW_NAMES[i] ?? `Street ${i}`,
      min_zoom: major ? 9 : 12,
      sort_rank: major ? 380 : 350,
    },
  );
}
const nsXs: number[] = [];
for (let i = 0, x = X0; x <= X1; x += 250, i++) {
  nsXs.push(x);
  const major = x === 250;
  add(
    "roads",
    {
      type: "LineString",
      coordinates: [ll(x, major ? -2500 : Y0 - 100), ll(x, major ? 2500 : Y1 + 100)],
    },
    {
      kind: major ? "major_road" : "minor_road",
      kind_detail: major ? "primary" : "residential",
      name: NS_NAMES[i] ?? `Way ${i}`,
      min_zoom: major ? 9 : 12,
      sort_rank: major ? 380 : 350,
    },
  );
}
// A footpath across the park.
add(
  "roads",
  { type: "LineString", coordinates: [ll(PARK[0], PARK[1]), ll(PARK[2], PARK[3])] },
  { kind: "path", kind_detail: "footway", name: "Heron Walk", min_zoom: 14, sort_rank: 300 },
);

// Buildings: four per block, 12 m back from the streets, none on the river, park or school.
const overlaps = (a: readonly number[], b: readonly number[]) =>
  (a[0] as number) < (b[2] as number) &&
  (a[2] as number) > (b[0] as number) &&
  (a[1] as number) < (b[3] as number) &&
  (a[3] as number) > (b[1] as number);
const SET_BACK = 12;
const GAP = 8;
for (let i = 0; i + 1 < nsXs.length; i++) {
  for (let j = 0; j + 1 < ewYs.length; j++) {
    const bx0 = (nsXs[i] as number) + SET_BACK;
    const bx1 = (nsXs[i + 1] as number) - SET_BACK;
    const by0 = (ewYs[j] as number) + SET_BACK;
    const by1 = (ewYs[j + 1] as number) - SET_BACK;
    const block = [bx0, by0, bx1, by1];
    if (overlaps(block, PARK) || overlaps(block, SCHOOL)) continue;
    const riverBox = [
      Math.min(riverX(by0), riverX(by1)) - 220,
      by0,
      Math.max(riverX(by0), riverX(by1)) + 220,
      by1,
    ];
    if (overlaps(block, riverBox)) continue;
    const mx = (bx0 + bx1) / 2;
    const my = (by0 + by1) / 2;
    for (const [x0, y0, x1, y1] of [
      [bx0, by0, mx - GAP, my - GAP],
      [mx + GAP, by0, bx1, my - GAP],
      [bx0, my + GAP, mx - GAP, by1],
      [mx + GAP, my + GAP, bx1, by1],
    ] as const) {
      add(
        "buildings",
        { type: "Polygon", coordinates: rect(x0, y0, x1, y1) },
        { kind: "building", height: 9 + 3 * ((i + j) % 4), min_zoom: 13, sort_rank: 400 },
      );
    }
  }
}
// The school building.
add(
  "buildings",
  { type: "Polygon", coordinates: rect(1100, 420, 1350, 520) },
  { kind: "building", kind_detail: "school", height: 12, min_zoom: 13, sort_rank: 400 },
);

// Places and points of interest.
add(
  "places",
  { type: "Point", coordinates: ll(300, 150) },
  { kind: "locality", name: "Ostervale", min_zoom: 8, population_rank: 9, sort_key: 8 },
);
add(
  "places",
  { type: "Point", coordinates: ll(-1400, 700) },
  { kind: "neighbourhood", name: "Millbank", min_zoom: 12, sort_key: 12 },
);
add(
  "places",
  { type: "Point", coordinates: ll(1900, -500) },
  { kind: "neighbourhood", name: "Eastholm", min_zoom: 12, sort_key: 12 },
);
add(
  "pois",
  { type: "Point", coordinates: ll(1225, 400) },
  { kind: "school", name: "Harrowgate School", min_zoom: 14 },
);
add(
  "pois",
  { type: "Point", coordinates: ll(475, -600) },
  { kind: "park", name: "Fenwick Park", min_zoom: 13 },
);

/** The invented town as one FeatureCollection; `layer` says which tile layer each feature is in. */
export function townCollection(): FeatureCollection<Geometry, Props> {
  return { type: "FeatureCollection", features };
}

/** Bounds of the extract: [west, south, east, north] in degrees. */
export function townBounds(): [number, number, number, number] {
  const sw = ll(EXTENT_M.west, EXTENT_M.south);
  const ne = ll(EXTENT_M.east, EXTENT_M.north);
  return [sw[0] as number, sw[1] as number, ne[0] as number, ne[1] as number];
}

const HERE = dirname(fileURLToPath(import.meta.url));
export const TOWN_GEOJSON = join(HERE, "..", "..", "tests", "fixtures", "map", "town.geojson");

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const fc = {
    _comment: "Ostervale: an INVENTED town for tests (every name made up). Not real map data.",
    ...townCollection(),
  };
  writeFileSync(TOWN_GEOJSON, `${JSON.stringify(fc)}\n`);
  console.log(`wrote ${TOWN_GEOJSON} (${features.length} features)`);
}
