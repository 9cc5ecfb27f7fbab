/**
 * Parts of the screen that are not needed for the first estimate are loaded after it is on
 * screen (the log, with its storage and export code) or on demand (the model page), so the
 * first screen parses as little JavaScript as possible on a low-end phone. The chart below the
 * figures follows the same rule.
 */
import type { ComponentType } from "preact";
import { useEffect, useState } from "preact/hooks";
import { FootprintView } from "./components/FootprintView.tsx";
import type { ProfileChartProps } from "./components/ProfileChart.tsx";
import type { LimitSetPanelProps } from "./limitsets/LimitSetPanel.tsx";
import type { LogSectionProps } from "./log/LogSection.tsx";
import type { MapPartProps } from "./map/MapPart.tsx";

/** Load a component once; later calls share the same promise. */
function once<P>(load: () => Promise<ComponentType<P>>): () => Promise<ComponentType<P>> {
  let p: Promise<ComponentType<P>> | null = null;
  return () => {
    p ??= load();
    return p;
  };
}

export const loadLogSection = once<LogSectionProps>(() =>
  import("./log/LogSection.tsx").then((m) => m.LogSection),
);
export const loadCentrelineChart = once<ProfileChartProps>(() =>
  import("./components/ProfileChart.tsx").then((m) => m.ProfileChart),
);
export const loadLimitSetPanel = once<LimitSetPanelProps>(() =>
  import("./limitsets/LimitSetPanel.tsx").then((m) => m.LimitSetPanel),
);
export const loadMapPart = once<MapPartProps>(() =>
  import("./map/MapPart.tsx").then((m) => m.MapPart),
);
export const loadAboutPage = once<{ onBack: () => void }>(() =>
  import("./components/AboutPage.tsx").then((m) => m.AboutPage),
);

/** Render `load()`'s component once it is there; `fallback` until then. Starts at once, or when idle. */
function useDeferred<P>(load: () => Promise<ComponentType<P>>, whenIdle: boolean) {
  const [C, setC] = useState<ComponentType<P> | null>(null);
  useEffect(() => {
    let live = true;
    const start = () => {
      load().then(
        (c) => live && setC(() => c),
        () => live && setC(null),
      );
    };
    if (!whenIdle) start();
    else if ("requestIdleCallback" in window) window.requestIdleCallback(start, { timeout: 1000 });
    else setTimeout(start, 100);
    return () => {
      live = false;
    };
  }, [load, whenIdle]);
  return C;
}

/** The log section, loaded once the first estimate has been drawn. */
export function DeferredLogSection(props: LogSectionProps) {
  const C = useDeferred(loadLogSection, true);
  if (!C) {
    return (
      <section class="dm-log" aria-labelledby="dm-log-title">
        <h2 id="dm-log-title">Log</h2>
        <p>Opening the log…</p>
      </section>
    );
  }
  return <C {...props} />;
}

/** The "what this model cannot do" page, loaded when asked for. */
export function DeferredAboutPage(props: { onBack: () => void }) {
  const C = useDeferred(loadAboutPage, false);
  if (!C) return <p role="status">Opening…</p>;
  return <C {...props} />;
}

/**
 * The footprint area: the plain drawing first, then (when idle) the map part, which shows the map
 * when a kept map area holds the source.
 */
export function DeferredMapPart(props: Omit<MapPartProps, "plain">) {
  const C = useDeferred(loadMapPart, true);
  const plain = <FootprintView {...props} />;
  return C ? <C {...props} plain={plain} /> : plain;
}

/** The centreline chart, loaded once the first estimate has been drawn. */
export function DeferredCentrelineChart(props: ProfileChartProps) {
  const C = useDeferred(loadCentrelineChart, true);
  return C ? <C {...props} /> : null;
}

/** The "Limit set" field and the saved sets, loaded once the first estimate has been drawn. */
export function DeferredLimitSetPanel(props: LimitSetPanelProps) {
  const C = useDeferred(loadLimitSetPanel, true);
  return C ? <C {...props} /> : null;
}
