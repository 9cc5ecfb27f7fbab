import type { FormState, ProblemsByField } from "../form.ts";
import type { Action } from "../store.ts";

/** What every input section receives: the form, a way to change it, and its problems. */
export interface SectionProps {
  form: FormState;
  dispatch: (a: Action) => void;
  errors: ProblemsByField;
}

/** Shorthand for a "set one form key" change handler. */
export const setter =
  (dispatch: (a: Action) => void) =>
  <K extends keyof FormState>(key: K) =>
  (value: FormState[K]) =>
    dispatch({ type: "set", key, value });
