"use client";

import type { BenchResults, DeflectionRow, ResultRow } from "@/lib/bench/compute-results";
import { WEAK_FIELD_TOLERANCE } from "@/lib/bench/compute-results";
import { AUTO_UNIT, displayUnit, formatInUnit, unitChoices, unitLabel } from "@/lib/bench/display-units";
import { CopyRowButton } from "./copy-row-button";
import { formatSignificant } from "@/lib/numbers/significant";

/** The user's unit per row id (from the link) and how to change one; AUTO_UNIT clears the choice. */
export interface UnitChoices {
  chosen: Record<string, string>;
  onChange: (id: string, unit: string) => void;
}

/** A unit per row: "auto" picks a readable unit for the value (named in the option), any other wins. */
function UnitSelect({ kind, chosen, autoUnit, onChange, label }: { kind: ResultRow["kind"]; chosen: string | undefined; autoUnit: string; onChange: (unit: string) => void; label: string }) {
  if (kind === "ratio") return null;
  return (
    <select
      aria-label={`Unit for ${label}`}
      value={chosen ?? AUTO_UNIT}
      onChange={(event) => onChange(event.target.value)}
      className="rounded border border-void-edge bg-void px-1 py-0.5 text-xs text-dusk"
    >
      <option value={AUTO_UNIT}>auto ({unitLabel(autoUnit)})</option>
      {unitChoices[kind].map((unit) => (
        <option key={unit} value={unit}>
          {unitLabel(unit)}
        </option>
      ))}
    </select>
  );
}

function QuantityRows({ rows, units }: { rows: ResultRow[]; units: UnitChoices }) {
  return (
    <table className="w-full text-sm">
      <caption className="sr-only">Lens quantities</caption>
      <thead className="text-left text-xs text-dusk-dim">
        <tr>
          <th scope="col" className="py-1 font-normal">Quantity</th>
          <th scope="col" className="py-1 font-normal">Value</th>
          <th scope="col" className="py-1 font-normal">Unit</th>
          <th scope="col" className="py-1 font-normal"><span className="sr-only">Copy</span></th>
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => {
          const chosen = units.chosen[row.id];
          const unit = displayUnit(row.kind, row.value, chosen);
          const valueText = formatInUnit(row.kind, row.value, unit);
          const rowText = `${row.label} ${row.symbol} = ${valueText}${row.note === undefined ? "" : ` (${row.note})`}`;
          return (
            <tr key={row.id} className="border-t border-void-edge">
              <th scope="row" className="py-1 pr-2 text-left font-normal text-dusk">
                {row.label} <span className="text-dusk-dim">{row.symbol}</span>
              </th>
              <td className="py-1 pr-2">
                <span className="font-mono text-glint" data-testid={`result-${row.id}`}>
                  {valueText}
                </span>
                {row.note !== undefined ? (
                  <span className="block text-xs text-ember" data-testid={`result-${row.id}-note`}>
                    {row.note}
                  </span>
                ) : null}
              </td>
              <td className="py-1 pr-2">
                <UnitSelect
                  kind={row.kind}
                  chosen={chosen}
                  autoUnit={displayUnit(row.kind, row.value, undefined)}
                  label={row.label}
                  onChange={(next) => units.onChange(row.id, next)}
                />
              </td>
              <td className="py-1 text-right">
                <CopyRowButton text={rowText} label={row.label} />
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

/** Unit-choice key of the deflection table (one unit for the whole table). */
const DEFLECTION_UNITS_ID = "deflection";

function DeflectionRows({ deflections, units }: { deflections: DeflectionRow[]; units: UnitChoices }) {
  const chosen = units.chosen[DEFLECTION_UNITS_ID];
  const autoUnit = displayUnit("angle", deflections[0]?.exactRad ?? 0, undefined);
  const unit = displayUnit("angle", deflections[0]?.exactRad ?? 0, chosen);
  const angle = (valueRad: number) => formatInUnit("angle", valueRad, unit, 10);
  return (
    <div className="space-y-2">
      <div className="flex items-center justify-between gap-2">
        <h3 className="text-sm font-semibold text-dusk">Deflection: exact against weak field (4M/b)</h3>
        <UnitSelect kind="angle" chosen={chosen} autoUnit={autoUnit} label="deflection angles" onChange={(next) => units.onChange(DEFLECTION_UNITS_ID, next)} />
      </div>
      <table className="w-full text-sm">
        <caption className="sr-only">Exact and weak-field deflection of the rays that form the images</caption>
        <thead className="text-left text-xs text-dusk-dim">
          <tr>
            <th scope="col" className="py-1 font-normal">Ray</th>
            <th scope="col" className="py-1 font-normal">b / M</th>
            <th scope="col" className="py-1 font-normal">α exact</th>
            <th scope="col" className="py-1 font-normal">α weak field</th>
            <th scope="col" className="py-1 font-normal">(weak − exact)/exact</th>
            <th scope="col" className="py-1 font-normal"><span className="sr-only">Copy</span></th>
          </tr>
        </thead>
        <tbody>
          {deflections.map((row) => {
            const difference = formatSignificant(row.fractionalDifference, 3);
            const flag = row.hitsSurface ? " — the ray ends on the lens's surface" : row.isWeakFieldOff ? ` — weak field off by more than ${WEAK_FIELD_TOLERANCE * 100}%` : "";
            const rowText = `${row.label}: b = ${formatSignificant(row.bOverM)} M, α exact = ${angle(row.exactRad)}, α weak field = ${angle(row.weakFieldRad)}, fractional difference ${difference}${flag}`;
            return (
              <tr key={row.id} className="border-t border-void-edge" data-testid={row.id}>
                <th scope="row" className="py-1 pr-2 text-left font-normal text-dusk">
                  {row.label}
                  {row.hitsSurface ? (
                    <span className="block text-xs text-ember" data-testid={`${row.id}-hits-surface`}>
                      hits the lens's surface (b &lt; R): no image from this ray
                    </span>
                  ) : null}
                </th>
                <td className="py-1 pr-2 font-mono text-glint">{formatSignificant(row.bOverM)}</td>
                <td className="py-1 pr-2 font-mono text-glint">{angle(row.exactRad)}</td>
                <td className="py-1 pr-2 font-mono text-glint">{angle(row.weakFieldRad)}</td>
                <td className={`py-1 pr-2 font-mono ${row.isWeakFieldOff ? "text-alarm" : "text-glint"}`}>
                  {difference}
                  {row.isWeakFieldOff ? <span className="ml-1 font-sans text-xs">▲ off by &gt;{WEAK_FIELD_TOLERANCE * 100}%</span> : null}
                </td>
                <td className="py-1 text-right">
                  <CopyRowButton text={rowText} label={row.label} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

/** The numbers of the sketch: lens quantities with per-row units, and exact against weak-field deflection. */
export function ResultsPanel({ results, units }: { results: BenchResults; units: UnitChoices }) {
  return (
    <section aria-label="Results" className="space-y-4 rounded-md border border-void-edge bg-void-raised p-4">
      <h2 className="text-base font-semibold text-dusk">Results</h2>
      <QuantityRows rows={results.rows} units={units} />
      {results.notes.map((note) => (
        <p key={note.id} className="text-sm text-ember" data-testid={`result-note-${note.id}`}>
          {note.text}
        </p>
      ))}
      {results.deflections.length > 0 ? <DeflectionRows deflections={results.deflections} units={units} /> : null}
    </section>
  );
}
