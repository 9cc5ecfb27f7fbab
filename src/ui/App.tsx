import { useCallback, useEffect, useMemo, useReducer, useRef, useState } from "preact/hooks";
import { ScenarioError } from "../core/errors.ts";
import { estimateLocal } from "../core/estimate.ts";
import type { EstimateOutput, Scenario } from "../core/types.ts";
import { CautionBanner } from "./components/CautionBanner.tsx";
import { LimitsSection } from "./components/LimitsSection.tsx";
import { ModelSection } from "./components/ModelSection.tsx";
import { PlaceSection, type PositionFix } from "./components/PlaceSection.tsx";
import { ReleaseSection } from "./components/ReleaseSection.tsx";
import { Results } from "./components/Results.tsx";
import { Toolbar } from "./components/Toolbar.tsx";
import { WeatherSection } from "./components/WeatherSection.tsx";
import {
  DeferredAboutPage,
  DeferredCentrelineChart,
  DeferredLimitSetPanel,
  DeferredLogSection,
  DeferredMapPart,
} from "./deferred.tsx";
import { DEMO_SCENARIO } from "./demo.ts";
import { type Evaluation, evaluate, readForm, settle } from "./evaluate.ts";
import { groupProblems } from "./form.ts";
import { bandStyles } from "./palette.ts";
import {
  initialScreen,
  loadTheme,
  loadUnits,
  reduce,
  saveScreen,
  saveTheme,
  saveUnits,
  type Theme,
} from "./store.ts";
import { suggestionFor } from "./suggestion.ts";
import type { UnitSystem } from "./units.ts";
import "./style.css";

const nowIso = () => new Date().toISOString();
/** More limits than this and even the first estimate is left to the worker. */
const FIRST_ON_PAGE_MAX_LIMITS = 10;

/** Pause after the last keystroke before recomputing (ms). */
const TYPING_PAUSE_MS = 60;

/**
 * Runs estimates off the main thread (src/app/worker), latest wins. Errors are told apart by
 * name: "EstimateCancelled" (a newer one superseded it: ignore) and "EstimateTimeout" (the
 * solve was stopped: keep the previous result, marked out of date).
 */
export interface AsyncEstimator {
  run(scenario: Scenario, options?: { geojson?: boolean }): Promise<EstimateOutput>;
  dispose(): void;
}

export interface AppProps {
  /** Makes the off-thread estimator, on the first change after start. Absent: estimate here. */
  makeEstimator?: () => AsyncEstimator;
}

const SLOW_PROBLEM = {
  field: "",
  message:
    "These inputs take too long to estimate and the estimate was stopped. Showing the last one; " +
    "try fewer limits or a smaller wind swing.",
};

export function App({ makeEstimator }: AppProps = {}) {
  const [screen, dispatch] = useReducer(reduce, undefined, () => initialScreen(DEMO_SCENARIO));
  const [theme, setTheme] = useState<Theme>(loadTheme);
  const [units, setUnits] = useState<UnitSystem>(loadUnits);
  const [view, setView] = useState<"main" | "about">("main");
  const [positionFix, setPositionFix] = useState<PositionFix | null>(null);
  const previous = useRef<Evaluation["last"]>(null);
  const estimator = useRef<AsyncEstimator | null>(null);
  const show = (ev: Evaluation) => {
    previous.current = ev.last;
    setEvaluation(ev);
  };
  // The first estimate is computed here, so the first screen shows it without waiting for a
  // worker — unless the restored inputs are heavy (many limits), which go to the worker too.
  const firstInWorker = useRef(
    makeEstimator !== undefined && screen.form.limits.length > FIRST_ON_PAGE_MAX_LIMITS,
  );
  const [evaluation, setEvaluation] = useState<Evaluation>(() => {
    if (firstInWorker.current) return { last: null, stale: false, problems: [] };
    const ev = evaluate(screen.form, { timeIso: nowIso() }, estimateLocal, null);
    previous.current = ev.last;
    return ev;
  });
  const recompute = (form: typeof screen.form) => {
    const r = readForm(form, { timeIso: nowIso() }, previous.current);
    if (!r.ready) return show(r.evaluation);
    if (!makeEstimator) {
      return show(evaluate(form, { timeIso: nowIso() }, estimateLocal, previous.current));
    }
    estimator.current ??= makeEstimator();
    estimator.current.run(r.scenario, { geojson: false }).then(
      (output) => show(settle(r.scenario, { output }, previous.current)),
      (error: unknown) => {
        const name = error instanceof Error ? error.name : "";
        if (name === "EstimateCancelled") return;
        if (name === "EstimateTimeout") {
          return show({
            last: previous.current,
            stale: previous.current !== null,
            problems: [SLOW_PROBLEM],
          });
        }
        if (error instanceof ScenarioError)
          return show(settle(r.scenario, { error }, previous.current));
        // The worker itself failed: estimate here instead.
        show(evaluate(form, { timeIso: nowIso() }, estimateLocal, previous.current));
      },
    );
  };
  useEffect(() => () => estimator.current?.dispose(), []);
  const firstRun = useRef(true);
  // Recompute as the user types; a short pause coalesces keystrokes so typing never lags.
  useEffect(() => {
    if (firstRun.current) {
      firstRun.current = false;
      if (firstInWorker.current) recompute(screen.form);
      return;
    }
    const timer = setTimeout(() => recompute(screen.form), TYPING_PAUSE_MS);
    return () => clearTimeout(timer);
  }, [screen.form]);

  useEffect(() => saveScreen(screen), [screen]);
  useEffect(() => {
    document.documentElement.dataset.theme = theme;
    saveTheme(theme);
  }, [theme]);
  useEffect(() => saveUnits(units), [units]);
  // A new view starts at its top.
  useEffect(() => window.scrollTo(0, 0), [view]);

  const last = evaluation.last;
  const errors = groupProblems(evaluation.problems);
  const styles = useMemo(
    () => bandStyles(last?.output.bands.map((b) => b.limit_mg_m3) ?? []),
    [last],
  );
  const suggestion = useMemo(() => suggestionFor(screen.form, nowIso()), [screen.form]);
  const loadScenario = useCallback(
    (s: Scenario) => dispatch({ type: "load", scenario: s, origin: "user" }),
    [],
  );
  // The results and the log change only with a new estimate (or units, or a position fix), not
  // with each keystroke: keep their elements so typing re-renders the form alone.
  const stale = evaluation.stale;
  const resultsView = useMemo(() => {
    if (!last)
      return <p>Enter the release, weather and at least one limit to see the footprint.</p>;
    const src = last.scenario.source;
    const placeText = src
      ? `Source at ${Math.abs(src.lat)}° ${src.lat < 0 ? "S" : "N"}, ${Math.abs(src.lon)}° ${src.lon < 0 ? "W" : "E"}.`
      : "No place given: drawn relative to the source.";
    const ongoing =
      last.scenario.release.kind === "continuous" && last.scenario.release.duration_s === undefined;
    return (
      <>
        <DeferredMapPart
          scenario={last.scenario}
          output={last.output}
          styles={styles}
          units={units}
          placeText={placeText}
          night={theme === "night"}
          position={positionFix}
          onPutSource={(lat, lon) => dispatch({ type: "place", lat, lon })}
          onFix={setPositionFix}
        />
        <Results
          output={last.output}
          units={units}
          ongoing={ongoing}
          styles={styles}
          limits={last.scenario.limits}
        />
        <DeferredCentrelineChart
          scenario={last.scenario}
          output={last.output}
          styles={styles}
          units={units}
        />
      </>
    );
  }, [last, styles, units, theme, positionFix]);
  const logView = useMemo(
    () => (
      <DeferredLogSection
        scenario={stale ? null : (last?.scenario ?? null)}
        result={stale ? null : (last?.output ?? null)}
        onReopen={loadScenario}
        positionFix={positionFix}
        units={units}
      />
    ),
    [stale, last, loadScenario, positionFix, units],
  );

  if (view === "about") {
    return (
      <div class="app">
        <CautionBanner onLimits={() => setView("main")} showingLimits={true} />
        <DeferredAboutPage onBack={() => setView("main")} />
      </div>
    );
  }
  return (
    <div class="app">
      <CautionBanner onLimits={() => setView("about")} showingLimits={false} />
      <main id="main">
        <h1 class="app-title">Driftmark estimate</h1>
        <Toolbar
          theme={theme}
          units={units}
          onTheme={() => setTheme(theme === "day" ? "night" : "day")}
          onUnits={() => setUnits(units === "metric" ? "us" : "metric")}
          onDemo={() => dispatch({ type: "load", scenario: DEMO_SCENARIO, origin: "demo" })}
          onClear={() => dispatch({ type: "clear" })}
        />
        {screen.origin === "demo" ? (
          <p class="demo-mark" data-testid="demo-mark">
            Invented demo scenario: not a real incident, chemical or limit values.
          </p>
        ) : screen.origin === "demo-edited" ? (
          <p class="demo-mark" data-testid="demo-mark">
            Started from the invented demo scenario: check every value.
          </p>
        ) : null}
        <form class="inputs" onSubmit={(e) => e.preventDefault()} noValidate>
          <ReleaseSection form={screen.form} dispatch={dispatch} errors={errors} />
          <WeatherSection
            form={screen.form}
            dispatch={dispatch}
            errors={errors}
            suggestion={suggestion}
          />
          <LimitsSection
            form={screen.form}
            dispatch={dispatch}
            errors={errors}
            sets={<DeferredLimitSetPanel form={screen.form} dispatch={dispatch} />}
          />
          <PlaceSection
            form={screen.form}
            dispatch={dispatch}
            errors={errors}
            units={units}
            onFix={setPositionFix}
          />
          <ModelSection form={screen.form} dispatch={dispatch} errors={errors} />
        </form>
        <section
          class={`results-section${evaluation.stale ? " is-stale" : ""}`}
          aria-labelledby="results-title"
        >
          <h2 id="results-title">Estimate</h2>
          {evaluation.problems.length > 0 ? (
            <div class="problems" role="alert">
              <p>Fix the marked fields to update the estimate:</p>
              <ul>
                {evaluation.problems.map((p) => (
                  <li key={`${p.field}-${p.message}`}>
                    {p.field ? <a href={`#${p.field}`}>{p.message}</a> : p.message}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
          {evaluation.stale ? (
            <p class="stale-mark" data-testid="stale">
              Out of date: showing the last valid estimate, not the inputs now on screen.
            </p>
          ) : null}
          {resultsView}
        </section>
        {logView}
      </main>
    </div>
  );
}
