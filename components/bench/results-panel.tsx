"use client";

import { useState } from "react";
import type { BenchResults, DeflectionRow, ResultRow } from "@/lib/bench/compute-results";
import { WEAK_FIELD_TOLERANCE } from "@/lib/bench/compute-results";
import { formatInUnit, formatPlain, naturalAngleUnit, unitChoices, unitLabel } from "@/lib/bench/display-units";
import { CopyRowButton } from "./copy-row-button";

function UnitSelect({ kind, value, onChange, label }: { kind: ResultRow["kind"]; value: string; onChange: (unit: string) => void; label: string }) {
  if (kind === "ratio") return null;
  return (
    <select
      aria-label={`Unit for ${label}`}
      value={value}
      onChange={(event) => onChange(event.target.value)}
      className="rounded border border-void-edge bg-void px-1 py-0.5 text-xs text-dusk"
    >
      {unitChoices[kind].map((unit) => (
        <option key={unit} value={unit}>
          {unitLabel(unit)}
        </option>
      ))}
    </select>
  );
}

function QuantityRows({ rows }: { rows: ResultRow[] }) {
  const [unitById, setUnitById] = useState<Record<string, string>>({});
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
          const unit = unitById[row.id] ?? row.defaultUnit;
          const valueText = formatInUnit(row.kind, row.value, unit);
          const rowText = `${row.label} ${row.symbol} = ${valueText}`;
          return (
            <tr key={row.id} className="border-t border-void-edge">
              <th scope="row" className="py-1 pr-2 text-left font-normal text-dusk">
                {row.label} <span className="text-dusk-dim">{row.symbol}</span>
              </th>
              <td className="py-1 pr-2 font-mono text-glint" data-testid={`result-${row.id}`}>
                {valueText}
              </td>
              <td className="py-1 pr-2">
                <UnitSelect kind={row.kind} value={unit} label={row.label} onChange={(next) => setUnitById((previous) => ({ ...previous, [row.id]: next }))} />
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

function DeflectionRows({ deflections }: { deflections: DeflectionRow[] }) {
  const [unit, setUnit] = useState<string>(() => naturalAngleUnit(deflections[0]?.exactRad ?? 0));
  const angle = (valueRad: number) => formatInUnit("angle", valueRad, unit, 10);
  return (
    <div className="space-y-2">
      <div className="flex items-center justify-between gap-2">
        <h3 className="text-sm font-semibold text-dusk">Deflection: exact against weak field (4M/b)</h3>
        <UnitSelect kind="angle" value={unit} label="deflection angles" onChange={setUnit} />
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
            const difference = formatPlain(row.fractionalDifference, 3);
            const flag = row.isWeakFieldOff ? ` — weak field off by more than ${WEAK_FIELD_TOLERANCE * 100}%` : "";
            const rowText = `${row.label}: b = ${formatPlain(row.bOverM)} M, α exact = ${angle(row.exactRad)}, α weak field = ${angle(row.weakFieldRad)}, fractional difference ${difference}${flag}`;
            return (
              <tr key={row.id} className="border-t border-void-edge" data-testid={row.id}>
                <th scope="row" className="py-1 pr-2 text-left font-normal text-dusk">{row.label}</th>
                <td className="py-1 pr-2 font-mono text-glint">{formatPlain(row.bOverM)}</td>
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
export function ResultsPanel({ results }: { results: BenchResults }) {
  return (
    <section aria-label="Results" className="space-y-4 rounded-md border border-void-edge bg-void-raised p-4">
      <h2 className="text-base font-semibold text-dusk">Results</h2>
      <QuantityRows rows={results.rows} />
      {results.deflections.length > 0 ? <DeflectionRows deflections={results.deflections} /> : null}
    </section>
  );
}
