/**
 * Reader for the Project Prairie Grass transcription in `../shared/data/prairie_grass/`.
 *
 * Source of the measurements: Barad, M. L. (ed.) (1958), *Project Prairie Grass, a Field
 * Program in Diffusion*, Geophysical Research Papers No. 59, Air Force Cambridge Research
 * Center (Vol. I: AD152572). The folder's README.md describes each file; this module follows it:
 *
 * - `PGARCS.txt`: 340 blocks (68 experiments × 5 arcs at 50, 100, 200, 400, 800 m). Header line 1
 *   `exp, arc, 'MM/DD/56', 'HHMM-HHMM', x`; line 2 `n, i1, i2, k, 1, 0, 0, Q, hs, zr, 1`
 *   (Q in g/s, hs release height m, zr sampler height m); then `n` lines
 *   `azimuth_deg pos x_m C` with C the 10-minute mean SO₂ concentration in mg/m³, uncorrected,
 *   `-9` = missing.
 * - `PGrassEvapLossTABLE_5_4.txt`: Barad's Table 5.4, SO₂ correction factors per experiment and
 *   arc, which MULTIPLY the concentrations. Experiment 12 at 200 m is printed 0.09, a
 *   transcription slip for 0.9 (every other factor lies in 0.85–1.00): we use 0.9 and record it.
 * - `modelParamList.txt`: meteorology for 53 runs (tab separated):
 *   `exp L u* h_i wind_dir sigma_u sigma_v sigma_w sigma_theta U`, U measured at 2 m.
 *
 * Nothing here computes a model; it only reads and checks the files. Errors are thrown as
 * `PrairieGrassDataError` with one plain line naming the file and what is wrong.
 */

import { existsSync, readFileSync, statSync } from "node:fs";
import path from "node:path";

/** Arc radii (m), in arc-index order 1–5 (Barad 1958; the data README). */
export const ARC_DISTANCES_M = [50, 100, 200, 400, 800] as const;

/**
 * Readings below this are "below threshold" (mg/m³): Barad 1958, Vol. I, p. 77, as cited by the
 * data README (the thesis code that accompanies the files uses the same value).
 */
export const DETECTION_THRESHOLD_MG_M3 = 0.1;

/** Value used in the files for a missing reading. */
const MISSING = -9;

export class PrairieGrassDataError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "PrairieGrassDataError";
  }
}

export interface SamplerReading {
  /** Bearing of the sampler from the source (degrees). */
  azimuth_deg: number;
  /** 10-minute mean SO₂ (mg/m³), uncorrected; null where the file says missing (-9). */
  concentration_mg_m3: number | null;
}

export interface ArcRecord {
  experiment: number;
  /** Arc index 1–5. */
  arc: number;
  /** As printed, e.g. "07/03/56". */
  date: string;
  /** Sampling period as printed, e.g. "1100-1110". */
  period: string;
  distance_m: number;
  rate_g_s: number;
  release_height_m: number;
  sampler_height_m: number;
  readings: SamplerReading[];
}

/** One applied correction to the correction table (so the report can say what was changed). */
export interface FactorAmendment {
  experiment: number;
  distance_m: number;
  printed: number;
  used: number;
  reason: string;
}

export interface CorrectionTable {
  /** experiment → factor per arc (index 0..4 = 50..800 m); null where the table is blank. */
  factors: Map<number, (number | null)[]>;
  amendments: FactorAmendment[];
}

export interface RunMeteorology {
  experiment: number;
  /** Obukhov length (m), as compiled in the source. */
  obukhov_m: number;
  friction_velocity_m_s: number;
  /** Mixing height (m); null where the file says -999 (none / stable). */
  mixing_height_m: number | null;
  wind_from_deg: number;
  /** Standard deviation of the wind direction (degrees). */
  sigma_theta_deg: number;
  /** Mean wind speed at 2 m (m/s). */
  wind_speed_2m_m_s: number;
}

export interface PrairieGrassData {
  dir: string;
  arcs: ArcRecord[];
  corrections: CorrectionTable;
  meteorology: RunMeteorology[];
}

export type ArcStatus = "ok" | "missing" | "below-threshold";

/** The largest reading on one arc, with its correction. */
export interface ArcMaximum {
  experiment: number;
  distance_m: number;
  /** Largest valid reading as printed (mg/m³); null when no reading is valid. */
  printed_max_mg_m3: number | null;
  factor: number;
  /** printed_max × factor (mg/m³), or null. */
  corrected_max_mg_m3: number | null;
  status: ArcStatus;
}

export const FILES = {
  arcs: "PGARCS.txt",
  corrections: "PGrassEvapLossTABLE_5_4.txt",
  meteorology: "modelParamList.txt",
} as const;

function readText(dir: string, name: string): string {
  const file = path.join(dir, name);
  if (!existsSync(file)) {
    throw new PrairieGrassDataError(`${name} not found in ${dir}`);
  }
  return readFileSync(file, "utf8");
}

function toNumber(text: string | undefined, where: string): number {
  const v = Number(text?.trim());
  if (text === undefined || text.trim() === "" || !Number.isFinite(v)) {
    throw new PrairieGrassDataError(`${where}: expected a number, got ${JSON.stringify(text)}`);
  }
  return v;
}

function lines(text: string): string[] {
  return text.split(/\r?\n/);
}

/** Parse the text of `PGARCS.txt`. */
export function parseArcs(text: string): ArcRecord[] {
  const all = lines(text);
  const records: ArcRecord[] = [];
  let i = 0;
  const next = () => all[i++];
  while (i < all.length) {
    const h1 = next();
    if (h1 === undefined || h1.trim() === "") continue;
    const where = `${FILES.arcs} line ${i}`;
    const m = /^\s*(\d+)\s*,\s*(\d+)\s*,\s*'([^']*)'\s*,\s*'([^']*)'\s*,\s*([-\d.]+)\s*$/.exec(h1);
    if (!m) throw new PrairieGrassDataError(`${where}: not an arc header: ${h1.trim()}`);
    const h2 = next();
    const f2 = (h2 ?? "").split(",");
    if (f2.length < 11) {
      throw new PrairieGrassDataError(`${FILES.arcs} line ${i}: expected 11 fields after header`);
    }
    const n = toNumber(f2[0], `${FILES.arcs} line ${i} (sampler count)`);
    const rec: ArcRecord = {
      experiment: toNumber(m[1], where),
      arc: toNumber(m[2], where),
      date: m[3] ?? "",
      period: m[4] ?? "",
      distance_m: toNumber(m[5], where),
      rate_g_s: toNumber(f2[7], `${FILES.arcs} line ${i} (Q)`),
      release_height_m: toNumber(f2[8], `${FILES.arcs} line ${i} (hs)`),
      sampler_height_m: toNumber(f2[9], `${FILES.arcs} line ${i} (zr)`),
      readings: [],
    };
    for (let k = 0; k < n; k++) {
      const row = next();
      const w = `${FILES.arcs} line ${i}`;
      if (row === undefined) throw new PrairieGrassDataError(`${w}: file ends inside a block`);
      const f = row.trim().split(/\s+/);
      if (f.length !== 4) throw new PrairieGrassDataError(`${w}: expected 4 columns`);
      const c = toNumber(f[3], w);
      rec.readings.push({
        azimuth_deg: toNumber(f[0], w),
        concentration_mg_m3: c === MISSING ? null : c,
      });
    }
    records.push(rec);
  }
  return records;
}

/** Known transcription slips in Table 5.4, corrected with the reason (see the data README). */
const KNOWN_SLIPS: { experiment: number; distance_m: number; printed: number; used: number }[] = [
  { experiment: 12, distance_m: 200, printed: 0.09, used: 0.9 },
];

/** Parse the text of `PGrassEvapLossTABLE_5_4.txt` (Barad 1958, Table 5.4). */
export function parseCorrections(text: string): CorrectionTable {
  const factors = new Map<number, (number | null)[]>();
  const amendments: FactorAmendment[] = [];
  let inComment = false;
  let header: number[] | null = null;
  lines(text).forEach((raw, idx) => {
    const line = raw.trimEnd();
    const where = `${FILES.corrections} line ${idx + 1}`;
    if (line.trim().startsWith("/*")) inComment = true;
    if (inComment) {
      if (line.includes("*/")) inComment = false;
      return;
    }
    if (line.trim() === "") return;
    if (/^\s*Exp\b/.test(line)) {
      header = line.trim().split(/\s+/).slice(1).map(Number);
      if (header.join() !== ARC_DISTANCES_M.join()) {
        throw new PrairieGrassDataError(`${where}: unexpected arc columns ${line.trim()}`);
      }
      return;
    }
    if (!header) throw new PrairieGrassDataError(`${where}: data before the column header`);
    // Fixed-width columns: the README says blank values mean missing, so read by column
    // position (9 characters each after the 8-character experiment field).
    const exp = toNumber(line.slice(0, 8), where);
    const row: (number | null)[] = ARC_DISTANCES_M.map((d, j) => {
      const cell = line.slice(8 + 9 * j, 17 + 9 * j).trim();
      if (cell === "") return null;
      let v = toNumber(cell, where);
      const slip = KNOWN_SLIPS.find(
        (s) => s.experiment === exp && s.distance_m === d && s.printed === v,
      );
      if (slip) {
        amendments.push({
          ...slip,
          reason: "a transcription slip: every other factor lies in 0.85–1.00",
        });
        v = slip.used;
      }
      if (!(v > 0.5 && v <= 1)) {
        throw new PrairieGrassDataError(
          `${where}: correction factor ${v} for experiment ${exp} at ${d} m is outside 0.5–1`,
        );
      }
      return v;
    });
    factors.set(exp, row);
  });
  if (factors.size === 0) throw new PrairieGrassDataError(`${FILES.corrections}: no rows found`);
  return { factors, amendments };
}

/** Parse the text of `modelParamList.txt`. */
export function parseMeteorology(text: string): RunMeteorology[] {
  const out: RunMeteorology[] = [];
  lines(text).forEach((raw, idx) => {
    if (raw.trim() === "") return;
    const where = `${FILES.meteorology} line ${idx + 1}`;
    const f = raw.trim().split(/\s+/);
    if (f.length !== 10) throw new PrairieGrassDataError(`${where}: expected 10 columns`);
    const hi = toNumber(f[3], where);
    out.push({
      experiment: toNumber(f[0], where),
      obukhov_m: toNumber(f[1], where),
      friction_velocity_m_s: toNumber(f[2], where),
      mixing_height_m: hi === -999 ? null : hi,
      wind_from_deg: toNumber(f[4], where),
      sigma_theta_deg: toNumber(f[8], where),
      wind_speed_2m_m_s: toNumber(f[9], where),
    });
  });
  return out;
}

/** Read the three files from `dir`. Throws PrairieGrassDataError (one plain line) on any problem. */
export function readPrairieGrass(dir: string): PrairieGrassData {
  if (!existsSync(dir) || !statSync(dir).isDirectory()) {
    throw new PrairieGrassDataError(`data folder not found: ${dir}`);
  }
  const arcs = parseArcs(readText(dir, FILES.arcs));
  const corrections = parseCorrections(readText(dir, FILES.corrections));
  const meteorology = parseMeteorology(readText(dir, FILES.meteorology));
  if (arcs.length === 0) throw new PrairieGrassDataError(`${FILES.arcs}: no arc records`);
  return { dir, arcs, corrections, meteorology };
}

/**
 * The arc maximum, corrected. A reading counts when it is not missing and is at least the
 * detection threshold (0.1 mg/m³, Barad 1958 Vol. I p. 77). The threshold is applied to the
 * printed (uncorrected) reading, since it is a property of the sampler analysis.
 * - `missing`: no reading on the arc is present (every value -9, or no samplers listed);
 * - `below-threshold`: readings exist but none reaches 0.1 mg/m³.
 */
export function arcMaximum(rec: ArcRecord, corrections: CorrectionTable): ArcMaximum {
  const row = corrections.factors.get(rec.experiment);
  const j = ARC_DISTANCES_M.indexOf(rec.distance_m as (typeof ARC_DISTANCES_M)[number]);
  const factor = j >= 0 ? row?.[j] : undefined;
  if (factor === undefined || factor === null) {
    throw new PrairieGrassDataError(
      `${FILES.corrections}: no correction factor for experiment ${rec.experiment} at ${rec.distance_m} m`,
    );
  }
  const present = rec.readings
    .map((r) => r.concentration_mg_m3)
    .filter((c): c is number => c !== null);
  const base = { experiment: rec.experiment, distance_m: rec.distance_m, factor };
  if (present.length === 0) {
    return { ...base, printed_max_mg_m3: null, corrected_max_mg_m3: null, status: "missing" };
  }
  const max = Math.max(...present);
  if (max < DETECTION_THRESHOLD_MG_M3) {
    return {
      ...base,
      printed_max_mg_m3: max,
      corrected_max_mg_m3: null,
      status: "below-threshold",
    };
  }
  return { ...base, printed_max_mg_m3: max, corrected_max_mg_m3: max * factor, status: "ok" };
}

/**
 * Pasquill class from the standard deviation of the wind direction σθ (degrees), by the σA
 * ranges of US EPA (2000), *Meteorological Monitoring Guidance for Regulatory Modeling
 * Applications*, EPA-454/R-99-005, Table 6-7: A ≥ 22.5°, B 17.5–22.5, C 12.5–17.5,
 * D 7.5–12.5, E 3.8–7.5, F < 3.8 (lower bound inclusive). Applied as the plain ranges, without
 * the guidance's other adjustments.
 */
export function classFromSigmaTheta(sigmaThetaDeg: number): "A" | "B" | "C" | "D" | "E" | "F" {
  if (!Number.isFinite(sigmaThetaDeg) || sigmaThetaDeg < 0) {
    throw new RangeError(`sigma_theta: must be a finite angle ≥ 0 degrees (got ${sigmaThetaDeg})`);
  }
  if (sigmaThetaDeg >= 22.5) return "A";
  if (sigmaThetaDeg >= 17.5) return "B";
  if (sigmaThetaDeg >= 12.5) return "C";
  if (sigmaThetaDeg >= 7.5) return "D";
  if (sigmaThetaDeg >= 3.8) return "E";
  return "F";
}
