"use client";

import type { FieldErrors, FieldWarnings } from "@/lib/bench/parse-sketch";
import { lensSketches, type Sketch, type SketchField } from "@/lib/bench/sketch-state";
import { lensModels } from "@/lib/lensing/registry";
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

/** The lens sketch: lens, geometry, source and light curve, instrument. Every field is typed text with units. */
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

      <Section title="Source and light curve">
        <ChoiceField
          legend="Source offset β given"
          value={sketch.betaUnit}
          onChange={(value) => onFieldChange("betaUnit", value)}
          options={[
            { value: "thetaE", label: "in units of θ_E" },
            { value: "angle", label: "as an angle" },
          ]}
        />
        {text("beta", sketch.betaUnit === "thetaE" ? "a plain number, e.g. 0.3" : "e.g. 45 uas, 0.2 mas, 1 deg; a bare number is mas")}
        <div className="grid grid-cols-2 gap-3">
          {text("mu", "e.g. 6 mas/yr, 6 mas yr-1; a bare number is mas/yr")}
          {text("u0", "units of θ_E, e.g. 0.2")}
          {text("t0", "from the campaign start, e.g. 45 d; a bare number is days")}
          {lensSketches[sketch.lens].hasLightCurve ? text("rstar", "caps the peak magnification (uniform disk); e.g. 1 Rsun, 10 Rsun; a bare number is R☉") : null}
        </div>
      </Section>

      <Section title="Instrument and campaign">
        <ChoiceField
          legend="Resolution from"
          value={sketch.resolution}
          onChange={(value) => onFieldChange("resolution", value)}
          options={[
            { value: "fwhm", label: "PSF FWHM" },
            { value: "interferometer", label: "Interferometer λ and baseline" },
          ]}
        />
        {sketch.resolution === "fwhm" ? (
          text("fwhm", "e.g. 50 mas, 0.8 arcsec; a bare number is mas")
        ) : (
          <div className="grid grid-cols-2 gap-3">
            {text("lambda", "e.g. 2.2 um, 1.3 mm, 230 GHz; a bare number is µm")}
            {text("baseline", "e.g. 130 m, 10000 km; a bare number is metres")}
          </div>
        )}
        <div className="grid grid-cols-2 gap-3">
          {text("cadence", "time between epochs, e.g. 1 d, 6 h; a bare number is days")}
          {text("campaign", "e.g. 90 d, 2 yr; a bare number is days")}
        </div>
      </Section>
    </form>
  );
}
