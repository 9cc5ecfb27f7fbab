import { FIELD } from "../form.ts";
import {
  LENGTH_UNITS,
  MASS_UNITS,
  RATE_UNITS,
  TEMPERATURE_UNITS,
  TIME_UNITS,
  type TimeUnit,
} from "../units.ts";
import { CheckField, plainOptions, TextField } from "./Field.tsx";
import { type SectionProps, setter } from "./types.ts";

const TIME_OPTIONS = TIME_UNITS.map((u: TimeUnit) => ({
  value: u,
  label: { s: "s", min: "min", h: "h" }[u],
}));

export function ReleaseSection({ form, dispatch, errors }: SectionProps) {
  const set = setter(dispatch);
  return (
    <fieldset class="section">
      <legend>Release</legend>
      <div class="segmented" role="radiogroup" aria-label="Kind of release">
        <div class="seg">
          <input
            type="radio"
            id="kind-continuous"
            name="kind"
            checked={form.kind === "continuous"}
            onChange={() => set("kind")("continuous")}
          />
          <label for="kind-continuous">Continuous</label>
        </div>
        <div class="seg">
          <input
            type="radio"
            id="kind-instantaneous"
            name="kind"
            checked={form.kind === "instantaneous"}
            onChange={() => set("kind")("instantaneous")}
          />
          <label for="kind-instantaneous">All at once</label>
        </div>
      </div>
      {form.kind === "continuous" ? (
        <>
          <TextField
            id={FIELD.rate}
            label="Release rate"
            value={form.rate}
            onInput={set("rate")}
            errors={errors[FIELD.rate]}
            unitPart={{
              unitId: "rate-unit",
              unitLabel: "Rate unit",
              unit: form.rateUnit,
              units: plainOptions(RATE_UNITS),
              onUnit: set("rateUnit"),
            }}
          />
          <TextField
            id={FIELD.duration}
            label="Duration"
            value={form.duration}
            onInput={set("duration")}
            errors={errors[FIELD.duration]}
            hint={form.duration.trim() === "" ? "Empty: ongoing, no known end." : undefined}
            placeholder="ongoing"
            unitPart={{
              unitId: "duration-unit",
              unitLabel: "Time unit",
              unit: form.durationUnit,
              units: TIME_OPTIONS,
              onUnit: set("durationUnit"),
            }}
          />
        </>
      ) : (
        <TextField
          id={FIELD.mass}
          label="Mass released"
          value={form.mass}
          onInput={set("mass")}
          errors={errors[FIELD.mass]}
          unitPart={{
            unitId: "mass-unit",
            unitLabel: "Mass unit",
            unit: form.massUnit,
            units: plainOptions(MASS_UNITS),
            onUnit: set("massUnit"),
          }}
        />
      )}
      <TextField
        id={FIELD.height}
        label="Release height"
        value={form.height}
        onInput={set("height")}
        errors={errors[FIELD.height]}
        hint="Above the ground."
        unitPart={{
          unitId: "height-unit",
          unitLabel: "Height unit",
          unit: form.heightUnit,
          units: plainOptions(LENGTH_UNITS),
          onUnit: set("heightUnit"),
        }}
      />
      <CheckField
        id="heavy-or-cold"
        label="Heavier than air, cold or pressurised"
        checked={form.heavyOrCold}
        onChange={set("heavyOrCold")}
      />
      <CheckField
        id="hot-on"
        label="Hot release (vent or fire)"
        checked={form.hotOn}
        onChange={set("hotOn")}
      />
      {form.hotOn ? (
        <div class="subsection">
          <TextField
            id={FIELD.exitSpeed}
            label="Exit speed"
            value={form.exitSpeed}
            onInput={set("exitSpeed")}
            errors={errors[FIELD.exitSpeed]}
            suffix="m/s"
          />
          <TextField
            id={FIELD.diameter}
            label="Vent diameter"
            value={form.diameter}
            onInput={set("diameter")}
            errors={errors[FIELD.diameter]}
            unitPart={{
              unitId: "diameter-unit",
              unitLabel: "Diameter unit",
              unit: form.diameterUnit,
              units: plainOptions(LENGTH_UNITS),
              onUnit: set("diameterUnit"),
            }}
          />
          <TextField
            id={FIELD.gasTemp}
            label="Gas temperature"
            value={form.gasTemp}
            onInput={set("gasTemp")}
            errors={errors[FIELD.gasTemp]}
            decimal={false}
            unitPart={{
              unitId: "gas-temp-unit",
              unitLabel: "Temperature unit",
              unit: form.gasTempUnit,
              units: plainOptions(TEMPERATURE_UNITS),
              onUnit: set("gasTempUnit"),
            }}
          />
          <TextField
            id={FIELD.airTemp}
            label="Air temperature"
            value={form.airTemp}
            onInput={set("airTemp")}
            errors={errors[FIELD.airTemp]}
            decimal={false}
            suffix={form.gasTempUnit}
            hint="Optional; 25 °C when empty. Used only for the plume rise."
          />
        </div>
      ) : null}
    </fieldset>
  );
}
