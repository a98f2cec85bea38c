import { useId } from "react";

interface FieldProps extends React.InputHTMLAttributes<HTMLInputElement> {
  label: string;
  name: string;
  errors?: string[];
  hint?: string;
}

/** A labelled input with its validation messages beside it (announced to screen readers). */
export function Field({ label, name, errors, hint, className, ...input }: FieldProps) {
  const id = useId();
  const errorId = `${id}-error`;
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-sm font-semibold text-dusk">
        {label}
      </label>
      <input
        id={id}
        name={name}
        aria-invalid={errors && errors.length > 0 ? true : undefined}
        aria-describedby={errors && errors.length > 0 ? errorId : undefined}
        className="mt-1 w-full rounded-md border border-void-edge bg-void px-3 py-2 text-dusk placeholder:text-dusk-dim"
        {...input}
      />
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
