/**
 * The estimate sheet (glossary): one printed page of an estimate for the incident record — the
 * caution, large and first; the footprint; each band's figures; the places to check; every input;
 * the warnings; the model version, the time stamp and the position. Content only: print.tsx puts
 * it on the page and sheet.css lays it out for A4 and US Letter.
 */
import { CAUTION } from "../../core/caution.ts";
import type { EstimateOutput, Scenario } from "../../core/types.ts";
import type { LoggedResults, Place } from "../../storage/schema.ts";
import { FootprintView } from "../components/FootprintView.tsx";
import { bandFigures, stabilityWords } from "../figures.ts";
import { bandStyles } from "../palette.ts";
import type { UnitSystem } from "../units.ts";
import { inputRows, placeRows } from "./inputs.ts";

export interface SheetProps {
  scenario: Scenario;
  /** The estimate for these inputs: drawn, and its figures shown unless `logged` is given. */
  output: EstimateOutput;
  /** The figures as logged (a log entry's sheet shows these, exactly as they were shown). */
  logged?: LoggedResults;
  /** The estimate's time stamp, ISO 8601 with the device's offset. */
  timeLocal: string;
  /** The device's position when the estimate was made, if known. */
  place: Place | null;
  note?: string;
  units: UnitSystem;
}

function stamp(iso: string): string {
  const m = /^(\d{4}-\d\d-\d\d)T(\d\d:\d\d:\d\d)(?:\.\d+)?(Z|[+-]\d\d:\d\d)$/.exec(iso);
  return m ? `${m[1]} ${m[2]} (UTC${m[3] === "Z" ? "" : m[3]})` : iso;
}

export function EstimateSheet(p: SheetProps) {
  const figures = p.logged ?? p.output;
  const s = p.scenario;
  const ongoing = s.release.kind === "continuous" && s.release.duration_s === undefined;
  const styles = bandStyles(figures.bands.map((b) => b.limit_mg_m3));
  const src = s.source;
  const placeText = src
    ? `Source at ${src.lat.toFixed(5)}, ${src.lon.toFixed(5)}.`
    : "No source position: drawn relative to the source.";
  const device = p.place
    ? `${p.place.lat.toFixed(5)}, ${p.place.lon.toFixed(5)}${p.place.accuracy_m === null ? "" : ` (±${Math.round(p.place.accuracy_m)} m)`}`
    : "not known";
  const places = placeRows(figures.points, p.units);
  return (
    <article class="dm-sheet" data-testid="estimate-sheet">
      <p class="dm-sheet-caution">{CAUTION}</p>
      <h1 class="dm-sheet-title">Driftmark estimate sheet</h1>
      <p class="dm-sheet-meta">
        <span>Time: {stamp(p.timeLocal)}</span>
        <span>
          Source position: {src ? `${src.lat.toFixed(5)}, ${src.lon.toFixed(5)}` : "not given"}
        </span>
        <span>Position logged: {device}</span>
        <span>Model version: {figures.model_version}</span>
      </p>
      {s.limit_set ? (
        <p class="dm-sheet-set">
          Limit set: {s.limit_set.name}. Source: {s.limit_set.source_note || "none given"}.
        </p>
      ) : null}
      {p.note ? <p class="dm-sheet-note">Note: {p.note}</p> : null}
      <div class="dm-sheet-main">
        <div class="dm-sheet-map">
          <FootprintView output={p.output} styles={styles} units={p.units} placeText={placeText} />
        </div>
        <div class="dm-sheet-bands">
          <h2>Bands</h2>
          <p>{stabilityWords(figures.stability_used, figures.stability_reason)}</p>
          {figures.bands.map((b, i) => (
            <section key={b.label} class="dm-sheet-band">
              <h3>{b.label}</h3>
              <dl>
                {bandFigures(b, p.units, ongoing, s.limits[i]).map((f) => (
                  <div key={f.key}>
                    <dt>{f.label}</dt>
                    <dd data-testid={f.key === "reach" ? `sheet-reach-${i}` : undefined}>
                      {f.value}
                    </dd>
                  </div>
                ))}
              </dl>
            </section>
          ))}
        </div>
      </div>
      <section class="dm-sheet-places">
        <h2>Places to check</h2>
        {places.length === 0 ? (
          <p>None given.</p>
        ) : (
          <ul>
            {places.map((r) => (
              <li key={r.label}>
                {r.label}: {r.value}
              </li>
            ))}
          </ul>
        )}
      </section>
      <section class="dm-sheet-warnings">
        <h2>Model limits</h2>
        {figures.warnings.length === 0 ? (
          <p>None raised.</p>
        ) : (
          <ul>
            {figures.warnings.map((w) => (
              <li key={`${w.code}-${w.limit ?? ""}-${w.point ?? ""}`}>{w.message}</li>
            ))}
          </ul>
        )}
      </section>
      <section class="dm-sheet-inputs">
        <h2>Inputs</h2>
        <dl>
          {inputRows(s, p.units).map((r) => (
            <div key={r.label}>
              <dt>{r.label}</dt>
              <dd>{r.value}</dd>
            </div>
          ))}
        </dl>
      </section>
      <p class="dm-sheet-foot">
        {CAUTION}. Printed from Driftmark, model {figures.model_version}.
      </p>
    </article>
  );
}
