import { useId } from "react";

interface FieldProps extends React.InputHTMLAttributes<HTMLInputElement> {
  label: string;
  name: string;
  errors?: string[];
  hint?: string;
  /** What the field read from its text, shown as the user types (a quantity's value in its unit). */
  echo?: { text: string; isRefused: boolean } | null;
}

/** A labelled input with its validation messages beside it (announced to screen readers). */
export function Field({ label, name, errors, hint, echo, className, ...input }: FieldProps) {
  const id = useId();
  const errorId = `${id}-error`;
  const echoId = `${id}-echo`;
  const describedBy = [echo ? echoId : undefined, errors && errors.length > 0 ? errorId : undefined].filter(Boolean).join(" ");
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-semibold text-dusk">
        {label}
      </label>
      <input
        id={id}
        name={name}
        aria-invalid={errors && errors.length > 0 ? true : undefined}
        aria-describedby={describedBy === "" ? undefined : describedBy}
        className="mt-1 w-full rounded-md border border-void-edge bg-void px-3 py-2 text-dusk placeholder:text-dusk-dim"
        {...input}
      />
      {echo && (
        <p id={echoId} data-testid={`echo-${name}`} aria-live="polite" className={`mt-1 text-xs ${echo.isRefused ? "text-alarm" : "text-glint"}`}>
          {echo.text}
        </p>
      )}
      {hint && <p className="mt-1 text-xs text-dusk-dim">{hint}</p>}
      {errors && errors.length > 0 && (
        <p id={errorId} role="alert" className="mt-1 text-sm text-alarm">
          {errors.join(" ")}
        </p>
      )}
    </div>
  );
}

export function FormError({ message }: { message: string | null }) {
  if (!message) return null;
  return (
    <p role="alert" className="rounded-md border border-alarm/60 bg-alarm/10 px-3 py-2 text-sm text-alarm">
      {message}
    </p>
  );
}

export const buttonClass =
  "rounded-md bg-ember px-4 py-2 font-semibold text-void hover:bg-ember-strong disabled:cursor-wait disabled:opacity-60";
export const quietButtonClass = "rounded-md border border-void-edge px-3 py-1.5 text-sm text-dusk hover:border-dusk-dim";
