import type { ComponentChildren } from "preact";
import type { LimitUnit } from "../../core/types.ts";
import { FIELD, LIMIT_TEMPLATES, limitFieldId } from "../form.ts";
import { FieldError, type Option, TextField } from "./Field.tsx";
import { type SectionProps, setter } from "./types.ts";

const UNIT_OPTIONS: Option<LimitUnit>[] = [
  { value: "ppm", label: "ppm" },
  { value: "mg/m3", label: "mg/m³" },
];

export function LimitsSection({
  form,
  dispatch,
  errors,
  sets,
}: SectionProps & { sets?: ComponentChildren }) {
  const set = setter(dispatch);
  const usesPpm = form.limits.some((l) => l.unit === "ppm");
  return (
    <fieldset class="section">
      <legend>Limits</legend>
      <p class="hint">
        Enter each limit from your agency's sources. Tier names fill the name and averaging time
        only, never a value.
      </p>
      {sets}
      <FieldError id={FIELD.limits} messages={errors[FIELD.limits]} />
      {form.limits.map((limit, i) => {
        const n = i + 1;
        const templateId = `limit-${i}-template`;
        return (
          <fieldset class="limit" key={i}>
            <legend>Limit {n}</legend>
            <div class="field">
              <label for={templateId}>Fill from tier name</label>
              <select
                id={templateId}
                value=""
                onChange={(e) => {
                  const v = (e.currentTarget as HTMLSelectElement).value;
                  if (v) dispatch({ type: "template", index: i, templateId: v });
                }}
              >
                <option value="">Choose a tier…</option>
                {LIMIT_TEMPLATES.map((t) => (
                  <option key={t.id} value={t.id}>
                    {t.name} ({t.averagingMin} min)
                  </option>
                ))}
              </select>
            </div>
            <TextField
              id={limitFieldId(i, "name")}
              label="Limit name"
              value={limit.name}
              decimal={false}
              onInput={(v) => dispatch({ type: "setLimit", index: i, patch: { name: v } })}
              errors={errors[limitFieldId(i, "name")]}
            />
            <TextField
              id={limitFieldId(i, "value")}
              label="Limit value"
              value={limit.value}
              onInput={(v) => dispatch({ type: "setLimit", index: i, patch: { value: v } })}
              errors={errors[limitFieldId(i, "value")]}
              unitPart={{
                unitId: limitFieldId(i, "unit"),
                unitLabel: "Unit",
                unit: limit.unit,
                units: UNIT_OPTIONS,
                onUnit: (u) => dispatch({ type: "setLimit", index: i, patch: { unit: u } }),
              }}
            />
            <FieldError id={limitFieldId(i, "unit")} messages={errors[limitFieldId(i, "unit")]} />
            <TextField
              id={limitFieldId(i, "avg")}
              label="Averaging time"
              value={limit.averagingMin}
              onInput={(v) => dispatch({ type: "setLimit", index: i, patch: { averagingMin: v } })}
              errors={errors[limitFieldId(i, "avg")]}
              suffix="min"
            />
            <button
              type="button"
              class="secondary"
              onClick={() => dispatch({ type: "removeLimit", index: i })}
            >
              Remove limit {n}
            </button>
          </fieldset>
        );
      })}
      <button type="button" class="secondary" onClick={() => dispatch({ type: "addLimit" })}>
        Add limit
      </button>
      <TextField
        id={FIELD.molecularWeight}
        label="Molecular weight"
        value={form.molecularWeight}
        onInput={set("molecularWeight")}
        errors={errors[FIELD.molecularWeight]}
        suffix="g/mol"
        hint={
          usesPpm
            ? "Needed to convert ppm to mg/m³ (at 25 °C, 1 atm). Above 29 g/mol the gas is heavier than air."
            : "Optional with mg/m³ limits. Above 29 g/mol the gas is heavier than air."
        }
      />
    </fieldset>
  );
}
