"use client";

import { useId } from "react";
import { fieldEcho } from "@/lib/bench/field-echo";
import type { FieldErrors, FieldWarnings } from "@/lib/bench/parse-sketch";
import { fieldLabels, type Sketch, type SketchField as SketchFieldName } from "@/lib/bench/sketch-state";
import type { QuantityEcho } from "@/lib/physics";

interface SketchFieldProps {
  label: string;
  value: string;
  onChange: (value: string) => void;
  /** What the field accepts, e.g. "mass: 0.5 Msun, 3e30 kg, 1.48 km (GM/c²)". */
  hint: string;
  error?: string;
  /** A value that computes but deserves a second look. */
  warning?: string;
  /** The value the bench uses, echoed by the quantity parser. */
  echo?: QuantityEcho;
  /** Test id of the echo: `echo-<field>`. */
  echoTestId?: string;
}

/**
 * One typed quantity with the value it is read as beside it (as the user types), its hint, and its
 * error right below it when the text does not parse.
 */
export function SketchField({ label, value, onChange, hint, error, warning, echo, echoTestId }: SketchFieldProps) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const echoId = `${id}-echo`;
  const shownEcho = error === undefined && echo?.ok ? echo.text : undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-dusk">
        {label}
      </label>
      <input
        id={id}
        type="text"
        inputMode="text"
        spellCheck={false}
        autoComplete="off"
        value={value}
        onChange={(event) => onChange(event.target.value)}
        aria-invalid={error !== undefined}
        aria-describedby={error !== undefined ? `${errorId} ${hintId}` : shownEcho !== undefined ? `${echoId} ${hintId}` : hintId}
        className={`rounded border bg-void px-2 py-1 font-mono text-sm text-dusk ${error !== undefined ? "border-alarm" : "border-void-edge"}`}
      />
      {shownEcho !== undefined ? (
        <p id={echoId} className="font-mono text-xs text-glint" data-testid={echoTestId} aria-live="polite">
          {shownEcho}
        </p>
      ) : null}
      {warning !== undefined && error === undefined ? (
        <p className="text-sm text-ember" data-testid={echoTestId === undefined ? undefined : `${echoTestId}-warning`}>
          ⚠ {warning}
        </p>
      ) : null}
      {error !== undefined ? (
        <p id={errorId} role="alert" className="text-sm text-alarm">
          {error}
        </p>
      ) : null}
      <p id={hintId} className="text-xs text-dusk-dim">
        {hint}
      </p>
    </div>
  );
}

interface ChoiceFieldProps<T extends string> {
  legend: string;
  value: T;
  options: readonly { value: T; label: string }[];
  onChange: (value: T) => void;
}

/** A small set of mutually exclusive choices as radio buttons (lens model, geometry, instrument). */
export function ChoiceField<T extends string>({ legend, value, options, onChange }: ChoiceFieldProps<T>) {
  const name = useId();
  return (
    <fieldset className="flex flex-wrap items-center gap-x-4 gap-y-1">
      <legend className="mb-1 text-sm font-semibold text-dusk">{legend}</legend>
      {options.map((option) => (
        <label key={option.value} className="flex items-center gap-1.5 text-sm text-dusk">
          <input
            type="radio"
            name={name}
            value={option.value}
            checked={value === option.value}
            onChange={() => onChange(option.value)}
            className="accent-ember"
          />
          {option.label}
        </label>
      ))}
    </fieldset>
  );
}

export type FieldChange = <K extends SketchFieldName>(field: K, value: Sketch[K]) => void;

/** Binds text fields to the sketch: `text("mass", hint)` renders the field with its label, echo, warning and error. */
export function sketchTextFields(sketch: Sketch, fieldErrors: FieldErrors, onFieldChange: FieldChange, warnings: FieldWarnings = {}) {
  return function text(field: SketchFieldName, hint: string) {
    return (
      <SketchField
        label={fieldLabels[field]}
        hint={hint}
        value={sketch[field]}
        error={fieldErrors[field]}
        warning={warnings[field]}
        echo={fieldEcho(sketch, field)}
        echoTestId={`echo-${field}`}
        onChange={(value) => onFieldChange(field, value)}
      />
    );
  };
}
