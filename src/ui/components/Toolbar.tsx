import type { Theme } from "../store.ts";
import type { UnitSystem } from "../units.ts";

export function Toolbar(p: {
  theme: Theme;
  units: UnitSystem;
  onTheme: () => void;
  onUnits: () => void;
  onDemo: () => void;
  onClear: () => void;
}) {
  return (
    <nav class="toolbar" aria-label="Screen settings">
      <button type="button" onClick={p.onTheme} aria-pressed={p.theme === "night"}>
        Night theme
      </button>
      <button type="button" onClick={p.onUnits} aria-pressed={p.units === "us"}>
        US units
      </button>
      <button type="button" onClick={p.onDemo}>
        Demo
      </button>
      <button type="button" onClick={p.onClear}>
        New estimate
      </button>
      <a class="button-link" href="#results-title">
        To results
      </a>
    </nav>
  );
}
