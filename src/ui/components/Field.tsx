/**
 * Labelled inputs. Every control has a visible <label for>, whose text is its
 * accessible name; a problem shows under the field, is tied to it with
 * aria-describedby and marks it aria-invalid.
 */
import type { ComponentChildren } from "preact";

export interface Option<T extends string> {
  value: T;
  label: string;
}

export function FieldError({
  id,
  messages,
}: {
  id: string;
  messages: readonly string[] | undefined;
}) {
  if (!messages || messages.length === 0) return null;
  return (
    <p class="field-error" id={`${id}-error`} data-testid={`error-${id}`}>
      {messages.join(" ")}
    </p>
  );
}

interface UnitProps<U extends string> {
  unitId: string;
  unitLabel: string;
  unit: U;
  units: readonly Option<U>[];
  onUnit: (u: U) => void;
}

export interface TextFieldProps<U extends string> {
  id: string;
  label: string;
  value: string;
  onInput: (v: string) => void;
  errors?: readonly string[] | undefined;
  hint?: string | undefined;
  /** Numeric keyboard on phones (no minus sign on some): set false where negatives are normal. */
  decimal?: boolean;
  placeholder?: string;
  unitPart?: UnitProps<U>;
  /** Fixed unit shown after the input when there is no choice. */
  suffix?: string;
  disabled?: boolean;
}

export function TextField<U extends string>(p: TextFieldProps<U>) {
  const invalid = Boolean(p.errors && p.errors.length > 0);
  const describedBy = [p.hint ? `${p.id}-hint` : "", invalid ? `${p.id}-error` : ""]
    .filter(Boolean)
    .join(" ");
  return (
    <div class={`field${invalid ? " field-invalid" : ""}`}>
      <div class="field-row">
        <div class="field-main">
          <label for={p.id}>{p.label}</label>
          <div class="input-wrap">
            <input
              id={p.id}
              name={p.id}
              type="text"
              inputMode={p.decimal === false ? "text" : "decimal"}
              autoComplete="off"
              spellcheck={false}
              value={p.value}
              placeholder={p.placeholder}
              disabled={p.disabled}
              aria-invalid={invalid ? "true" : undefined}
              aria-describedby={describedBy || undefined}
              onInput={(e) => p.onInput((e.currentTarget as HTMLInputElement).value)}
            />
            {p.suffix ? <span class="suffix">{p.suffix}</span> : null}
          </div>
        </div>
        {p.unitPart ? (
          <div class="field-unit">
            <label for={p.unitPart.unitId}>{p.unitPart.unitLabel}</label>
            <select
              id={p.unitPart.unitId}
              value={p.unitPart.unit}
              onChange={(e) =>
                p.unitPart?.onUnit((e.currentTarget as HTMLSelectElement).value as U)
              }
            >
              {p.unitPart.units.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </select>
          </div>
        ) : null}
      </div>
      <FieldFoot id={p.id} hint={p.hint} errors={p.errors} />
    </div>
  );
}

/** Below an input: its hint (`{id}-hint`) and its problems (`{id}-error`). */
function FieldFoot(p: {
  id: string;
  hint?: ComponentChildren;
  errors?: readonly string[] | undefined;
}) {
  return (
    <>
      {p.hint ? (
        <div class="hint" id={`${p.id}-hint`}>
          {p.hint}
        </div>
      ) : null}
      <FieldError id={p.id} messages={p.errors} />
    </>
  );
}

export function SelectField<T extends string>(p: {
  id: string;
  label: string;
  value: T;
  options: readonly Option<T>[];
  onChange: (v: T) => void;
  errors?: readonly string[] | undefined;
  hint?: ComponentChildren;
}) {
  const invalid = Boolean(p.errors && p.errors.length > 0);
  const describedBy = [p.hint ? `${p.id}-hint` : "", invalid ? `${p.id}-error` : ""]
    .filter(Boolean)
    .join(" ");
  return (
    <div class={`field${invalid ? " field-invalid" : ""}`}>
      <label for={p.id}>{p.label}</label>
      <select
        id={p.id}
        value={p.value}
        aria-invalid={invalid ? "true" : undefined}
        aria-describedby={describedBy || undefined}
        onChange={(e) => p.onChange((e.currentTarget as HTMLSelectElement).value as T)}
      >
        {p.options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <FieldFoot id={p.id} hint={p.hint} errors={p.errors} />
    </div>
  );
}

export function CheckField(p: {
  id: string;
  label: string;
  checked: boolean;
  onChange: (v: boolean) => void;
}) {
  return (
    <div class="check">
      <input
        id={p.id}
        type="checkbox"
        checked={p.checked}
        onChange={(e) => p.onChange((e.currentTarget as HTMLInputElement).checked)}
      />
      <label for={p.id}>{p.label}</label>
    </div>
  );
}

/** Helper for option lists whose label is the value itself. */
export const plainOptions = <T extends string>(values: readonly T[]): Option<T>[] =>
  values.map((v) => ({ value: v, label: v }));
