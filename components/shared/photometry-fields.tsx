"use client";

import { useId, useState } from "react";
import type { FieldErrors } from "@/lib/errors";
import { magnitudeSystemLabels, standardBands, typicalDarkSiteConditions, type MagnitudeSystem } from "@/lib/photometry/bands";
import { KOLMOGOROV_MOFFAT_BETA } from "@/lib/photometry/psf";
import { quantityEcho } from "@/lib/workspace/quantity-field";
import { CUSTOM_BAND_ID, photometryQuantities, psfShapeKinds, type PhotometrySettings, type PsfShapeKind } from "@/lib/workspace/photometry-schema";
import { ChoiceOptions } from "@/components/shared/choice-options";
import { Field } from "@/components/shared/field";
import { QuantityInput } from "@/components/shared/quantity-input";
import {
  customBandInputName,
  photometryFieldTexts,
  photometryInputName,
  skyBandIds,
  skyFields,
  skyInputName,
  skyOwnMarkerName,
  type PhotometrySettingKey,
} from "@/components/shared/photometry-body";

/** Each setting's label (with the unit a bare number is read in) and the hint under its input. */
const settingInputs: Record<PhotometrySettingKey, { label: string; hint?: string }> = {
  apertureM: { label: "Telescope aperture (m)", hint: "diameter of the primary; or with a unit: 120 cm" },
  centralObstructionM: { label: "Central obstruction (m)", hint: "diameter of the secondary's shadow; 0 for none" },
  throughput: { label: "Total throughput", hint: "optics, filter and detector together, 0 to 1" },
  readNoiseElectrons: { label: "Read noise (e⁻ rms per pixel)" },
  darkElectronsPerSPerPixel: { label: "Dark current (e⁻/s per pixel)" },
  gainElectronsPerAdu: { label: "Gain (e⁻/ADU)" },
  fullWellElectrons: { label: "Full well (e⁻)", hint: "a brighter peak pixel is warned of as saturated" },
  pixelScaleArcsec: { label: "Pixel scale (″ per pixel)", hint: "or with a unit: 0.4 arcsec" },
  seeingFwhmArcsec: { label: "Seeing FWHM at the zenith (″)", hint: "grows as airmass^0.6 at each visit (Roddier 1981)" },
  apertureRadiusFwhm: { label: "Photometric aperture radius (× FWHM)" },
  overheadS: { label: "Overhead per visit (s)", hint: "slew, acquisition and readout; or with a unit: 2 min" },
  signalToNoiseGoal: { label: "Signal-to-noise goal per visit", hint: "50 is 2 % photometry" },
};

const settingGroups: { legend: string; keys: PhotometrySettingKey[]; hasPsfShape?: boolean }[] = [
  { legend: "Telescope", keys: ["apertureM", "centralObstructionM", "throughput"] },
  { legend: "Detector", keys: ["readNoiseElectrons", "darkElectronsPerSPerPixel", "gainElectronsPerAdu", "fullWellElectrons", "pixelScaleArcsec"] },
  { legend: "Seeing, aperture and visits", keys: ["seeingFwhmArcsec", "apertureRadiusFwhm", "overheadS", "signalToNoiseGoal"], hasPsfShape: true },
];

const psfShapeLabels: Record<PsfShapeKind, string> = {
  moffat: `Moffat, β = ${KOLMOGOROV_MOFFAT_BETA} (seeing-limited; Trujillo et al. 2001)`,
  gaussian: "Gaussian",
};

const magnitudeSystems: readonly MagnitudeSystem[] = ["vega", "ab"];
const selectClass = "mt-1 rounded border border-void-edge bg-void px-2 py-1";

/** The built-in bands by label, then the team's own band (named `customLabel` when the proposal has one). */
export function BandOptions({ customLabel }: { customLabel: string }) {
  return (
    <>
      {standardBands.map((band) => (
        <option key={band.id} value={band.id}>
          {band.label}
        </option>
      ))}
      <option value={CUSTOM_BAND_ID}>{customLabel}</option>
    </>
  );
}

/** A select with its label above and its field errors beside it. */
function ChoiceField({ label, errors, children, ...select }: React.SelectHTMLAttributes<HTMLSelectElement> & { label: string; errors?: string[] }) {
  return (
    <label className="flex flex-col text-sm font-semibold text-dusk">
      {label}
      <select aria-invalid={errors && errors.length > 0 ? true : undefined} className={`${selectClass} font-normal`} {...select}>
        {children}
      </select>
      {errors && errors.length > 0 && (
        <span role="alert" className="mt-1 font-normal text-alarm">
          {errors.join(" ")}
        </span>
      )}
    </label>
  );
}

/**
 * The photon budget's settings on the settings page: telescope, detector, seeing and visits, the band
 * observed (built-in or the team's own) and the site's sky per band. Each input is named by its API
 * field path, so the server's refusals show beside it.
 */
export function PhotometryFields({ fields, initial }: { fields: FieldErrors; initial: PhotometrySettings }) {
  const texts = photometryFieldTexts(initial);
  const customLabel = initial.customBand ? `Your own band (${initial.customBand.label})` : "Your own band (described below)";
  return (
    <section aria-labelledby="photometry-heading" className="space-y-4">
      <h2 id="photometry-heading" className="text-lg font-semibold">
        Photometry (the photon budget)
      </h2>
      <p className="max-w-3xl text-sm text-dusk-dim">
        Each target&apos;s signal-to-noise at every scheduled visit, its exposure time and the hours the proposal asks for are
        computed from these settings, the target&apos;s source magnitude and the night&apos;s sky, Moon included.
      </p>
      {initial.apertureM === null && (
        <p className="text-sm text-ember" data-testid="aperture-needed">
          No telescope aperture yet: the photon budget needs it. Until it is given, no target has a signal-to-noise or a time request.
        </p>
      )}
      {settingGroups.map(({ legend, keys, hasPsfShape }) => (
        <fieldset key={legend} className="grid gap-4 md:grid-cols-3">
          <legend className="mb-2 text-sm font-semibold text-dusk-dim">{legend}</legend>
          {keys.map((key) => {
            const name = photometryInputName(key);
            return (
              <QuantityInput
                key={key}
                spec={photometryQuantities[key]}
                label={settingInputs[key].label}
                name={name}
                inputMode={photometryQuantities[key].kind === "number" ? "decimal" : undefined}
                required={key !== "apertureM"}
                defaultValue={texts[name]}
                hint={settingInputs[key].hint}
                errors={fields[name]}
              />
            );
          })}
          {hasPsfShape && (
            <ChoiceField label="PSF shape" name={photometryInputName("psfShape")} defaultValue={initial.psfShape} errors={fields[photometryInputName("psfShape")]}>
              <ChoiceOptions values={psfShapeKinds} labels={psfShapeLabels} />
            </ChoiceField>
          )}
        </fieldset>
      ))}
      <fieldset className="space-y-4">
        <legend className="mb-2 text-sm font-semibold text-dusk-dim">Band</legend>
        <ChoiceField label="Band observed" name={photometryInputName("bandId")} defaultValue={initial.bandId} errors={fields[photometryInputName("bandId")]}>
          <BandOptions customLabel={customLabel} />
        </ChoiceField>
        <CustomBandFields fields={fields} texts={texts} />
      </fieldset>
      <SiteSkyTable fields={fields} initial={initial} />
    </section>
  );
}

/** The team's own band: empty unless they describe one (then every field but the AB − Vega offset is needed). */
function CustomBandFields({ fields, texts }: { fields: FieldErrors; texts: Record<string, string> }) {
  const field = (name: string, label: string, hint?: string) => (
    <Field label={label} name={name} inputMode={name.endsWith("label") ? undefined : "decimal"} defaultValue={texts[name]} hint={hint} errors={fields[name]} />
  );
  return (
    <fieldset className="grid gap-4 md:grid-cols-3">
      <legend className="mb-2 text-sm text-dusk-dim">Your own band (leave empty when a built-in band is used)</legend>
      {field(customBandInputName("label"), "Band name", "e.g. Hα narrow")}
      {field(customBandInputName("effectiveWavelengthNm"), "Effective wavelength (nm)")}
      {field(customBandInputName("widthNm"), "Band width (nm)")}
      {field(customBandInputName("zeroPointWPerM2PerNm"), "Zero point (W m⁻² nm⁻¹)", "f_λ of a 0-mag star; V (Johnson–Cousins) is 3.631e-11")}
      <ChoiceField label="Magnitude system of the zero point" name={customBandInputName("zeroPointSystem")} defaultValue={texts[customBandInputName("zeroPointSystem")]} errors={fields[customBandInputName("zeroPointSystem")]}>
        <ChoiceOptions values={magnitudeSystems} labels={magnitudeSystemLabels} />
      </ChoiceField>
      {field(customBandInputName("abMinusVegaMag"), "AB − Vega (mag)", "optional")}
      {fields["photometry.customBand"] && (
        <p role="alert" className="text-sm text-alarm md:col-span-3">
          {fields["photometry.customBand"].join(" ")}
        </p>
      )}
    </fieldset>
  );
}

const skyColumnWords: Record<(typeof skyFields)[number], string> = {
  darkSkyMagPerArcsec2: "dark sky (mag/arcsec²)",
  extinctionMagPerAirmass: "extinction (mag/airmass)",
};

/**
 * The site's dark sky and extinction per band. A row shows the typical dark site's values (its
 * source on hover) until the team edits it; an edited row is the team's own and is saved, and
 * "Use typical" takes it back out.
 */
function SiteSkyTable({ fields, initial }: { fields: FieldErrors; initial: PhotometrySettings }) {
  const [ownBands, setOwnBands] = useState<ReadonlySet<string>>(() => new Set(Object.keys(initial.skyByBand)));
  // A reset remounts the row's inputs with the typical values as their text.
  const [resets, setResets] = useState<Record<string, number>>({});
  const labelOf = (bandId: string) => (bandId === CUSTOM_BAND_ID ? (initial.customBand?.label ?? "Your own band") : (standardBands.find((band) => band.id === bandId)?.label ?? bandId));
  return (
    <fieldset>
      <legend className="mb-2 text-sm font-semibold text-dusk-dim">Site sky per band</legend>
      <p className="mb-2 text-xs text-dusk-dim">Moonless zenith sky and extinction per air mass; the Moon&apos;s light is added per visit.</p>
      <table className="text-left text-sm" data-testid="site-sky-table">
        <thead className="text-dusk-dim">
          <tr>
            <th scope="col" className="pr-4 font-normal">Band</th>
            <th scope="col" className="pr-4 font-normal">Dark sky (mag/arcsec²)</th>
            <th scope="col" className="pr-4 font-normal">Extinction (mag/airmass)</th>
            <th scope="col" className="font-normal">Values</th>
          </tr>
        </thead>
        <tbody>
          {skyBandIds.map((bandId) => {
            const typical = typicalDarkSiteConditions[bandId];
            const own = initial.skyByBand[bandId];
            const isOwn = ownBands.has(bandId);
            const label = labelOf(bandId);
            const markOwn = () => setOwnBands((current) => (current.has(bandId) ? current : new Set(current).add(bandId)));
            const reset = () => {
              setOwnBands((current) => {
                const next = new Set(current);
                next.delete(bandId);
                return next;
              });
              setResets((current) => ({ ...current, [bandId]: (current[bandId] ?? 0) + 1 }));
            };
            // Before any reset the stored values show; after one, the typical values (or empty, for the own band).
            const start = (resets[bandId] ?? 0) === 0 && own !== undefined ? own : typical;
            return (
              <tr key={`${bandId}-${resets[bandId] ?? 0}`} data-testid={`sky-row-${bandId}`} className="align-top">
                <th scope="row" className="py-1 pr-4 font-normal">{label}</th>
                {skyFields.map((field) => (
                  <td key={field} className="py-1 pr-4">
                    <SkyInput
                      name={skyInputName(bandId, field)}
                      field={field}
                      label={`${label}: ${skyColumnWords[field]}`}
                      defaultValue={start === undefined ? "" : String(start[field])}
                      errors={fields[skyInputName(bandId, field)]}
                      onEdit={markOwn}
                    />
                  </td>
                ))}
                <td className="py-1">
                  {isOwn ? (
                    <span className="flex items-center gap-2">
                      <input type="hidden" name={skyOwnMarkerName(bandId)} value="1" />
                      <span className="text-glint">your site</span>
                      <button type="button" className="text-xs text-dusk-dim underline" aria-label={`Use the typical dark site for ${label}`} onClick={reset}>
                        {typical === undefined ? "clear" : "use typical"}
                      </button>
                    </span>
                  ) : typical === undefined ? (
                    <span className="text-dusk-dim">no typical values: give your site&apos;s to use this band</span>
                  ) : (
                    <span className="text-dusk-dim underline decoration-dotted" title={typical.source}>
                      typical dark site
                    </span>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </fieldset>
  );
}

/**
 * One cell of the sky table: a compact input named by its row and column (no label of its own
 * above it), with the same echo and refusal words as every quantity field.
 */
function SkyInput({ name, field, label, defaultValue, errors, onEdit }: { name: string; field: (typeof skyFields)[number]; label: string; defaultValue: string; errors?: string[]; onEdit: () => void }) {
  const [text, setText] = useState(defaultValue);
  const id = useId();
  const echo = quantityEcho(photometryQuantities[field], text);
  const hasErrors = errors !== undefined && errors.length > 0;
  const describedBy = [echo ? `${id}-echo` : undefined, hasErrors ? `${id}-error` : undefined].filter(Boolean).join(" ");
  return (
    <>
      <input
        aria-label={label}
        aria-describedby={describedBy === "" ? undefined : describedBy}
        name={name}
        inputMode="decimal"
        defaultValue={defaultValue}
        aria-invalid={hasErrors ? true : undefined}
        onChange={(event) => {
          setText(event.target.value);
          onEdit();
        }}
        className="w-24 rounded-md border border-void-edge bg-void px-2 py-1 text-dusk"
      />
      {echo && (
        <p id={`${id}-echo`} data-testid={`echo-${name}`} aria-live="polite" className={`mt-1 max-w-48 text-xs ${echo.ok ? "text-glint" : "text-alarm"}`}>
          {echo.ok ? echo.text : echo.message}
        </p>
      )}
      {hasErrors && (
        <p id={`${id}-error`} role="alert" className="mt-1 max-w-48 text-sm text-alarm">
          {errors.join(" ")}
        </p>
      )}
    </>
  );
}
