"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import type { TargetView } from "@/lib/workspace/target-view";
import { apiFetch } from "@/components/shared/api-client";
import { FormError, buttonClass, quietButtonClass } from "@/components/shared/field";
import { SEMI_MAJOR_AXIS_INPUT, TargetFieldset, targetBodyOf, type GeometrySource, type TargetFieldTexts } from "@/components/targets/target-edit-fields";
import { formValues, useFormSubmit } from "@/components/shared/use-form-submit";
import { eventPeakText } from "@/lib/workspace/event-peak";
import { degreesFieldText } from "@/lib/workspace/coordinates";

const textOf = (value: number | null | undefined) => (value == null ? "" : String(value));

/** The stored target as the inputs' starting text. */
export function targetFieldTexts(t: TargetView): TargetFieldTexts {
  return {
    name: t.name,
    ra: degreesFieldText(t.raDeg),
    dec: degreesFieldText(t.decDeg),
    lensMassSolar: textOf(t.lensMassSolar),
    velocityDispersionKmPerS: textOf(t.velocityDispersionKmPerS),
    lensDistancePc: textOf(t.lensDistancePc),
    sourceDistancePc: textOf(t.sourceDistancePc),
    lensRedshift: textOf(t.lensRedshift),
    sourceRedshift: textOf(t.sourceRedshift),
    sourceOffsetThetaE: textOf(t.sourceOffsetThetaE),
    properMotionMasPerYr: textOf(t.properMotionMasPerYr),
    scienceCase: t.scienceCase ?? "",
    // As a Julian date with every stored digit, so saving an untouched form keeps t0.
    eventPeakJdUtc: t.eventPeakJdUtc == null ? "" : eventPeakText(t.eventPeakJdUtc),
    sourceRadiusSolar: textOf(t.sourceRadiusSolar),
    sourceRadiusThetaE: textOf(t.sourceRadiusThetaE),
    limbDarkeningU: textOf(t.limbDarkeningU),
    einsteinTimeDays: textOf(t.einsteinTimeDays),
    parallaxNorth: textOf(t.parallaxNorth),
    parallaxEast: textOf(t.parallaxEast),
    // With its unit, so the one input reads it back into the same column.
    [SEMI_MAJOR_AXIS_INPUT]: t.orbitSemiMajorAxisAu != null ? `${t.orbitSemiMajorAxisAu} au` : t.orbitSemiMajorAxisMas != null ? `${t.orbitSemiMajorAxisMas} mas` : "",
    orbitEccentricity: textOf(t.orbitEccentricity),
    orbitPeriodDays: textOf(t.orbitPeriodDays),
    orbitPeriapsisJdUtc: t.orbitPeriapsisJdUtc == null ? "" : eventPeakText(t.orbitPeriapsisJdUtc),
    orbitInclinationDeg: textOf(t.orbitInclinationDeg),
    orbitNodeDeg: textOf(t.orbitNodeDeg),
    orbitPeriapsisArgumentDeg: textOf(t.orbitPeriapsisArgumentDeg),
    sourceMagnitude: textOf(t.sourceMagnitude),
    sourceBand: t.sourceBand ?? "",
    blendFraction: textOf(t.blendFraction),
    priority: String(t.priority),
    tags: t.tags.join(", "),
  };
}

/**
 * Edits every field of a target but its status (which has its own control). The server validates
 * the whole hypothesis again and recomputes the lensing columns; a refusal shows beside each field.
 */
export function TargetEditForm({ target, targetUrl }: { target: TargetView; targetUrl: string }) {
  const router = useRouter();
  const { fields, message, isBusy, run } = useFormSubmit();
  const [isOpen, setOpen] = useState(false);
  const [model, setModel] = useState(target.lensModel);
  const [geometry, setGeometry] = useState<GeometrySource>(target.lensRedshift != null ? "redshift" : "distance");
  const [saved, setSaved] = useState<string | null>(null);

  if (!isOpen) {
    return (
      <div className="flex flex-wrap items-center gap-3">
        <button
          type="button"
          className={quietButtonClass}
          onClick={() => {
            // The target may have changed since this form last opened (a refresh after a save).
            setModel(target.lensModel);
            setGeometry(target.lensRedshift != null ? "redshift" : "distance");
            setSaved(null);
            setOpen(true);
          }}
        >
          Edit target
        </button>
        {saved && (
          <p role="status" className="text-sm text-glint" data-testid="target-saved">
            {saved}
          </p>
        )}
      </div>
    );
  }
  return (
    <form
      aria-label="Edit target"
      className="space-y-4 rounded-lg border border-void-edge bg-void-raised p-5"
      onSubmit={(event) => {
        event.preventDefault();
        const body = targetBodyOf(formValues(event.currentTarget), model, geometry);
        void run(async () => {
          const { target: updated } = await apiFetch<{ target: TargetView }>(targetUrl, { method: "PATCH", body });
          setSaved(`Saved ${updated.name}; the computed columns are up to date.`);
          setOpen(false);
          router.refresh();
        });
      }}
    >
      <h2 className="text-xl font-semibold">Edit {target.name}</h2>
      <TargetFieldset
        fields={fields}
        initial={targetFieldTexts(target)}
        model={model}
        geometry={geometry}
        onModelChange={setModel}
        onGeometryChange={setGeometry}
        coordinateHints={{ ra: `Stored: ${target.raText} (ICRS)`, dec: `Stored: ${target.decText} (ICRS)` }}
      />
      <FormError message={message} />
      <div className="flex gap-3">
        <button type="submit" className={buttonClass} disabled={isBusy}>
          Save changes
        </button>
        <button type="button" className={quietButtonClass} onClick={() => setOpen(false)}>
          Cancel
        </button>
      </div>
    </form>
  );
}
