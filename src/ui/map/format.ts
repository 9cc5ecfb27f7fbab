/** Display of map areas: sizes and bounds. Pure. */

/**
 * A file size for people: bytes, kB, MB or GB (decimal, 1 kB = 1000 bytes), 3 significant digits.
 * @param bytes size (bytes), finite and ≥ 0
 */
export function formatBytes(bytes: number): string {
  if (!(bytes >= 0)) return "unknown size";
  if (bytes < 1000) return `${bytes} bytes`;
  const units = ["kB", "MB", "GB", "TB"];
  let v = bytes / 1000;
  let i = 0;
  while (v >= 999.5 && i < units.length - 1) {
    v /= 1000;
    i++;
  }
  return `${Number(v.toPrecision(3))} ${units[i]}`;
}

const deg = (v: number, pos: string, neg: string) =>
  `${Math.abs(Number(v.toFixed(3)))}° ${v < 0 ? neg : pos}`;

/** [west, south, east, north] (degrees) as "46.98° N – 47.02° N, 7.95° E – 8.05° E". */
export function formatBounds(b: readonly [number, number, number, number]): string {
  const [w, s, e, n] = b;
  return `${deg(s, "N", "S")} – ${deg(n, "N", "S")}, ${deg(w, "E", "W")} – ${deg(e, "E", "W")}`;
}
