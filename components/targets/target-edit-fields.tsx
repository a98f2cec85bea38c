"use client";

import type { FieldErrors } from "@/lib/errors";
import { lensModelOf, lensParameters, usesParameter } from "@/lib/lensing/registry";
import type { LensParameterKey } from "@/lib/lensing/lens-model";
import { scienceCaseLabels } from "@/lib/lensing/science-cases";
import { scienceCaseIds, type ScienceCaseId } from "@/lib/lensing/science-case-inputs";
import { lensModelLabels, lensModels, semiMajorAxisKeyOf, targetQuantities, type CreateTargetInput, type LensModel } from "@/lib/workspace/target-schema";
import { ChoiceOptions } from "@/components/shared/choice-options";
import { BandOptions } from "@/components/shared/photometry-fields";
import { Field } from "@/components/shared/field";
import { QuantityInput } from "@/components/shared/quantity-input";

/** Where a target's geometry comes from: Galactic distances or cosmological redshifts. */
export type GeometrySource = "distance" | "redshift";

/** What the fieldset starts with: each input's text by name (empty where the target has no value). */
export type TargetFieldTexts = Partial<Record<TargetFieldName | typeof SEMI_MAJOR_AXIS_INPUT, string>>;

/** The one input of the orbit's semi-major axis, in au or as an angle; its text goes to one of two fields (`semiMajorAxisKeyOf`). */
export const SEMI_MAJOR_AXIS_INPUT = "orbitSemiMajorAxis";

/** The text inputs and the science case's select: every field of a new target but the lens model. */
type TargetFieldName = Exclude<keyof CreateTargetInput, "lensModel">;

/** Empty → absent; anything else is sent as typed, and the server reads it with its unit (one parser for the form and the API). */
export function optionalTyped(text: string | undefined): string | null {
  if (text === undefined || text.trim() === "") return null;
  return text;
}

/**
 * The request body for the fieldset's inputs. The parameter of the model not chosen and the geometry
 * not chosen are sent as null, so switching a target from distances to redshifts clears the distances.
 */
export function targetBodyOf(v: Record<string, string>, model: LensModel, geometry: GeometrySource) {
  return {
    name: v.name,
    ra: v.ra,
    dec: v.dec,
    lensModel: model,
    ...lensParameterBody(v, model),
    lensDistancePc: geometry === "distance" ? optionalTyped(v.lensDistancePc) : null,
    sourceDistancePc: geometry === "distance" ? optionalTyped(v.sourceDistancePc) : null,
    lensRedshift: geometry === "redshift" ? optionalTyped(v.lensRedshift) : null,
    sourceRedshift: geometry === "redshift" ? optionalTyped(v.sourceRedshift) : null,
    sourceOffsetThetaE: optionalTyped(v.sourceOffsetThetaE),
    properMotionMasPerYr: optionalTyped(v.properMotionMasPerYr),
    scienceCase: (optionalTyped(v.scienceCase) as ScienceCaseId | null),
    eventPeakJdUtc: optionalTyped(v.eventPeakJdUtc),
    sourceRadiusSolar: optionalTyped(v.sourceRadiusSolar),
    sourceRadiusThetaE: optionalTyped(v.sourceRadiusThetaE),
    limbDarkeningU: optionalTyped(v.limbDarkeningU),
    einsteinTimeDays: optionalTyped(v.einsteinTimeDays),
    parallaxNorth: optionalTyped(v.parallaxNorth),
    parallaxEast: optionalTyped(v.parallaxEast),
    ...orbitBody(v),
    sourceMagnitude: optionalTyped(v.sourceMagnitude),
    // Empty: the proposal's band, which follows a later change of the proposal's settings.
    sourceBand: optionalTyped(v.sourceBand),
    blendFraction: optionalTyped(v.blendFraction),
    priority: optionalTyped(v.priority),
    tags: (v.tags ?? "").split(/[\s,]+/).filter(Boolean),
  };
}

/** The orbiting star's elements as typed; the semi-major axis goes to the au or the angle field by its unit, the other null. */
function orbitBody(v: Record<string, string>) {
  const axis = optionalTyped(v[SEMI_MAJOR_AXIS_INPUT]);
  const axisKey = axis === null ? null : semiMajorAxisKeyOf(axis);
  return {
    orbitSemiMajorAxisAu: axisKey === "orbitSemiMajorAxisAu" ? axis : null,
    orbitSemiMajorAxisMas: axisKey === "orbitSemiMajorAxisMas" ? axis : null,
    orbitEccentricity: optionalTyped(v.orbitEccentricity),
    orbitPeriodDays: optionalTyped(v.orbitPeriodDays),
    orbitPeriapsisJdUtc: optionalTyped(v.orbitPeriapsisJdUtc),
    orbitInclinationDeg: optionalTyped(v.orbitInclinationDeg),
    orbitNodeDeg: optionalTyped(v.orbitNodeDeg),
    orbitPeriapsisArgumentDeg: optionalTyped(v.orbitPeriapsisArgumentDeg),
  };
}

/** The semi-major axis's reader for what is typed: the angle's for an angle, else the au length's. */
const semiMajorAxisSpec = (text: string) => targetQuantities[semiMajorAxisKeyOf(text)];

/** The server's errors of either semi-major axis field, shown beside the one input. */
function semiMajorAxisErrors(fields: FieldErrors): string[] | undefined {
  const messages = [...(fields.orbitSemiMajorAxisAu ?? []), ...(fields.orbitSemiMajorAxisMas ?? [])];
  return messages.length > 0 ? messages : undefined;
}

/** Every lens parameter: the chosen model's as typed, the others null. */
function lensParameterBody(v: Record<string, string>, model: LensModel): Record<LensParameterKey, string | null> {
  const body: Partial<Record<LensParameterKey, string | null>> = {};
  for (const { key } of lensParameters) body[key] = usesParameter(model, key) ? optionalTyped(v[key]) : null;
  return body as Record<LensParameterKey, string | null>;
}

/** Examples beside a lens parameter's input, where the unit vocabulary offers more than one unit. */
const parameterHints: Partial<Record<LensParameterKey, string>> = { lensMassSolar: "or with a unit: 4e6 Msun, 3 Mjup" };

/** The server keys a bad tag by its index ("tags.2"); the form shows every message beside the one input. */
function tagErrors(fields: FieldErrors): string[] | undefined {
  const messages = Object.entries(fields).flatMap(([key, list]) => (key === "tags" || key.startsWith("tags.") ? list : []));
  return messages.length > 0 ? messages : undefined;
}

interface TargetFieldsetProps {
  fields: FieldErrors;
  initial: TargetFieldTexts;
  model: LensModel;
  geometry: GeometrySource;
  onModelChange: (model: LensModel) => void;
  onGeometryChange: (geometry: GeometrySource) => void;
  /** Shown under the coordinates, e.g. the stored position in sexagesimal form. */
  coordinateHints?: { ra?: string; dec?: string };
}

/** Every input of a target but its status, with the server's field errors beside each one. */
export function TargetFieldset({ fields, initial, model, geometry, onModelChange, onGeometryChange, coordinateHints }: TargetFieldsetProps) {
  return (
    <>
      <div className="grid gap-4 md:grid-cols-3">
        <Field label="Target name" name="name" required defaultValue={initial.name} errors={fields.name} />
        <Field label="Right ascension" name="ra" placeholder="17 57 12.4 or 269.30" required defaultValue={initial.ra} hint={coordinateHints?.ra} errors={fields.ra} />
        <Field label="Declination" name="dec" placeholder="-29 12 05 or -29.20" required defaultValue={initial.dec} hint={coordinateHints?.dec} errors={fields.dec} />
      </div>
      <div className="flex flex-wrap gap-6 text-sm">
        <label className="flex flex-col">
          Lens model
          <select name="lensModel" value={model} onChange={(e) => onModelChange(e.target.value as LensModel)} className="mt-1 rounded border border-void-edge bg-void px-2 py-1">
            <ChoiceOptions values={lensModels} labels={lensModelLabels} />
          </select>
        </label>
        <label className="flex flex-col">
          Science case
          <select name="scienceCase" defaultValue={initial.scienceCase ?? ""} className="mt-1 rounded border border-void-edge bg-void px-2 py-1">
            <option value="">Inferred from the model (default)</option>
            <ChoiceOptions values={scienceCaseIds} labels={scienceCaseLabels} />
          </select>
          {fields.scienceCase && (
            <span role="alert" className="mt-1 text-sm text-alarm">
              {fields.scienceCase.join(" ")}
            </span>
          )}
        </label>
        <label className="flex flex-col">
          Geometry from
          <select value={geometry} onChange={(e) => onGeometryChange(e.target.value as GeometrySource)} className="mt-1 rounded border border-void-edge bg-void px-2 py-1">
            <option value="distance">Distances (pc)</option>
            <option value="redshift">Redshifts</option>
          </select>
        </label>
      </div>
      <div className="grid gap-4 md:grid-cols-3">
        {lensModelOf(model).parameters.map(({ key, label, unitWords }) => (
          <QuantityInput key={key} spec={targetQuantities[key]} label={`${label} (${unitWords})`} name={key} defaultValue={initial[key]} hint={parameterHints[key]} errors={fields[key]} />
        ))}
        {geometry === "distance" ? (
          <>
            <QuantityInput spec={targetQuantities.lensDistancePc} label="Lens distance (pc)" name="lensDistancePc" defaultValue={initial.lensDistancePc} hint="or with a unit: 4 kpc" errors={fields.lensDistancePc} />
            <QuantityInput spec={targetQuantities.sourceDistancePc} label="Source distance (pc)" name="sourceDistancePc" defaultValue={initial.sourceDistancePc} errors={fields.sourceDistancePc} />
          </>
        ) : (
          <>
            <QuantityInput spec={targetQuantities.lensRedshift} label="Lens redshift" name="lensRedshift" inputMode="decimal" defaultValue={initial.lensRedshift} errors={fields.lensRedshift} />
            <QuantityInput spec={targetQuantities.sourceRedshift} label="Source redshift" name="sourceRedshift" inputMode="decimal" defaultValue={initial.sourceRedshift} errors={fields.sourceRedshift} />
          </>
        )}
        <QuantityInput spec={targetQuantities.sourceOffsetThetaE} label="Source offset (θE)" name="sourceOffsetThetaE" inputMode="decimal" required defaultValue={initial.sourceOffsetThetaE} errors={fields.sourceOffsetThetaE} />
        <QuantityInput spec={targetQuantities.properMotionMasPerYr} label="Relative proper motion (mas/yr)" name="properMotionMasPerYr" defaultValue={initial.properMotionMasPerYr} errors={fields.properMotionMasPerYr} />
        <QuantityInput spec={targetQuantities.priority} label="Priority (1–5)" name="priority" inputMode="numeric" required defaultValue={initial.priority} errors={fields.priority} />
        <Field label="Tags" name="tags" placeholder="bulge, high-mag" defaultValue={initial.tags} errors={tagErrors(fields)} />
      </div>
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm text-dusk-dim">The event and its source (microlensing cases; leave empty when they do not apply)</legend>
        <Field label="Event peak t0" name="eventPeakJdUtc" placeholder="2027-06-15 04:30 or JD 2461571.69" defaultValue={initial.eventPeakJdUtc} hint="UTC date and time, or JD" errors={fields.eventPeakJdUtc} />
        <QuantityInput spec={targetQuantities.sourceRadiusSolar} label="Source radius (R☉)" name="sourceRadiusSolar" defaultValue={initial.sourceRadiusSolar} hint="or give ρ instead, not both" errors={fields.sourceRadiusSolar} />
        <QuantityInput spec={targetQuantities.sourceRadiusThetaE} label="Source radius ρ (θE)" name="sourceRadiusThetaE" inputMode="decimal" defaultValue={initial.sourceRadiusThetaE} hint="θ* / θE, typed directly" errors={fields.sourceRadiusThetaE} />
        <QuantityInput spec={targetQuantities.limbDarkeningU} label="Limb-darkening coefficient" name="limbDarkeningU" inputMode="decimal" defaultValue={initial.limbDarkeningU} hint="linear, 0 (uniform disk) to 1" errors={fields.limbDarkeningU} />
        <QuantityInput spec={targetQuantities.einsteinTimeDays} label="Einstein time t_E (fitted)" name="einsteinTimeDays" defaultValue={initial.einsteinTimeDays} hint="days, or with a unit; used instead of θE / proper motion (empty: derived from them)" errors={fields.einsteinTimeDays} />
        <QuantityInput spec={targetQuantities.parallaxNorth} label="Microlens parallax π_E,N" name="parallaxNorth" inputMode="decimal" defaultValue={initial.parallaxNorth} hint="north component, with π_E,E" errors={fields.parallaxNorth} />
        <QuantityInput spec={targetQuantities.parallaxEast} label="Microlens parallax π_E,E" name="parallaxEast" inputMode="decimal" defaultValue={initial.parallaxEast} hint="east component, with π_E,N" errors={fields.parallaxEast} />
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm text-dusk-dim">The source&apos;s brightness (the photon budget; leave empty when it does not apply)</legend>
        <QuantityInput spec={targetQuantities.sourceMagnitude} label="Source magnitude" name="sourceMagnitude" inputMode="decimal" defaultValue={initial.sourceMagnitude} hint="the lensed source alone, unmagnified, in the source band" errors={fields.sourceMagnitude} />
        <label className="flex flex-col text-sm font-semibold text-dusk">
          Source band
          <select name="sourceBand" defaultValue={initial.sourceBand ?? ""} className="mt-1 rounded border border-void-edge bg-void px-2 py-1 font-normal">
            <option value="">The proposal&apos;s band (default)</option>
            <BandOptions customLabel="The proposal's own band" />
          </select>
          {fields.sourceBand && (
            <span role="alert" className="mt-1 font-normal text-alarm">
              {fields.sourceBand.join(" ")}
            </span>
          )}
        </label>
        <QuantityInput spec={targetQuantities.blendFraction} label="Blend fraction f_s" name="blendFraction" inputMode="decimal" defaultValue={initial.blendFraction} hint="the lensed source's share of the baseline flux; 1 = no blended light" errors={fields.blendFraction} />
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-3" aria-label="Orbiting star">
        <legend className="mb-2 text-sm text-dusk-dim">
          Orbiting star (the relativistic-orbit case: a star or pulsar around a point-mass lens; leave empty when there is none)
        </legend>
        <QuantityInput spec={semiMajorAxisSpec} label="Semi-major axis a" name={SEMI_MAJOR_AXIS_INPUT} defaultValue={initial[SEMI_MAJOR_AXIS_INPUT]} hint="in au (a bare number), or as an angle at the lens distance: 125 mas, 0.125 arcsec" errors={semiMajorAxisErrors(fields)} />
        <QuantityInput spec={targetQuantities.orbitEccentricity} label="Eccentricity e" name="orbitEccentricity" inputMode="decimal" defaultValue={initial.orbitEccentricity} hint="0 (a circle) to below 1" errors={fields.orbitEccentricity} />
        <QuantityInput spec={targetQuantities.orbitPeriodDays} label="Orbital period P (days)" name="orbitPeriodDays" defaultValue={initial.orbitPeriodDays} hint="or with a unit: 16 yr; the lens mass, when known, sets the orbit" errors={fields.orbitPeriodDays} />
        <Field label="Time of periapsis T_p" name="orbitPeriapsisJdUtc" placeholder="2018-05-19 or JD 2458257.5" defaultValue={initial.orbitPeriapsisJdUtc} hint="any passage; UTC date and time, or JD" errors={fields.orbitPeriapsisJdUtc} />
        <QuantityInput spec={targetQuantities.orbitInclinationDeg} label="Inclination i (°)" name="orbitInclinationDeg" defaultValue={initial.orbitInclinationDeg} hint="0° to 180°; above 90° the star moves clockwise on the sky" errors={fields.orbitInclinationDeg} />
        <QuantityInput spec={targetQuantities.orbitNodeDeg} label="Ascending node Ω (°)" name="orbitNodeDeg" defaultValue={initial.orbitNodeDeg} hint="position angle of the ascending node, east of north" errors={fields.orbitNodeDeg} />
        <QuantityInput spec={targetQuantities.orbitPeriapsisArgumentDeg} label="Argument of periapsis ω (°)" name="orbitPeriapsisArgumentDeg" defaultValue={initial.orbitPeriapsisArgumentDeg} hint="from the ascending node, in the direction of motion" errors={fields.orbitPeriapsisArgumentDeg} />
      </fieldset>
    </>
  );
}
