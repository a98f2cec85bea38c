"use client";

import { addDaysIso } from "@/lib/astro/time";

interface NightDateControlProps {
  /** The night, by the local date of its evening, `YYYY-MM-DD`. */
  value: string;
  onChange: (nightDateIso: string) => void;
}

/** Pick the night: a date field and one-night steps either way. */
export function NightDateControl({ value, onChange }: NightDateControlProps) {
  const step = (days: number) => onChange(addDaysIso(value, days));
  const buttonClass = "rounded-md border border-void-edge px-3 py-1 text-dusk hover:border-ember";
  return (
    <div className="flex flex-wrap items-end gap-2">
      <button type="button" className={buttonClass} onClick={() => step(-1)} aria-label="Previous night">
        ‹
      </button>
      <label className="flex flex-col gap-1 text-sm font-semibold text-dusk">
        Night of (evening date)
        <input
          type="date"
          value={value}
          min="1900-01-01"
          max="2200-12-31"
          onChange={(event) => event.target.value && onChange(event.target.value)}
          className="rounded border border-void-edge bg-void px-2 py-1 font-mono text-dusk"
        />
      </label>
      <button type="button" className={buttonClass} onClick={() => step(1)} aria-label="Next night">
        ›
      </button>
    </div>
  );
}
