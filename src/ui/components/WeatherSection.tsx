import type { Sky, StabilityClass } from "../../core/types.ts";
import { FIELD } from "../form.ts";
import { LENGTH_UNITS, SPEED_UNITS } from "../units.ts";
import { directionWords } from "../words.ts";
import { type Option, plainOptions, SelectField, TextField } from "./Field.tsx";
import { type SectionProps, setter } from "./types.ts";

const SKY_OPTIONS: Option<Sky>[] = [
  { value: "sun", label: "Daytime sun (strength from clock and place)" },
  { value: "strong-sun", label: "Strong sun" },
  { value: "moderate-sun", label: "Moderate sun" },
  { value: "slight-sun", label: "Slight sun" },
  { value: "overcast", label: "Heavy overcast (day or night)" },
  { value: "night-cloudy", label: "Night, cloudy (half or more low cloud)" },
  { value: "night-clear", label: "Night, clear (less than half cloud)" },
];

const STABILITY_OPTIONS: Option<StabilityClass | "auto">[] = [
  { value: "auto", label: "Use the suggested class" },
  { value: "A", label: "A — very unstable" },
  { value: "B", label: "B — unstable" },
  { value: "C", label: "C — slightly unstable" },
  { value: "D", label: "D — neutral" },
  { value: "E", label: "E — slightly stable" },
  { value: "F", label: "F — moderately stable" },
];

export interface Suggestion {
  stability: StabilityClass;
  reason: string;
}

export function WeatherSection({
  form,
  dispatch,
  errors,
  suggestion,
}: SectionProps & { suggestion: Suggestion | null }) {
  const set = setter(dispatch);
  const dirWords = directionWords(form.windFrom);
  const suggestionText = suggestion
    ? form.stability === "auto"
      ? `Using class ${suggestion.stability}. ${suggestion.reason}`
      : `Suggested ${suggestion.stability}: ${suggestion.reason} You chose ${form.stability}.`
    : form.sky === "sun"
      ? "A class is suggested once the wind speed and the place (for the sun's height) are valid."
      : "A class is suggested once the wind speed is valid.";
  return (
    <fieldset class="section">
      <legend>Weather</legend>
      <TextField
        id={FIELD.windSpeed}
        label="Wind speed"
        value={form.windSpeed}
        onInput={set("windSpeed")}
        errors={errors[FIELD.windSpeed]}
        unitPart={{
          unitId: "wind-speed-unit",
          unitLabel: "Speed unit",
          unit: form.windSpeedUnit,
          units: plainOptions(SPEED_UNITS),
          onUnit: set("windSpeedUnit"),
        }}
      />
      <TextField
        id={FIELD.windHeight}
        label="Measured at height"
        value={form.windHeight}
        onInput={set("windHeight")}
        errors={errors[FIELD.windHeight]}
        hint="Height of the wind reading; 10 m is standard."
        unitPart={{
          unitId: "wind-height-unit",
          unitLabel: "Measured-at unit",
          unit: form.windHeightUnit,
          units: plainOptions(LENGTH_UNITS),
          onUnit: set("windHeightUnit"),
        }}
      />
      <TextField
        id={FIELD.windFrom}
        label="Wind from"
        value={form.windFrom}
        onInput={set("windFrom")}
        errors={errors[FIELD.windFrom]}
        decimal={false}
        placeholder="270 or W"
        hint={dirWords ?? "Degrees true or a compass point (N, NNE, … NNW)."}
      />
      <TextField
        id={FIELD.windSwing}
        label="Wind swing"
        value={form.windSwing}
        onInput={set("windSwing")}
        errors={errors[FIELD.windSwing]}
        suffix="± °"
        hint="How far the wind direction may shift either way; the bands are swept through it."
      />
      <SelectField
        id={FIELD.sky}
        label="Sky"
        value={form.sky}
        options={SKY_OPTIONS}
        onChange={set("sky")}
        errors={errors[FIELD.sky]}
      />
      <SelectField
        id={FIELD.stability}
        label="Stability class"
        value={form.stability}
        options={STABILITY_OPTIONS}
        onChange={set("stability")}
        errors={errors[FIELD.stability]}
        hint={<span data-testid="stability-suggestion">{suggestionText}</span>}
      />
      <SelectField
        id={FIELD.terrain}
        label="Ground"
        value={form.terrain}
        options={[
          { value: "open", label: "Open country" },
          { value: "urban", label: "Built-up" },
        ]}
        onChange={set("terrain")}
        errors={errors[FIELD.terrain]}
      />
      <TextField
        id={FIELD.mixingHeight}
        label="Mixing height (optional)"
        value={form.mixingHeight}
        onInput={set("mixingHeight")}
        errors={errors[FIELD.mixingHeight]}
        hint="Leave empty when unknown."
        unitPart={{
          unitId: "mixing-height-unit",
          unitLabel: "Mixing unit",
          unit: form.mixingHeightUnit,
          units: plainOptions(LENGTH_UNITS),
          onUnit: set("mixingHeightUnit"),
        }}
      />
    </fieldset>
  );
}
