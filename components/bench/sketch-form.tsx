"use client";

import type { FieldErrors } from "@/lib/bench/parse-sketch";
import type { Sketch } from "@/lib/bench/sketch-state";
import { ChoiceField, sketchTextFields, type FieldChange } from "./sketch-field";

interface SketchFormProps {
  sketch: Sketch;
  fieldErrors: FieldErrors;
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

/** The lens sketch: lens, geometry, source and light curve, instrument. Every field is typed text with units. */
export function SketchForm({ sketch, fieldErrors, onFieldChange }: SketchFormProps) {
  const text = sketchTextFields(sketch, fieldErrors, onFieldChange);
  return (
    <form className="space-y-4" onSubmit={(event) => event.preventDefault()} aria-label="Lens sketch">
      <Section title="Lens">
        <ChoiceField
          legend="Lens model"
          value={sketch.lens}
          onChange={(value) => onFieldChange("lens", value)}
          options={[
            { value: "point", label: "Compact mass (point lens)" },
            { value: "sis", label: "Singular isothermal sphere" },
          ]}
        />
        {sketch.lens === "point"
          ? text("mass", "Lens mass", "e.g. 0.5 Msun, 4e6 Msun, 3e30 kg, or GM/c² as 1.48 km, GM/c³ as 4.9 us")
          : text("sigma", "Velocity dispersion σ", "e.g. 220 km/s")}
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
            {text("dl", "Lens distance D_L", "e.g. 4 kpc, 1 au")}
            {text("ds", "Source distance D_S", "e.g. 8 kpc")}
          </div>
        ) : (
          <div className="grid grid-cols-2 gap-3">
            {text("zl", "Lens redshift z_L", "a plain number")}
            {text("zs", "Source redshift z_S", "a plain number")}
            {text("h0", "Hubble constant H0", "km/s/Mpc, a plain number")}
            {text("om0", "Matter density Ωm", "a plain number, 0 to 1")}
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
        {text("beta", "Source offset β", sketch.betaUnit === "thetaE" ? "a plain number, e.g. 0.3" : "e.g. 45 uas, 0.2 mas")}
        <div className="grid grid-cols-2 gap-3">
          {text("mu", "Relative proper motion μ_rel", "e.g. 6 mas/yr")}
          {text("u0", "Impact parameter at peak u0", "units of θ_E, e.g. 0.2")}
          {text("t0", "Peak time t0", "from the campaign start, e.g. 45 d")}
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
          text("fwhm", "PSF FWHM", "e.g. 50 mas, 0.8 arcsec")
        ) : (
          <div className="grid grid-cols-2 gap-3">
            {text("lambda", "Wavelength λ", "e.g. 2.2 um, 1.3 mm")}
            {text("baseline", "Longest baseline B", "e.g. 130 m, 10000 km")}
          </div>
        )}
        <div className="grid grid-cols-2 gap-3">
          {text("cadence", "Cadence", "time between epochs, e.g. 1 d, 6 h")}
          {text("campaign", "Campaign length", "e.g. 90 d, 2 yr")}
        </div>
      </Section>
    </form>
  );
}
