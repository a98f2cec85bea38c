"use client";

import type { FieldErrors, FieldWarnings } from "@/lib/bench/parse-sketch";
import { caseChoices, fieldLabels, lensSketches, type Sketch, type SketchField } from "@/lib/bench/sketch-state";
import { lensModels } from "@/lib/lensing/registry";
import { scienceCaseLabels } from "@/lib/lensing/science-cases";
import { Fragment } from "react";
import { ChoiceField, sketchTextFields, type FieldChange } from "./sketch-field";

interface SketchFormProps {
  sketch: Sketch;
  fieldErrors: FieldErrors;
  warnings: FieldWarnings;
  onFieldChange: FieldChange;
}

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section aria-label={title} className="space-y-3 rounded-md border border-void-edge bg-void-raised p-4">
      <h2 className="text-base font-semibold text-dusk">{title}</h2>
      {children}
    </section>
  );
}

/** What each lens model's own field suggests typing. */
const lensFieldHints: Partial<Record<SketchField, string>> = {
  mass: "e.g. 0.5 Msun, 4,100,000 Msun, 3e30 kg, or GM/c² as 1.48 km, GM/c³ as 4.9 us; a bare number is M☉",
  radius: "compact (a black hole), or the body's radius: 1 Rsun, 6.957e5 km, 12 km; a bare number is R☉",
  sigma: "e.g. 220 km/s; a bare number is km/s",
};

/** The science case as a list: the inferred one first, then each case by its name. */
function CaseField({ value, onChange }: { value: Sketch["case"]; onChange: (value: Sketch["case"]) => void }) {
  return (
    <label className="flex flex-col gap-1 text-sm font-semibold text-dusk">
      {fieldLabels.case}
      <select
        value={value}
        onChange={(event) => onChange(event.target.value as Sketch["case"])}
        className="rounded border border-void-edge bg-void px-2 py-1 font-normal"
      >
        {caseChoices.map((choice) => (
          <option key={choice} value={choice}>
            {choice === "inferred" ? "Inferred from the lens and the instrument" : scienceCaseLabels[choice]}
          </option>
        ))}
      </select>
    </label>
  );
}

/**
 * The lens sketch: lens, geometry, the target (position, case, event, source), the instrument, and the
 * site and cycle the schedule is simulated for. Every field is typed text with units; an empty field is
 * "not set", as on a target or a proposal.
 */
export function SketchForm({ sketch, fieldErrors, warnings, onFieldChange }: SketchFormProps) {
  const text = sketchTextFields(sketch, fieldErrors, onFieldChange, warnings);
  return (
    <form className="space-y-4" onSubmit={(event) => event.preventDefault()} aria-label="Lens sketch">
      <Section title="Lens">
        <ChoiceField
          legend="Lens model"
          value={sketch.lens}
          onChange={(value) => onFieldChange("lens", value)}
          options={lensModels.map((model) => ({ value: model.id, label: model.label }))}
        />
        {lensSketches[sketch.lens].fields.map((field) => (
          <Fragment key={field}>{text(field, lensFieldHints[field] ?? "")}</Fragment>
        ))}
      </Section>

      <Section title="Geometry">
        <ChoiceField
          legend="Distances from"
          value={sketch.geometry}
          onChange={(value) => onFieldChange("geometry", value)}
          options={[
            { value: "distance", label: "Distances (within the Galaxy)" },
            { value: "redshift", label: "Redshifts (flat ΛCDM)" },
          ]}
        />
        {sketch.geometry === "distance" ? (
          <div className="grid grid-cols-2 gap-3">
            {text("dl", "e.g. 4 kpc, 1 au; a bare number is kpc")}
            {text("ds", "e.g. 8 kpc; a bare number is kpc")}
          </div>
        ) : (
          <div className="grid grid-cols-2 gap-3">
            {text("zl", "a plain number")}
            {text("zs", "a plain number")}
            {text("h0", "km/s/Mpc, a plain number")}
            {text("om0", "a plain number, 0 to 1")}
          </div>
        )}
      </Section>

      <Section title="Target and event">
        <div className="grid grid-cols-2 gap-3">
          {text("ra", "hours \"17 57 12.4\" or degrees \"269.30\"")}
          {text("dec", "degrees \"-29 12 05\" or \"-29.20\"")}
        </div>
        <CaseField value={sketch.case} onChange={(value) => onFieldChange("case", value)} />
        <ChoiceField
          legend="Source offset β given"
          value={sketch.betaUnit}
          onChange={(value) => onFieldChange("betaUnit", value)}
          options={[
            { value: "thetaE", label: "in units of θ_E" },
            { value: "angle", label: "as an angle" },
          ]}
        />
        {text("beta", `the impact parameter u0 at the peak; ${sketch.betaUnit === "thetaE" ? "a plain number, e.g. 0.3" : "e.g. 45 uas, 0.2 mas, 1 deg; a bare number is mas"}`)}
        <div className="grid grid-cols-2 gap-3">
          {text("mu", "e.g. 6 mas/yr, 6 mas yr-1; a bare number is mas/yr; empty: not set")}
          {text("t0", "a UTC date, e.g. 2027-07-10 04:30, or JD 2461596.69; empty: not set")}
          {text("rstar", "e.g. 1 Rsun, 10 Rsun; a bare number is R☉; empty: a point source")}
          {text("rho", "the source radius in θ_E instead of R_*, e.g. 0.002")}
          {text("limb", "linear coefficient 0 (uniform disk) to 1; empty: uniform")}
        </div>
      </Section>

      <Section title="Instrument">
        {text("fwhm", "e.g. 50 mas, 0.8 arcsec; a bare number is mas")}
        <div className="grid grid-cols-2 gap-3">
          {text("lambda", "an interferometer, with B: e.g. 2.2 um, 1.3 mm, 230 GHz; a bare number is µm; empty: none")}
          {text("baseline", "e.g. 130 m, 10000 km; a bare number is metres")}
          {text("astrometry", "e.g. 0.1 mas, 100 uas; a bare number is mas; empty: not set")}
          {text("contrast", "largest flux ratio, e.g. 100; empty: not set")}
        </div>
      </Section>

      <Section title="Site, cycle and campaign">
        {text("site", "a name for the site")}
        <div className="grid grid-cols-2 gap-3">
          {text("lat", "e.g. -30.2 deg; a bare number is degrees")}
          {text("lon", "east positive, e.g. -70.7 deg; a bare number is degrees")}
          {text("elev", "e.g. 2200 m; a bare number is metres")}
          {text("horizon", "lowest altitude, e.g. 20 deg; a bare number is degrees")}
          {text("cycleStart", "evening date YYYY-MM-DD; empty: no schedule")}
          {text("cycleEnd", "evening date YYYY-MM-DD, at most a year later")}
          {text("airmass", "e.g. 2")}
          {text("moonSep", "e.g. 30 deg; a bare number is degrees; empty: no Moon limit")}
          {text("moonIllum", "fraction 0 to 1; empty: any Moon")}
          {text("cadence", "time between visits, e.g. 1 d, 6 h; a bare number is days")}
          {text("visit", "e.g. 20 min; a bare number is minutes")}
          {text("clear", "share of clear nights, e.g. 0.7; 1: every night")}
          {text("campaign", "e.g. 90 d, 2 yr; a bare number is days")}
        </div>
      </Section>
    </form>
  );
}
