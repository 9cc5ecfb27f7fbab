/** Model settings: the near zone, the breathing height and the dispersion curves. */
import type { SigmaScheme } from "../../core/types.ts";
import { FIELD } from "../form.ts";
import { SelectField, TextField } from "./Field.tsx";
import { type SectionProps, setter } from "./types.ts";

export function ModelSection({ form, dispatch, errors }: SectionProps) {
  const set = setter(dispatch);
  return (
    <fieldset class="section">
      <legend>Model settings</legend>
      <TextField
        id={FIELD.nearZone}
        label="Near zone radius"
        value={form.nearZone}
        onInput={set("nearZone")}
        errors={errors[FIELD.nearZone]}
        suffix="m"
        hint="Always drawn around the source: the model does not hold there and the hazard is highest."
      />
      <TextField
        id={FIELD.receptorHeight}
        label="Breathing height"
        value={form.receptorHeight}
        onInput={set("receptorHeight")}
        errors={errors[FIELD.receptorHeight]}
        suffix="m"
        hint="Height above the ground at which the bands are drawn; 1.5 m is standing height."
      />
      <SelectField<SigmaScheme>
        id={FIELD.scheme}
        label="Dispersion curves"
        value={form.scheme}
        options={[
          { value: "briggs", label: "Briggs (default; open country or built-up)" },
          { value: "pasquill-gifford", label: "Pasquill–Gifford (open country only)" },
        ]}
        onChange={set("scheme")}
        errors={errors[FIELD.scheme]}
      />
    </fieldset>
  );
}
