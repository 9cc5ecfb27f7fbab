/**
 * Form state of the estimate screen and the pure step from it to a core `Scenario`.
 *
 * The form keeps exactly what the user typed (strings) plus unit choices, so a
 * half-typed number never loses characters. `buildScenario` turns it into a
 * `Scenario` or a list of problems, each tied to the input (by id) that caused it.
 * `problemsFromCore` maps the core's `ScenarioError` problem fields (dotted
 * paths such as `release.rate_g_s` or `limits[0].value`) back to those inputs.
 */
import type {
  LimitUnit,
  Scenario,
  ScenarioProblem,
  SigmaScheme,
  Sky,
  StabilityClass,
} from "../core/types.ts";
import {
  type LengthUnit,
  lengthFromM,
  lengthToM,
  type MassUnit,
  massFromG,
  massToG,
  parseDirection,
  parseNumber,
  type RateUnit,
  rateFromGPerS,
  rateToGPerS,
  roundSig,
  type SpeedUnit,
  speedFromMPerS,
  speedToMPerS,
  type TemperatureUnit,
  type TimeUnit,
  temperatureFromK,
  temperatureToK,
  timeFromS,
  timeToS,
} from "./units.ts";

export interface LimitForm {
  name: string;
  value: string;
  unit: LimitUnit;
  /** Averaging time in minutes, as typed. */
  averagingMin: string;
}

export interface FormState {
  kind: "continuous" | "instantaneous";
  rate: string;
  rateUnit: RateUnit;
  duration: string;
  durationUnit: TimeUnit;
  mass: string;
  massUnit: MassUnit;
  height: string;
  heightUnit: LengthUnit;
  heavyOrCold: boolean;
  hotOn: boolean;
  exitSpeed: string;
  diameter: string;
  diameterUnit: LengthUnit;
  gasTemp: string;
  gasTempUnit: TemperatureUnit;
  /** Air temperature (plume rise only), in `gasTempUnit`; blank = the model's 25 °C. */
  airTemp: string;
  windSpeed: string;
  windSpeedUnit: SpeedUnit;
  windHeight: string;
  windHeightUnit: LengthUnit;
  windFrom: string;
  windSwing: string;
  /** Near-zone radius in m, as typed (blank = the model's default). */
  nearZone: string;
  /** Breathing (receptor) height in m, as typed (blank = the model's 1.5 m). */
  receptorHeight: string;
  /** Dispersion curves: Briggs (the model's default) or Pasquill–Gifford. */
  scheme: SigmaScheme;
  sky: Sky;
  /** "auto" = use the suggested class. */
  stability: StabilityClass | "auto";
  terrain: "open" | "urban";
  mixingHeight: string;
  mixingHeightUnit: LengthUnit;
  molecularWeight: string;
  limits: LimitForm[];
  /** The limit set the limits were filled from; cleared when a limit or the weight is edited. */
  limitSet?: { name: string; source_note: string } | null;
  lat: string;
  lon: string;
}

/** Input ids used by the screen; problems are keyed by them. */
export const FIELD = {
  rate: "rate",
  duration: "duration",
  mass: "mass",
  height: "height",
  exitSpeed: "exit-speed",
  diameter: "diameter",
  gasTemp: "gas-temp",
  airTemp: "air-temp",
  windSpeed: "wind-speed",
  windHeight: "wind-height",
  windFrom: "wind-from",
  windSwing: "wind-swing",
  nearZone: "near-zone",
  receptorHeight: "receptor-height",
  scheme: "scheme",
  sky: "sky",
  stability: "stability",
  terrain: "terrain",
  mixingHeight: "mixing-height",
  molecularWeight: "molecular-weight",
  lat: "lat",
  lon: "lon",
  limits: "limits",
} as const;

export const limitFieldId = (i: number, part: "name" | "value" | "unit" | "avg") =>
  `limit-${i}-${part}`;

/** Visible label text of each input: also used to name the field in messages. */
export const FIELD_LABEL: Record<string, string> = {
  [FIELD.rate]: "Release rate",
  [FIELD.duration]: "Duration",
  [FIELD.mass]: "Mass released",
  [FIELD.height]: "Release height",
  [FIELD.exitSpeed]: "Exit speed",
  [FIELD.diameter]: "Vent diameter",
  [FIELD.gasTemp]: "Gas temperature",
  [FIELD.airTemp]: "Air temperature",
  [FIELD.windSpeed]: "Wind speed",
  [FIELD.windHeight]: "Measured at height",
  [FIELD.windFrom]: "Wind from",
  [FIELD.windSwing]: "Wind swing",
  [FIELD.nearZone]: "Near zone radius",
  [FIELD.receptorHeight]: "Breathing height",
  [FIELD.scheme]: "Dispersion curves",
  [FIELD.sky]: "Sky",
  [FIELD.stability]: "Stability class",
  [FIELD.terrain]: "Ground",
  [FIELD.mixingHeight]: "Mixing height",
  [FIELD.molecularWeight]: "Molecular weight",
  [FIELD.lat]: "Latitude",
  [FIELD.lon]: "Longitude",
  [FIELD.limits]: "Limits",
};

export function fieldLabel(id: string): string {
  const m = /^limit-(\d+)-(name|value|unit|avg)$/.exec(id);
  if (m) {
    const part = { name: "name", value: "value", unit: "unit", avg: "averaging time" }[
      m[2] as "name" | "value" | "unit" | "avg"
    ];
    return `Limit ${Number(m[1]) + 1} ${part}`;
  }
  return FIELD_LABEL[id] ?? id;
}

/** One problem shown beside an input: `field` is an input id, `message` names the field. */
export interface FieldProblem {
  field: string;
  message: string;
}

export const emptyLimit = (): LimitForm => ({
  name: "",
  value: "",
  unit: "ppm",
  averagingMin: "60",
});

/** The form of a fresh screen (no values a responder must check are prefilled). */
export function initialForm(): FormState {
  return {
    kind: "continuous",
    rate: "",
    rateUnit: "kg/s",
    duration: "",
    durationUnit: "min",
    mass: "",
    massUnit: "kg",
    height: "0",
    heightUnit: "m",
    heavyOrCold: false,
    hotOn: false,
    exitSpeed: "",
    diameter: "",
    diameterUnit: "m",
    gasTemp: "",
    gasTempUnit: "°C",
    airTemp: "",
    windSpeed: "",
    windSpeedUnit: "m/s",
    windHeight: "10",
    windHeightUnit: "m",
    windFrom: "",
    windSwing: "0",
    nearZone: "100",
    receptorHeight: "1.5",
    scheme: "briggs",
    sky: "overcast",
    stability: "auto",
    terrain: "open",
    mixingHeight: "",
    mixingHeightUnit: "m",
    molecularWeight: "",
    limits: [emptyLimit()],
    lat: "",
    lon: "",
  };
}

/** Tier-name templates: they fill the name and averaging time, never a value. */
export interface LimitTemplate {
  id: string;
  name: string;
  averagingMin: number;
}

export const LIMIT_TEMPLATES: readonly LimitTemplate[] = [
  ...(["AEGL-1", "AEGL-2", "AEGL-3"] as const).flatMap((tier) =>
    [10, 30, 60].map((min) => ({
      id: `${tier}-${min}`,
      name: `${tier} ${min} min`,
      averagingMin: min,
    })),
  ),
  ...(["ERPG-1", "ERPG-2", "ERPG-3"] as const).map((tier) => ({
    id: tier,
    name: tier,
    averagingMin: 60,
  })),
  { id: "IDLH", name: "IDLH worker escape value", averagingMin: 30 },
];

/** Apply a template to a limit: name and averaging time only; the value stays what the user typed. */
export function applyTemplate(limit: LimitForm, templateId: string): LimitForm {
  const t = LIMIT_TEMPLATES.find((x) => x.id === templateId);
  if (!t) return limit;
  return { ...limit, name: t.name, averagingMin: String(t.averagingMin) };
}

export interface BuildContext {
  /** ISO 8601 time of the estimate (the UI's clock), used with sky "sun". */
  timeIso: string;
}

export type BuildResult =
  | { ok: true; scenario: Scenario; problems: [] }
  | { ok: false; scenario: null; problems: FieldProblem[] };

function quote(text: string): string {
  const t = text.trim();
  return t.length > 24 ? `'${t.slice(0, 21)}...'` : `'${t}'`;
}

/**
 * Form state → Scenario (SI units, core JSON names), or the problems that stop it.
 * Only parsing and unit conversion happen here; every range check is the core's.
 */
export function buildScenario(form: FormState, ctx: BuildContext): BuildResult {
  const r = build(form, ctx, false);
  return r.problems.length === 0 && r.scenario
    ? { ok: true, scenario: r.scenario, problems: [] }
    : { ok: false, scenario: null, problems: r.problems };
}

/**
 * Like `buildScenario`, but a field that cannot be read is replaced by a harmless
 * stand-in (1, or 0° for the wind direction) so the core can still check every
 * other field. The stand-in scenario is for validation only, never for figures.
 */
export function buildForChecking(
  form: FormState,
  ctx: BuildContext,
): { scenario: Scenario | null; problems: FieldProblem[] } {
  return build(form, ctx, true);
}

function build(
  form: FormState,
  ctx: BuildContext,
  lenient: boolean,
): { scenario: Scenario | null; problems: FieldProblem[] } {
  const problems: FieldProblem[] = [];
  const standIn = (required: boolean) => (lenient && required ? 1 : undefined);

  const num = (id: string, text: string, required: boolean): number | undefined => {
    const v = parseNumber(text);
    if (v === undefined) {
      problems.push({ field: id, message: `${fieldLabel(id)}: ${quote(text)} is not a number` });
      return standIn(required);
    }
    if (v === null) {
      if (required) problems.push({ field: id, message: `${fieldLabel(id)}: enter a value` });
      return standIn(required);
    }
    return v;
  };

  let release: Scenario["release"] | undefined;
  const heightV = num(FIELD.height, form.height, false);
  const height_m = heightV === undefined ? undefined : lengthToM(heightV, form.heightUnit);
  let hot: Scenario["release"]["hot"];
  let airK: number | undefined;
  if (form.hotOn) {
    const air = num(FIELD.airTemp, form.airTemp, false);
    if (air !== undefined) airK = temperatureToK(air, form.gasTempUnit);
    const sp = num(FIELD.exitSpeed, form.exitSpeed, true);
    const d = num(FIELD.diameter, form.diameter, true);
    const t = num(FIELD.gasTemp, form.gasTemp, true);
    if (sp !== undefined && d !== undefined && t !== undefined) {
      hot = {
        exit_speed_m_s: sp,
        diameter_m: lengthToM(d, form.diameterUnit),
        gas_temperature_k: temperatureToK(t, form.gasTempUnit),
      };
    }
  }
  const common = {
    ...(height_m !== undefined ? { height_m } : {}),
    ...(form.heavyOrCold ? { heavy_or_cold: true } : {}),
    ...(hot ? { hot } : {}),
  };
  if (form.kind === "continuous") {
    const rate = num(FIELD.rate, form.rate, true);
    // An empty duration means an ongoing release.
    const dur = num(FIELD.duration, form.duration, false);
    if (rate !== undefined && (parseNumber(form.duration) === null || dur !== undefined)) {
      release = {
        kind: "continuous",
        rate_g_s: rateToGPerS(rate, form.rateUnit),
        ...(dur !== undefined ? { duration_s: timeToS(dur, form.durationUnit) } : {}),
        ...common,
      };
    }
  } else {
    const mass = num(FIELD.mass, form.mass, true);
    if (mass !== undefined) {
      release = { kind: "instantaneous", mass_g: massToG(mass, form.massUnit), ...common };
    }
  }

  const ws = num(FIELD.windSpeed, form.windSpeed, true);
  const wh = num(FIELD.windHeight, form.windHeight, false);
  const typedDir = parseDirection(form.windFrom);
  const dir = typeof typedDir === "number" ? typedDir : lenient ? 0 : typedDir;
  if (typedDir === undefined) {
    problems.push({
      field: FIELD.windFrom,
      message: `Wind from: ${quote(form.windFrom)} is not degrees or a compass point (N, NNE … NNW)`,
    });
  } else if (typedDir === null) {
    problems.push({
      field: FIELD.windFrom,
      message: "Wind from: enter degrees or a compass point",
    });
  }
  const swing = num(FIELD.windSwing, form.windSwing, false);
  const nz = num(FIELD.nearZone, form.nearZone, false);
  const zr = num(FIELD.receptorHeight, form.receptorHeight, false);
  const mix = num(FIELD.mixingHeight, form.mixingHeight, false);
  const usesPpm = form.limits.some((l) => l.unit === "ppm");
  let mw = num(FIELD.molecularWeight, form.molecularWeight, false);
  if (usesPpm && mw === undefined && parseNumber(form.molecularWeight) === null) {
    problems.push({
      field: FIELD.molecularWeight,
      message: "Molecular weight: needed to convert ppm limits (g/mol)",
    });
  }
  if (usesPpm && mw === undefined && lenient) mw = 1;

  if (form.limits.length === 0) {
    problems.push({ field: FIELD.limits, message: "Limits: add at least one limit" });
  }
  const limits: Scenario["limits"] = [];
  form.limits.forEach((l, i) => {
    const value = num(limitFieldId(i, "value"), l.value, true);
    const avg = num(limitFieldId(i, "avg"), l.averagingMin, true);
    const label = l.name.trim() || `Limit ${i + 1}`;
    if (value !== undefined && avg !== undefined) {
      limits.push({ label, value, unit: l.unit, averaging_s: timeToS(avg, "min") });
    }
  });
  const labels = form.limits.map((l, i) => l.name.trim() || `Limit ${i + 1}`);
  labels.forEach((label, i) => {
    if (labels.indexOf(label) !== i) {
      problems.push({
        field: limitFieldId(i, "name"),
        message: `${fieldLabel(limitFieldId(i, "name"))}: '${label}' is already used by another limit; give each a different name`,
      });
    }
  });

  const latV = num(FIELD.lat, form.lat, false);
  const lonV = num(FIELD.lon, form.lon, false);
  const latEmpty = parseNumber(form.lat) === null;
  const lonEmpty = parseNumber(form.lon) === null;
  if (latEmpty !== lonEmpty) {
    const missing = latEmpty ? FIELD.lat : FIELD.lon;
    problems.push({
      field: missing,
      message: `${fieldLabel(missing)}: enter both latitude and longitude, or neither`,
    });
  }

  if ((problems.length > 0 && !lenient) || !release || ws === undefined || dir == null) {
    return { scenario: null, problems };
  }
  const weather: Scenario["weather"] = {
    wind_speed_m_s: speedToMPerS(ws, form.windSpeedUnit),
    wind_from_deg: dir,
    stability: form.stability,
    sky: form.sky,
    terrain: form.terrain,
    ...(wh !== undefined ? { wind_height_m: lengthToM(wh, form.windHeightUnit) } : {}),
    ...(mix !== undefined ? { mixing_height_m: lengthToM(mix, form.mixingHeightUnit) } : {}),
    ...(airK !== undefined ? { air_temperature_k: airK } : {}),
    ...(form.stability === "auto" ? { time: ctx.timeIso } : {}),
  };
  const scenario: Scenario = {
    release,
    weather,
    limits,
    ...(mw !== undefined ? { molecular_weight_g_mol: mw } : {}),
    ...(swing !== undefined ? { wind_swing_deg: swing } : {}),
    ...(nz !== undefined ? { near_zone_m: nz } : {}),
    ...(zr !== undefined ? { receptor_height_m: zr } : {}),
    ...(form.scheme !== "briggs" ? { sigma_scheme: form.scheme } : {}),
    ...(latV !== undefined && lonV !== undefined ? { source: { lat: latV, lon: lonV } } : {}),
    ...(form.limitSet ? { limit_set: form.limitSet } : {}),
  };
  return { scenario, problems };
}

/** Map one core problem path (e.g. `limits[1].value`) to the input id that holds it. */
export function fieldForPath(path: string): string {
  const lim = /^limits\[(\d+)\](?:\.(\w+))?/.exec(path);
  if (lim) {
    const i = Number(lim[1]);
    const part = lim[2];
    if (part === "label") return limitFieldId(i, "name");
    if (part === "unit") return limitFieldId(i, "unit");
    if (part === "averaging_s") return limitFieldId(i, "avg");
    return limitFieldId(i, "value");
  }
  const table: [RegExp, string][] = [
    [/^release\.rate_g_s/, FIELD.rate],
    [/^release\.duration_s/, FIELD.duration],
    [/^release\.mass_g/, FIELD.mass],
    [/^release\.height_m/, FIELD.height],
    [/^release\.hot\.exit_speed/, FIELD.exitSpeed],
    [/^release\.hot\.diameter/, FIELD.diameter],
    [/^release\.hot\.gas_temperature/, FIELD.gasTemp],
    [/^release\.hot/, FIELD.exitSpeed],
    [/^weather\.air_temperature/, FIELD.airTemp],
    [/^release/, FIELD.rate],
    [/^weather\.wind_speed/, FIELD.windSpeed],
    [/^weather\.wind_height/, FIELD.windHeight],
    [/^weather\.wind_from/, FIELD.windFrom],
    [/^weather\.stability/, FIELD.stability],
    [/^weather\.(sky|time)/, FIELD.sky],
    [/^weather\.terrain/, FIELD.terrain],
    [/^weather\.mixing_height/, FIELD.mixingHeight],
    [/^molecular_weight/, FIELD.molecularWeight],
    [/^wind_swing/, FIELD.windSwing],
    [/^near_zone/, FIELD.nearZone],
    [/^receptor_height/, FIELD.receptorHeight],
    [/^sigma_scheme/, FIELD.scheme],
    [/^source\.lon/, FIELD.lon],
    [/^source/, FIELD.lat],
    [/^limits/, FIELD.limits],
  ];
  for (const [re, id] of table) if (re.test(path)) return id;
  return "";
}

/** The core's problems, re-addressed to inputs and prefixed with the input's visible label. */
export function problemsFromCore(problems: readonly ScenarioProblem[]): FieldProblem[] {
  return problems.map((p) => {
    const field = fieldForPath(p.field);
    const name = field ? fieldLabel(field) : p.field;
    return { field, message: `${name}: ${p.message}` };
  });
}

const tidy = (v: number) => String(roundSig(v, 6));

/**
 * A scenario (from the demo file or a logged estimate) → form state, in the
 * form's default units where they read naturally. Inverse of `buildScenario`
 * up to rounding to 6 significant figures.
 */
export function formFromScenario(s: Scenario): FormState {
  const f = initialForm();
  const r = s.release;
  f.heavyOrCold = Boolean(r.heavy_or_cold);
  f.height = tidy(lengthFromM(r.height_m ?? 0, "m"));
  if (r.kind === "continuous") {
    f.kind = "continuous";
    const kgS = rateFromGPerS(r.rate_g_s, "kg/s");
    f.rateUnit = kgS >= 0.1 ? "kg/s" : "g/s";
    f.rate = tidy(rateFromGPerS(r.rate_g_s, f.rateUnit));
    if (r.duration_s !== undefined) {
      f.durationUnit = "min";
      f.duration = tidy(timeFromS(r.duration_s, "min"));
    }
  } else {
    f.kind = "instantaneous";
    f.massUnit = massFromG(r.mass_g, "kg") >= 0.1 ? "kg" : "g";
    f.mass = tidy(massFromG(r.mass_g, f.massUnit));
  }
  if (r.hot) {
    f.hotOn = true;
    f.exitSpeed = tidy(r.hot.exit_speed_m_s);
    f.diameter = tidy(r.hot.diameter_m);
    f.gasTemp = tidy(temperatureFromK(r.hot.gas_temperature_k, "°C"));
    const air = s.weather.air_temperature_k;
    f.airTemp = air === undefined ? "" : tidy(temperatureFromK(air, "°C"));
  }
  const w = s.weather;
  f.windSpeedUnit = "m/s";
  f.windSpeed = tidy(speedFromMPerS(w.wind_speed_m_s, "m/s"));
  f.windHeight = tidy(w.wind_height_m ?? 10);
  f.windFrom = tidy(w.wind_from_deg);
  f.stability = w.stability;
  if (w.sky) f.sky = w.sky;
  f.terrain = w.terrain ?? "open";
  f.mixingHeight = w.mixing_height_m === undefined ? "" : tidy(w.mixing_height_m);
  f.molecularWeight = s.molecular_weight_g_mol === undefined ? "" : tidy(s.molecular_weight_g_mol);
  f.windSwing = tidy(s.wind_swing_deg ?? 0);
  f.nearZone = tidy(s.near_zone_m ?? 100);
  f.receptorHeight = tidy(s.receptor_height_m ?? 1.5);
  f.scheme = s.sigma_scheme ?? "briggs";
  f.limits = s.limits.map((l) => ({
    name: l.label,
    value: tidy(l.value),
    unit: l.unit,
    averagingMin: tidy(timeFromS(l.averaging_s, "min")),
  }));
  f.limitSet = s.limit_set ?? null;
  f.lat = s.source ? String(roundSig(s.source.lat, 9)) : "";
  f.lon = s.source ? String(roundSig(s.source.lon, 9)) : "";
  return f;
}

/** Problems grouped by input id ("" = not tied to one input). */
export type ProblemsByField = Record<string, string[]>;

export function groupProblems(problems: readonly FieldProblem[]): ProblemsByField {
  const out: ProblemsByField = {};
  for (const p of problems) {
    const list = out[p.field] ?? [];
    list.push(p.message);
    out[p.field] = list;
  }
  return out;
}
