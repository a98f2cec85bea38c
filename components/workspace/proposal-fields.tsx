import type { FieldErrors } from "@/lib/errors";
import type { ProposalInput } from "@/lib/workspace/proposal-schema";
import { Field } from "@/components/workspace/field";

/** Typed text as a number when it reads as one; otherwise the text, so the server names the field. */
const numberOrText = (text: string | undefined) => (text !== undefined && text.trim() !== "" && Number.isFinite(Number(text)) ? Number(text) : text);
/** An optional field: blank is "not set" (null). */
const optionalNumber = (text: string | undefined) => (text === undefined || text.trim() === "" ? null : numberOrText(text));
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
      latitudeDeg: numberOrText(v.latitudeDeg),
      longitudeDeg: numberOrText(v.longitudeDeg),
      elevationM: numberOrText(v.elevationM),
      horizonLimitDeg: numberOrText(v.horizonLimitDeg),
    },
    instrument: {
      resolutionMas: numberOrText(v.resolutionMas),
      cadenceHours: numberOrText(v.cadenceHours),
      campaignLengthDays: numberOrText(v.campaignLengthDays),
      airmassLimit: numberOrText(v.airmassLimit),
      interferometerWavelengthMm: optionalNumber(v.interferometerWavelengthMm),
      interferometerBaselineKm: optionalNumber(v.interferometerBaselineKm),
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
        <Field label="Latitude (deg)" name="latitudeDeg" inputMode="decimal" required defaultValue={text(initial?.site.latitudeDeg)} errors={fields["site.latitudeDeg"]} />
        <Field label="Longitude (deg, east +)" name="longitudeDeg" inputMode="decimal" required defaultValue={text(initial?.site.longitudeDeg)} errors={fields["site.longitudeDeg"]} />
        <Field label="Elevation (m)" name="elevationM" inputMode="decimal" required defaultValue={text(initial?.site.elevationM)} errors={fields["site.elevationM"]} />
        <Field label="Horizon limit (deg)" name="horizonLimitDeg" inputMode="decimal" defaultValue={initial ? text(initial.site.horizonLimitDeg) : "20"} required errors={fields["site.horizonLimitDeg"]} />
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-dusk-dim">Instrument defaults</legend>
        <Field label="Resolution (mas)" name="resolutionMas" inputMode="decimal" required defaultValue={text(initial?.instrument.resolutionMas)} errors={fields["instrument.resolutionMas"]} />
        <Field label="Cadence (hours)" name="cadenceHours" inputMode="decimal" required defaultValue={text(initial?.instrument.cadenceHours)} errors={fields["instrument.cadenceHours"]} />
        <Field label="Campaign length (days)" name="campaignLengthDays" inputMode="decimal" required defaultValue={text(initial?.instrument.campaignLengthDays)} errors={fields["instrument.campaignLengthDays"]} />
        <Field label="Airmass limit" name="airmassLimit" inputMode="decimal" required defaultValue={initial ? text(initial.instrument.airmassLimit) : "2"} hint="2 ≈ 30° altitude" errors={fields["instrument.airmassLimit"]} />
        <Field label="Interferometer wavelength λ (mm)" name="interferometerWavelengthMm" inputMode="decimal" defaultValue={text(initial?.instrument.interferometerWavelengthMm)} hint="optional, with the baseline" errors={fields["instrument.interferometerWavelengthMm"]} />
        <Field label="Longest baseline B (km)" name="interferometerBaselineKm" inputMode="decimal" defaultValue={text(initial?.instrument.interferometerBaselineKm)} hint="optional, with the wavelength" errors={fields["instrument.interferometerBaselineKm"]} />
      </fieldset>
    </>
  );
}
