/** Between a limit set and the Limits section of the form: fill it from a set, or save it as one. */
import type { LimitSetData } from "../../storage/limit-sets.ts";
import type { FormState, LimitForm } from "../form.ts";
import type { Action } from "../store.ts";
import { parseNumber } from "../units.ts";

/** Fill the Limits section from a set: its limits, its molecular weight, and the record of it. */
export function applySet(set: LimitSetData, dispatch: (a: Action) => void): void {
  const limits: LimitForm[] = set.limits.map((l) => ({
    name: l.label,
    value: String(l.value),
    unit: l.unit,
    averagingMin: String(l.averaging_min),
  }));
  dispatch({ type: "set", key: "limits", value: limits });
  dispatch({
    type: "set",
    key: "molecularWeight",
    value: set.molecular_weight_g_mol === null ? "" : String(set.molecular_weight_g_mol),
  });
  dispatch({
    type: "set",
    key: "limitSet",
    value: { name: set.name, source_note: set.source_note },
  });
}

/** The Limits section as a set to store, or the reason it cannot be one. */
export function setFromForm(
  form: FormState,
  name: string,
  note: string,
): { ok: true; set: LimitSetData } | { ok: false; message: string } {
  const n = name.trim();
  if (!n) return { ok: false, message: "Set name: enter a name for the set" };
  if (form.limits.length === 0) return { ok: false, message: "Limits: add at least one limit" };
  const mwText = form.molecularWeight.trim();
  const mw = mwText === "" ? null : parseNumber(mwText);
  if (mw === undefined || (mw !== null && !(mw > 0 && mw <= 1000))) {
    return {
      ok: false,
      message: "Molecular weight: must be a number above 0 and at most 1000 g/mol",
    };
  }
  const limits: LimitSetData["limits"] = [];
  for (const [i, l] of form.limits.entries()) {
    const value = parseNumber(l.value);
    const avg = parseNumber(l.averagingMin);
    const label = l.name.trim() || `Limit ${i + 1}`;
    if (typeof value !== "number" || !(value > 0)) {
      return { ok: false, message: `Limit ${i + 1} value: must be a positive number` };
    }
    if (typeof avg !== "number" || avg < 1 || avg > 1440) {
      return { ok: false, message: `Limit ${i + 1} averaging time: must be 1 to 1440 min` };
    }
    if (l.unit === "ppm" && mw === null) {
      return { ok: false, message: "Molecular weight: needed for ppm limits" };
    }
    if (limits.some((x) => x.label === label)) {
      return { ok: false, message: `Limit ${i + 1} name: '${label}' is used twice` };
    }
    limits.push({ label, value, unit: l.unit, averaging_min: avg });
  }
  return {
    ok: true,
    set: { name: n, molecular_weight_g_mol: mw ?? null, limits, source_note: note.trim() },
  };
}
