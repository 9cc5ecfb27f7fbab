/**
 * Screen state: the form, how it came to be (demo or not), and the user's
 * display preferences. A reducer of plain actions, so every change is one
 * named step; preferences persist in localStorage.
 */
import type { Scenario } from "../core/types.ts";
import {
  applyTemplate,
  emptyLimit,
  type FormState,
  formFromScenario,
  initialForm,
  type LimitForm,
} from "./form.ts";
import type { UnitSystem } from "./units.ts";

export type Theme = "day" | "night";
export type Origin = "demo" | "demo-edited" | "user";

export interface ScreenState {
  form: FormState;
  origin: Origin;
}

export type Action =
  | { type: "set"; key: keyof FormState; value: FormState[keyof FormState] }
  | { type: "setLimit"; index: number; patch: Partial<LimitForm> }
  | { type: "addLimit" }
  | { type: "removeLimit"; index: number }
  | { type: "template"; index: number; templateId: string }
  | { type: "load"; scenario: Scenario; origin: Origin }
  | { type: "place"; lat: string; lon: string }
  | { type: "clear" };

const edited = (o: Origin): Origin => (o === "demo" ? "demo-edited" : o);

export function reduce(state: ScreenState, action: Action): ScreenState {
  const f = state.form;
  switch (action.type) {
    case "set":
      return { form: { ...f, [action.key]: action.value }, origin: edited(state.origin) };
    case "setLimit":
      return {
        form: {
          ...f,
          limits: f.limits.map((l, i) => (i === action.index ? { ...l, ...action.patch } : l)),
        },
        origin: edited(state.origin),
      };
    case "addLimit":
      return { form: { ...f, limits: [...f.limits, emptyLimit()] }, origin: edited(state.origin) };
    case "removeLimit":
      return {
        form: { ...f, limits: f.limits.filter((_, i) => i !== action.index) },
        origin: edited(state.origin),
      };
    case "template":
      return {
        form: {
          ...f,
          limits: f.limits.map((l, i) =>
            i === action.index ? applyTemplate(l, action.templateId) : l,
          ),
        },
        origin: edited(state.origin),
      };
    case "place":
      return { form: { ...f, lat: action.lat, lon: action.lon }, origin: edited(state.origin) };
    case "load":
      return { form: formFromScenario(action.scenario), origin: action.origin };
    case "clear":
      return { form: initialForm(), origin: "user" };
  }
}

const KEY_THEME = "driftmark.theme";
const KEY_UNITS = "driftmark.units";
const KEY_SCREEN = "driftmark.screen";

function read(key: string): string | null {
  try {
    return globalThis.localStorage?.getItem(key) ?? null;
  } catch {
    return null;
  }
}
function write(key: string, value: string): void {
  try {
    globalThis.localStorage?.setItem(key, value);
  } catch {
    // Private mode or storage full: the preference just is not remembered.
  }
}

export const loadTheme = (): Theme => (read(KEY_THEME) === "night" ? "night" : "day");
export const saveTheme = (t: Theme) => write(KEY_THEME, t);
export const loadUnits = (): UnitSystem => (read(KEY_UNITS) === "us" ? "us" : "metric");
export const saveUnits = (u: UnitSystem) => write(KEY_UNITS, u);
/**
 * The screen to start with: the form as it was left on this device, or the
 * invented demo scenario on the very first start (or if the saved form is unreadable).
 */
export function initialScreen(demo: Scenario): ScreenState {
  const raw = read(KEY_SCREEN);
  if (raw) {
    try {
      const saved = JSON.parse(raw) as Partial<ScreenState>;
      if (saved.form && typeof saved.form === "object" && Array.isArray(saved.form.limits)) {
        const origin: Origin =
          saved.origin === "demo" || saved.origin === "demo-edited" ? saved.origin : "user";
        return { form: { ...initialForm(), ...saved.form }, origin };
      }
    } catch {
      // Fall through to the demo.
    }
  }
  return { form: formFromScenario(demo), origin: "demo" };
}

/** Remember the form so an app closed mid-incident comes back as it was. */
export const saveScreen = (s: ScreenState) => write(KEY_SCREEN, JSON.stringify(s));
