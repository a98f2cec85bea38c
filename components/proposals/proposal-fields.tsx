import type { FieldErrors } from "@/lib/errors";
import { proposalQuantities, type ProposalInput } from "@/lib/workspace/proposal-schema";
import { Field } from "@/components/shared/field";
import { QuantityInput } from "@/components/shared/quantity-input";

/** A quantity as typed: the server reads it with its unit (one parser for the form and the API). */
const typed = (text: string | undefined) => text ?? "";
/** An optional field: blank is "not set" (null). */
const optionalTyped = (text: string | undefined) => (text === undefined || text.trim() === "" ? null : text);
const optionalDate = (text: string | undefined) => (text === undefined || text.trim() === "" ? null : text);

/** The request body of the create and edit forms, from the form's values by input name. */
export function proposalBody(v: Record<string, string>) {
  return {
    title: v.title,
    cycle: v.cycle,
    abstract: v.abstract ?? "",
    cycleStartDate: optionalDate(v.cycleStartDate),
    cycleEndDate: optionalDate(v.cycleEndDate),
    site: {
      name: v.siteName,
      latitudeDeg: typed(v.latitudeDeg),
      longitudeDeg: typed(v.longitudeDeg),
      elevationM: typed(v.elevationM),
      horizonLimitDeg: typed(v.horizonLimitDeg),
    },
    instrument: {
      resolutionMas: typed(v.resolutionMas),
      cadenceHours: typed(v.cadenceHours),
      campaignLengthDays: typed(v.campaignLengthDays),
      airmassLimit: typed(v.airmassLimit),
      interferometerWavelengthMm: optionalTyped(v.interferometerWavelengthMm),
      interferometerBaselineKm: optionalTyped(v.interferometerBaselineKm),
      moonMinSeparationDeg: optionalTyped(v.moonMinSeparationDeg),
      moonMaxIllumination: optionalTyped(v.moonMaxIllumination),
      visitMinutes: typed(v.visitMinutes),
      clearNightFraction: typed(v.clearNightFraction),
      astrometricPrecisionMas: optionalTyped(v.astrometricPrecisionMas),
      reachableContrast: optionalTyped(v.reachableContrast),
      spectroscopicPrecisionKmPerS: optionalTyped(v.spectroscopicPrecisionKmPerS),
    },
  };
}

const text = (value: number | null | undefined) => (value === null || value === undefined ? "" : String(value));

/**
 * Every field of a proposal, shared by the create and edit forms; each shows its own errors
 * (keyed by the API's field paths). `initial` fills them for editing.
 */
export function ProposalFields({ fields, initial }: { fields: FieldErrors; initial?: ProposalInput }) {
  return (
    <>
      <div className="grid gap-4 md:grid-cols-2">
        <Field label="Title" name="title" required defaultValue={initial?.title} errors={fields.title} />
        <Field label="Observing cycle" name="cycle" placeholder="2031A" required defaultValue={initial?.cycle} errors={fields.cycle} />
      </div>
      <div className="grid gap-4 md:grid-cols-2">
        <Field label="First night of the cycle" name="cycleStartDate" type="date" defaultValue={initial?.cycleStartDate ?? ""} hint="evening date; leave both empty if not yet known" errors={fields.cycleStartDate} />
        <Field label="Last night of the cycle" name="cycleEndDate" type="date" defaultValue={initial?.cycleEndDate ?? ""} hint="evening date, inclusive" errors={fields.cycleEndDate} />
      </div>
      <label className="block text-sm font-semibold">
        Abstract
        <textarea name="abstract" rows={3} defaultValue={initial?.abstract} className="mt-1 w-full rounded-md border border-void-edge bg-void px-3 py-2 font-normal" />
      </label>
      {fields.abstract && <p role="alert" className="text-sm text-alarm">{fields.abstract.join(" ")}</p>}
      <fieldset className="grid gap-4 md:grid-cols-5">
        <legend className="mb-2 text-sm font-semibold text-dusk-dim">Observing site</legend>
        <Field label="Site name" name="siteName" required defaultValue={initial?.site.name} errors={fields["site.name"]} />
        <QuantityInput spec={proposalQuantities.latitudeDeg} label="Latitude (deg)" name="latitudeDeg" required defaultValue={text(initial?.site.latitudeDeg)} errors={fields["site.latitudeDeg"]} />
        <QuantityInput spec={proposalQuantities.longitudeDeg} label="Longitude (deg, east +)" name="longitudeDeg" required defaultValue={text(initial?.site.longitudeDeg)} errors={fields["site.longitudeDeg"]} />
        <QuantityInput spec={proposalQuantities.elevationM} label="Elevation (m)" name="elevationM" required defaultValue={text(initial?.site.elevationM)} errors={fields["site.elevationM"]} />
        <QuantityInput spec={proposalQuantities.horizonLimitDeg} label="Horizon limit (deg)" name="horizonLimitDeg" defaultValue={initial ? text(initial.site.horizonLimitDeg) : "20"} required errors={fields["site.horizonLimitDeg"]} />
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-dusk-dim">Instrument defaults</legend>
        <QuantityInput spec={proposalQuantities.resolutionMas} label="Resolution (mas)" name="resolutionMas" required defaultValue={text(initial?.instrument.resolutionMas)} hint="or with a unit: 50 uas, 0.05 arcsec" errors={fields["instrument.resolutionMas"]} />
        <QuantityInput spec={proposalQuantities.cadenceHours} label="Cadence (hours)" name="cadenceHours" required defaultValue={text(initial?.instrument.cadenceHours)} hint="or with a unit: 30 min, 1 d" errors={fields["instrument.cadenceHours"]} />
        <QuantityInput spec={proposalQuantities.campaignLengthDays} label="Campaign length (days)" name="campaignLengthDays" required defaultValue={text(initial?.instrument.campaignLengthDays)} hint="or with a unit: 2 yr" errors={fields["instrument.campaignLengthDays"]} />
        <QuantityInput spec={proposalQuantities.airmassLimit} label="Airmass limit" name="airmassLimit" inputMode="decimal" required defaultValue={initial ? text(initial.instrument.airmassLimit) : "2"} hint="2 ≈ 30° altitude" errors={fields["instrument.airmassLimit"]} />
        <QuantityInput spec={proposalQuantities.interferometerWavelengthMm} label="Interferometer wavelength λ (mm)" name="interferometerWavelengthMm" defaultValue={text(initial?.instrument.interferometerWavelengthMm)} hint="optional, with the baseline; or 2.2 um, 230 GHz" errors={fields["instrument.interferometerWavelengthMm"]} />
        <QuantityInput spec={proposalQuantities.interferometerBaselineKm} label="Longest baseline B (km)" name="interferometerBaselineKm" defaultValue={text(initial?.instrument.interferometerBaselineKm)} hint="optional, with the wavelength" errors={fields["instrument.interferometerBaselineKm"]} />
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-dusk-dim">Observing constraints (the simulated schedule)</legend>
        <QuantityInput spec={proposalQuantities.moonMinSeparationDeg} label="Minimum Moon separation (deg)" name="moonMinSeparationDeg" defaultValue={initial ? text(initial.instrument.moonMinSeparationDeg) : "30"} hint="empty: no Moon constraint" errors={fields["instrument.moonMinSeparationDeg"]} />
        <QuantityInput spec={proposalQuantities.moonMaxIllumination} label="Largest Moon illumination" name="moonMaxIllumination" inputMode="decimal" defaultValue={text(initial?.instrument.moonMaxIllumination)} hint="optional, 0 to 1 (0.5: up to half Moon)" errors={fields["instrument.moonMaxIllumination"]} />
        <QuantityInput spec={proposalQuantities.visitMinutes} label="Time per visit (min)" name="visitMinutes" required defaultValue={initial ? text(initial.instrument.visitMinutes) : "20"} hint="or with a unit: 1 h" errors={fields["instrument.visitMinutes"]} />
        <QuantityInput spec={proposalQuantities.clearNightFraction} label="Clear-night fraction" name="clearNightFraction" inputMode="decimal" required defaultValue={initial ? text(initial.instrument.clearNightFraction) : "1"} hint="share of nights clear at the site; 1 counts every night" errors={fields["instrument.clearNightFraction"]} />
        <QuantityInput spec={proposalQuantities.astrometricPrecisionMas} label="Astrometric precision per epoch (mas)" name="astrometricPrecisionMas" defaultValue={text(initial?.instrument.astrometricPrecisionMas)} hint="optional, for astrometric microlensing; or 100 uas" errors={fields["instrument.astrometricPrecisionMas"]} />
        <QuantityInput spec={proposalQuantities.reachableContrast} label="Reachable contrast (flux ratio)" name="reachableContrast" inputMode="decimal" defaultValue={text(initial?.instrument.reachableContrast)} hint="optional: the largest brighter/fainter flux ratio of two images the instrument separates; Δm mag is 10^(0.4 Δm)" errors={fields["instrument.reachableContrast"]} />
        <QuantityInput spec={proposalQuantities.spectroscopicPrecisionKmPerS} label="Spectroscopic precision per epoch (km/s)" name="spectroscopicPrecisionKmPerS" defaultValue={text(initial?.instrument.spectroscopicPrecisionKmPerS)} hint="optional, for a relativistic orbit's redshift; or 500 m/s" errors={fields["instrument.spectroscopicPrecisionKmPerS"]} />
      </fieldset>
    </>
  );
}
