/**
 * Limit sets (glossary: Limit set): one substance as the user keeps it — a name, an optional
 * molecular weight, one or more limits and a free source note — and their two file formats.
 *
 * CSV, one row per limit, with exactly the columns of `CSV_COLUMNS` (UTF-8, RFC 4180 quoting,
 * header required, BOM and CRLF accepted); rows with the same `set_name` form one set, in the
 * order of their first row. JSON: `{ format: "driftmark-limit-sets", version: 1, exported_utc,
 * caution, sets: [{ name, molecular_weight_g_mol, source_note, limits: [{ label, value, unit,
 * averaging_min }] }] }`.
 *
 * Reading is pure and all-or-nothing: a file with any problem yields `LimitSetFileError` listing
 * every problem found (by row and column for CSV, by field path for JSON), and nothing is
 * imported. The ranges are those of the estimate's own validation (src/core/scenario.ts), so a
 * set that imports can always be estimated.
 */
import { CAUTION } from "../core/caution.ts";
import {
  MAX_LABEL_LENGTH,
  MAX_LIMITS,
  MAX_SET_NAME_LENGTH,
  MAX_SOURCE_NOTE_LENGTH,
} from "../core/scenario/fields.ts";
import type { LimitUnit } from "../core/types.ts";
import { CsvSyntaxError, parseCsv, writeCsv } from "./csv.ts";
import { readJsonText } from "./safe-json.ts";

/** One limit of a set. The averaging time is kept in minutes, as the CSV gives it. */
export interface LimitSetLimit {
  label: string;
  /** In `unit`; (0, 1e9]. */
  value: number;
  unit: LimitUnit;
  /** Minutes; [1, 1440]. */
  averaging_min: number;
}

/** A limit set as a file holds it (no id). */
export interface LimitSetData {
  name: string;
  /** g/mol, (0, 1000]; null when not given (then every limit must be in mg/m³). */
  molecular_weight_g_mol: number | null;
  limits: LimitSetLimit[];
  /** Where the values come from (free text; "" when none). */
  source_note: string;
}

/** A stored limit set. */
export interface LimitSet extends LimitSetData {
  /** Random UUID given when stored. */
  id: string;
  /** When it was created or last changed (ISO 8601 UTC). */
  updated_utc: string;
  /** True for the built-in invented demo set only. */
  invented?: boolean;
}

export const CSV_COLUMNS = [
  "set_name",
  "molecular_weight_g_mol",
  "limit_label",
  "value",
  "unit",
  "averaging_min",
  "source_note",
] as const;
type Column = (typeof CSV_COLUMNS)[number];

export const LIMIT_SETS_FORMAT = "driftmark-limit-sets";
export const LIMIT_SETS_VERSION = 1;
/** Largest file accepted (bytes). */
export const MAX_FILE_BYTES = 5 * 1024 * 1024;
export const MAX_SETS = 2000;
/** Same bounds as the estimate's validation (src/core/scenario.ts). */
export const MAX_LIMITS_PER_SET = MAX_LIMITS;
export const MAX_LABEL = MAX_LABEL_LENGTH;
export const MAX_VALUE = 1e9;
export const MAX_MW = 1000;
export const MIN_AVG_MIN = 1;
export const MAX_AVG_MIN = 1440;
export const MAX_NAME = MAX_SET_NAME_LENGTH;
export const MAX_NOTE = MAX_SOURCE_NOTE_LENGTH;
/** At most this many problems are listed; the count says how many more there were. */
const MAX_LISTED = 20;

/** One problem of a file: where (row and column, or field path) and what. */
export interface FileProblem {
  /** 1-based CSV line of the row; undefined for JSON files and whole-file problems. */
  row?: number;
  /** CSV column name; undefined when the whole row or file is concerned. */
  column?: string;
  /** JSON field path such as sets[2].limits[0].value. */
  path?: string;
  message: string;
}

/** Where a problem is, as the user reads it: "Row 4, column value" or "sets[3].name". */
export function problemText(p: FileProblem): string {
  const where =
    p.row !== undefined
      ? `Row ${p.row}${p.column ? `, column ${p.column}` : ""}`
      : (p.path ?? (p.column ? `Column ${p.column}` : ""));
  return where ? `${where}: ${p.message}` : p.message;
}

/** A limit sets file that cannot be imported; nothing was changed. */
export class LimitSetFileError extends Error {
  constructor(readonly problems: FileProblem[]) {
    const listed = problems.slice(0, MAX_LISTED).map(problemText);
    const more = problems.length - listed.length;
    super(
      `The limit sets file was not imported (nothing changed):\n${listed.join("\n")}${more > 0 ? `\n… and ${more} more problems` : ""}`,
    );
    this.name = "LimitSetFileError";
  }
}

function shown(text: string): string {
  const t = text.length > 30 ? `${text.slice(0, 27)}...` : text;
  return `'${t}'`;
}

/** A plain decimal number as typed in a CSV cell (no hex, no Infinity, no thousands separators). */
const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

function readNumber(text: string): number | undefined {
  const t = text.trim();
  return DECIMAL.test(t) ? Number(t) : undefined;
}

type Where = (field: string) => { row?: number; column?: string; path?: string };

/**
 * Checks one limit's fields (already read as numbers where they are numbers); returns the limit or
 * pushes problems. `where(field)` says where each field is in the file.
 */
function checkLimit(
  raw: { label: unknown; value: unknown; unit: unknown; averaging_min: unknown },
  where: Where,
  problems: FileProblem[],
  names: { label: string; value: string; unit: string; averaging_min: string },
): LimitSetLimit | null {
  const before = problems.length;
  const add = (field: string, message: string) => problems.push({ ...where(field), message });
  const label = typeof raw.label === "string" ? raw.label.trim() : "";
  if (typeof raw.label !== "string" || label === "" || label.length > MAX_LABEL) {
    add(names.label, `a limit needs a label of 1 to ${MAX_LABEL} characters`);
  }
  const value = raw.value;
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0 || value > MAX_VALUE) {
    const got = typeof value === "number" ? String(value) : shown(String(raw.value ?? ""));
    add(
      names.value,
      typeof value === "number" && value > MAX_VALUE
        ? `${got} is above the largest limit value accepted (1e9)`
        : `${got} is not a positive number`,
    );
  }
  const unit = raw.unit;
  if (unit !== "ppm" && unit !== "mg/m3") {
    add(names.unit, `unknown unit ${shown(String(unit ?? ""))}: use ppm or mg/m3`);
  }
  const avg = raw.averaging_min;
  if (typeof avg !== "number" || !Number.isFinite(avg)) {
    add(
      names.averaging_min,
      `${shown(String(avg ?? ""))} is not a number of minutes (1 min to 24 h = 1 to 1440)`,
    );
  } else if (avg < MIN_AVG_MIN || avg > MAX_AVG_MIN) {
    add(
      names.averaging_min,
      `averaging time ${avg} min is outside 1 min to 24 h (1 to 1440 minutes)`,
    );
  }
  if (problems.length > before) return null;
  return {
    label,
    value: value as number,
    unit: unit as LimitUnit,
    averaging_min: avg as number,
  };
}

/** Set-level checks once its limits are known: labels unique, ppm needs a molecular weight. */
function checkSet(
  set: LimitSetData,
  whereOfLimit: (i: number, field: string) => ReturnType<Where>,
  problems: FileProblem[],
  names: { label: string; unit: string },
): void {
  const seen = new Map<string, number>();
  set.limits.forEach((l, i) => {
    const first = seen.get(l.label);
    if (first !== undefined) {
      problems.push({
        ...whereOfLimit(i, names.label),
        message: `duplicate limit label ${shown(l.label)} in set ${shown(set.name)} (also on ${describeLimit(whereOfLimit(first, names.label))})`,
      });
    } else seen.set(l.label, i);
    if (l.unit === "ppm" && set.molecular_weight_g_mol === null) {
      problems.push({
        ...whereOfLimit(i, names.unit),
        message: `ppm limit in set ${shown(set.name)}, which has no molecular weight (give molecular_weight_g_mol, or the value in mg/m3)`,
      });
    }
  });
}

function describeLimit(w: ReturnType<Where>): string {
  return w.row !== undefined ? `row ${w.row}` : (w.path ?? "another limit");
}

function checkName(name: string, where: ReturnType<Where>, problems: FileProblem[]): void {
  if (name === "" || name.length > MAX_NAME) {
    problems.push({ ...where, message: `a set needs a name of 1 to ${MAX_NAME} characters` });
  }
}

function checkMw(
  mw: number | null,
  text: string,
  where: ReturnType<Where>,
  problems: FileProblem[],
) {
  if (mw === null) return;
  if (!Number.isFinite(mw) || mw <= 0 || mw > MAX_MW) {
    problems.push({
      ...where,
      message: `${shown(text)} is not a molecular weight above 0 and at most ${MAX_MW} g/mol`,
    });
  }
}

function checkNote(note: string, where: ReturnType<Where>, problems: FileProblem[]) {
  if (note.length > MAX_NOTE) {
    problems.push({ ...where, message: `the source note is longer than ${MAX_NOTE} characters` });
  }
}

function fileTooBig(bytes: number): FileProblem {
  return {
    message: `the file is ${(bytes / 1048576).toFixed(1)} MB; a limit sets file may be at most 5 MB`,
  };
}

function utf8Length(text: string): number {
  return new TextEncoder().encode(text).length;
}

// ---------------------------------------------------------------------------
// CSV
// ---------------------------------------------------------------------------

/**
 * Reads a limit sets CSV (see the module comment).
 * @throws LimitSetFileError listing every problem by row and column; nothing is returned then
 */
export function readLimitSetsCsv(text: string): LimitSetData[] {
  if (text.length > MAX_FILE_BYTES || utf8Length(text) > MAX_FILE_BYTES) {
    throw new LimitSetFileError([fileTooBig(utf8Length(text))]);
  }
  let records: ReturnType<typeof parseCsv>;
  try {
    records = parseCsv(text);
  } catch (e) {
    if (e instanceof CsvSyntaxError) {
      throw new LimitSetFileError([{ row: e.line, column: `${e.column}`, message: e.message }]);
    }
    throw e;
  }
  const header = records[0];
  if (!header) {
    throw new LimitSetFileError([
      {
        row: 1,
        message: `the file is empty; the header row is required: ${CSV_COLUMNS.join(",")}`,
      },
    ]);
  }
  const names = header.fields.map((f) => f.trim());
  const known = new Set<string>(CSV_COLUMNS);
  if (!names.some((n) => known.has(n))) {
    throw new LimitSetFileError([
      {
        row: header.line,
        message: `the header row is missing; the first row must be ${CSV_COLUMNS.join(",")}`,
      },
    ]);
  }
  const headerProblems: FileProblem[] = [];
  const index = {} as Record<Column, number>;
  for (const col of CSV_COLUMNS) {
    const at = names.indexOf(col);
    if (at < 0) {
      headerProblems.push({
        row: header.line,
        column: col,
        message: "this column is missing from the header",
      });
    } else index[col] = at;
  }
  names.forEach((n, i) => {
    if (!known.has(n)) {
      headerProblems.push({
        row: header.line,
        column: n || `${i + 1}`,
        message: `unknown column ${shown(n)}; the columns are ${CSV_COLUMNS.join(",")}`,
      });
    } else if (names.indexOf(n) !== i) {
      headerProblems.push({ row: header.line, column: n, message: "this column appears twice" });
    }
  });
  if (headerProblems.length > 0) throw new LimitSetFileError(headerProblems);

  const problems: FileProblem[] = [];
  interface Building {
    set: LimitSetData;
    firstRow: number;
    mwText: string;
    rows: number[];
  }
  const sets = new Map<string, Building>();
  const cell = (r: string[], c: Column) => r[index[c]] ?? "";
  for (const rec of records.slice(1)) {
    const row = rec.line;
    if (rec.fields.length !== names.length) {
      problems.push({
        row,
        message: `this row has ${rec.fields.length} fields; the header has ${names.length}`,
      });
      continue;
    }
    const f = rec.fields;
    const name = cell(f, "set_name").trim();
    const at = (column: string) => ({ row, column });
    checkName(name, at("set_name"), problems);
    const mwText = cell(f, "molecular_weight_g_mol").trim();
    const mw = mwText === "" ? null : (readNumber(mwText) ?? Number.NaN);
    const note = cell(f, "source_note");
    let b = sets.get(name);
    if (!b) {
      if (sets.size === MAX_SETS) {
        problems.push({
          row,
          column: "set_name",
          message: `more than ${MAX_SETS.toLocaleString("en")} sets in one file (set ${shown(name)} would be number ${MAX_SETS + 1})`,
        });
        break;
      }
      checkMw(mw, mwText, at("molecular_weight_g_mol"), problems);
      checkNote(note, at("source_note"), problems);
      b = {
        set: { name, molecular_weight_g_mol: mw, limits: [], source_note: note },
        firstRow: row,
        mwText,
        rows: [],
      };
      sets.set(name, b);
    } else {
      // Later rows of a set repeat (or leave empty) its molecular weight and source note.
      if (mwText !== "" && mw !== b.set.molecular_weight_g_mol) {
        problems.push({
          ...at("molecular_weight_g_mol"),
          message: `${shown(mwText)} differs from ${b.mwText === "" ? "the empty value" : shown(b.mwText)} on row ${b.firstRow} of set ${shown(name)}; a set has one molecular weight`,
        });
      }
      if (note !== "" && note !== b.set.source_note) {
        problems.push({
          ...at("source_note"),
          message: `differs from the source note on row ${b.firstRow} of set ${shown(name)}; a set has one source note`,
        });
      }
    }
    const valueText = cell(f, "value");
    const avgText = cell(f, "averaging_min");
    const limit = checkLimit(
      {
        label: cell(f, "limit_label"),
        value: readNumber(valueText) ?? valueText,
        unit: cell(f, "unit").trim(),
        averaging_min: readNumber(avgText) ?? avgText,
      },
      at,
      problems,
      { label: "limit_label", value: "value", unit: "unit", averaging_min: "averaging_min" },
    );
    if (limit) {
      if (b.set.limits.length === MAX_LIMITS_PER_SET) {
        problems.push({
          row,
          column: "limit_label",
          message: `set ${shown(name)} has more than ${MAX_LIMITS_PER_SET} limits`,
        });
      } else {
        b.set.limits.push(limit);
        b.rows.push(row);
      }
    }
  }
  for (const b of sets.values()) {
    checkSet(b.set, (i, column) => ({ row: b.rows[i], column }), problems, {
      label: "limit_label",
      unit: "unit",
    });
  }
  if (records.length === 1) {
    problems.push({ row: header.line + 1, message: "the file has a header but no limits" });
  }
  if (problems.length > 0) {
    problems.sort((a, b) => (a.row ?? 0) - (b.row ?? 0));
    throw new LimitSetFileError(problems);
  }
  return [...sets.values()].map((b) => b.set);
}

/** Sets → CSV text (CRLF, header first; a set's molecular weight and note repeated on each row). */
export function writeLimitSetsCsv(sets: readonly LimitSetData[]): string {
  const rows: string[][] = [[...CSV_COLUMNS]];
  for (const s of sets) {
    for (const l of s.limits) {
      rows.push([
        s.name,
        s.molecular_weight_g_mol === null ? "" : String(s.molecular_weight_g_mol),
        l.label,
        String(l.value),
        l.unit,
        String(l.averaging_min),
        s.source_note,
      ]);
    }
  }
  return writeCsv(rows);
}

// ---------------------------------------------------------------------------
// JSON
// ---------------------------------------------------------------------------

export interface LimitSetsFile {
  format: typeof LIMIT_SETS_FORMAT;
  version: typeof LIMIT_SETS_VERSION;
  exported_utc: string;
  caution: string;
  sets: LimitSetData[];
}

/** The JSON file object of some sets (ids and times are the device's own and are left out). */
export function makeLimitSetsFile(sets: readonly LimitSetData[], now: Date): LimitSetsFile {
  return {
    format: LIMIT_SETS_FORMAT,
    version: LIMIT_SETS_VERSION,
    exported_utc: now.toISOString(),
    caution: CAUTION,
    sets: sets.map(dataOf),
  };
}

/** Only the file's fields of a set, in a fixed order. */
export function dataOf(s: LimitSetData): LimitSetData {
  return {
    name: s.name,
    molecular_weight_g_mol: s.molecular_weight_g_mol,
    source_note: s.source_note,
    limits: s.limits.map((l) => ({
      label: l.label,
      value: l.value,
      unit: l.unit,
      averaging_min: l.averaging_min,
    })),
  };
}

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => typeof v === "object" && v !== null && !Array.isArray(v);

/**
 * Reads a limit sets JSON file (see the module comment).
 * @throws LimitSetFileError listing every problem by field path; nothing is returned then
 */
export function readLimitSetsJson(text: string): LimitSetData[] {
  if (text.length > MAX_FILE_BYTES || utf8Length(text) > MAX_FILE_BYTES) {
    throw new LimitSetFileError([fileTooBig(utf8Length(text))]);
  }
  const parsed = readJsonText(text);
  if (!parsed.ok) throw new LimitSetFileError([{ message: parsed.message }]);
  const d = parsed.value;
  if (!isObj(d) || d.format !== LIMIT_SETS_FORMAT) {
    throw new LimitSetFileError([
      {
        path: "format",
        message: `the file is not a Driftmark limit sets file (expected "${LIMIT_SETS_FORMAT}")`,
      },
    ]);
  }
  if (d.version !== LIMIT_SETS_VERSION) {
    throw new LimitSetFileError([
      {
        path: "version",
        message: `version ${shown(String(d.version))} cannot be read by this app (it reads version ${LIMIT_SETS_VERSION})`,
      },
    ]);
  }
  if (!Array.isArray(d.sets)) {
    throw new LimitSetFileError([{ path: "sets", message: "must be a list of limit sets" }]);
  }
  if (d.sets.length > MAX_SETS) {
    throw new LimitSetFileError([
      {
        path: "sets",
        message: `more than ${MAX_SETS.toLocaleString("en")} sets in one file (${d.sets.length})`,
      },
    ]);
  }
  const problems: FileProblem[] = [];
  const out: LimitSetData[] = [];
  const names = new Map<string, number>();
  d.sets.forEach((raw: unknown, si: number) => {
    const base = `sets[${si}]`;
    if (!isObj(raw)) {
      problems.push({ path: base, message: "must be an object with name, limits and source_note" });
      return;
    }
    const before = problems.length;
    const name = typeof raw.name === "string" ? raw.name.trim() : "";
    checkName(name, { path: `${base}.name` }, problems);
    const first = names.get(name);
    if (first !== undefined) {
      problems.push({
        path: `${base}.name`,
        message: `${shown(name)} is also the name of sets[${first}]; names are unique in a file`,
      });
    } else names.set(name, si);
    const mwRaw = raw.molecular_weight_g_mol;
    let mw: number | null = null;
    if (mwRaw !== null && mwRaw !== undefined) {
      mw = typeof mwRaw === "number" ? mwRaw : Number.NaN;
      checkMw(mw, String(mwRaw), { path: `${base}.molecular_weight_g_mol` }, problems);
    }
    const note = raw.source_note ?? "";
    if (typeof note !== "string") {
      problems.push({ path: `${base}.source_note`, message: "must be text" });
    } else checkNote(note, { path: `${base}.source_note` }, problems);
    if (!Array.isArray(raw.limits) || raw.limits.length === 0) {
      problems.push({ path: `${base}.limits`, message: "must be a list of at least one limit" });
      return;
    }
    if (raw.limits.length > MAX_LIMITS_PER_SET) {
      problems.push({
        path: `${base}.limits`,
        message: `has more than ${MAX_LIMITS_PER_SET} limits`,
      });
      return;
    }
    const limits: LimitSetLimit[] = [];
    raw.limits.forEach((l: unknown, li: number) => {
      const lp = `${base}.limits[${li}]`;
      if (!isObj(l)) {
        problems.push({
          path: lp,
          message: "must be an object with label, value, unit and averaging_min",
        });
        return;
      }
      const limit = checkLimit(
        { label: l.label, value: l.value, unit: l.unit, averaging_min: l.averaging_min },
        (field) => ({ path: `${lp}.${field}` }),
        problems,
        { label: "label", value: "value", unit: "unit", averaging_min: "averaging_min" },
      );
      if (limit) limits.push(limit);
    });
    if (problems.length > before) return;
    const set: LimitSetData = {
      name,
      molecular_weight_g_mol: mw,
      limits,
      source_note: note as string,
    };
    checkSet(set, (i, field) => ({ path: `${base}.limits[${i}].${field}` }), problems, {
      label: "label",
      unit: "unit",
    });
    out.push(set);
  });
  if (problems.length > 0) throw new LimitSetFileError(problems);
  return out;
}

/** Sets → JSON text (two-space indent). */
export function writeLimitSetsJson(sets: readonly LimitSetData[], now: Date): string {
  return `${JSON.stringify(makeLimitSetsFile(sets, now), null, 2)}\n`;
}

/**
 * Reads a limit sets file of either format: JSON when its name ends in .json or its text starts
 * with "{", CSV otherwise.
 * @param bytes the file's size in bytes (checked before anything else)
 * @throws LimitSetFileError
 */
export function readLimitSetsFile(fileName: string, text: string, bytes?: number): LimitSetData[] {
  if ((bytes ?? 0) > MAX_FILE_BYTES) throw new LimitSetFileError([fileTooBig(bytes ?? 0)]);
  const looksJson = /\.json$/i.test(fileName) || /^\uFEFF?\s*\{/.test(text);
  return looksJson ? readLimitSetsJson(text) : readLimitSetsCsv(text);
}

/** File names for an export: driftmark-limit-sets-YYYYMMDD.csv / .json (UTC). */
export function limitSetsFileName(now: Date, ext: "csv" | "json"): string {
  return `driftmark-limit-sets-${now.toISOString().slice(0, 10).replaceAll("-", "")}.${ext}`;
}

/** The built-in demo set: invented values, marked invented (matches the demo scenario). */
export const DEMO_LIMIT_SET: LimitSet = {
  id: "demo-invented",
  name: "Substance X (invented demo)",
  molecular_weight_g_mol: 34.1,
  limits: [
    { label: "Limit A (invented) 60 min", value: 3, unit: "ppm", averaging_min: 60 },
    { label: "Limit B (invented) 30 min", value: 20, unit: "ppm", averaging_min: 30 },
    { label: "Limit C (invented) 10 min", value: 100, unit: "ppm", averaging_min: 10 },
  ],
  source_note: "Invented for the demo: not a real substance or exposure value.",
  updated_utc: "2026-01-01T00:00:00.000Z",
  invented: true,
};
