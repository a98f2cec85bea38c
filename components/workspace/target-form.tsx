"use client";

import { useState } from "react";
import { useSWRConfig } from "swr";
import { lensModelLabels, lensModels, type LensModel } from "@/lib/workspace/target-schema";
import type { TargetView } from "@/lib/server/targets";
import { apiFetch } from "@/components/workspace/api-client";
import { ChoiceOptions } from "@/components/workspace/choice-options";
import { Field, FormError, buttonClass } from "@/components/workspace/field";
import { formatQuantity } from "@/components/workspace/format";
import { formValues, useFormSubmit } from "@/components/workspace/use-form-submit";

/** Empty → absent, a number → a number, anything else is sent as typed so the server names the field. */
function optionalNumber(text: string | undefined): number | string | null {
  if (text === undefined || text.trim() === "") return null;
  return Number.isFinite(Number(text)) ? Number(text) : text;
}

/** Adds a target (Co-I and PI); the server computes its lensing columns and answers with them. */
export function TargetForm({ proposalId }: { proposalId: string }) {
  const { mutate } = useSWRConfig();
  const { fields, message, isBusy, run } = useFormSubmit();
  const [model, setModel] = useState<LensModel>("point");
  const [geometry, setGeometry] = useState<"distance" | "redshift">("distance");
  const [added, setAdded] = useState<TargetView | null>(null);

  return (
    <form
      aria-label="Add a target"
      className="space-y-4 rounded-lg border border-void-edge bg-void-raised p-5"
      onSubmit={(event) => {
        event.preventDefault();
        const form = event.currentTarget;
        const v = formValues(form);
        const body = {
          name: v.name,
          ra: v.ra,
          dec: v.dec,
          lensModel: model,
          lensMassSolar: model === "point" ? optionalNumber(v.lensMassSolar) : null,
          velocityDispersionKmPerS: model === "sis" ? optionalNumber(v.velocityDispersionKmPerS) : null,
          lensDistancePc: geometry === "distance" ? optionalNumber(v.lensDistancePc) : null,
          sourceDistancePc: geometry === "distance" ? optionalNumber(v.sourceDistancePc) : null,
          lensRedshift: geometry === "redshift" ? optionalNumber(v.lensRedshift) : null,
          sourceRedshift: geometry === "redshift" ? optionalNumber(v.sourceRedshift) : null,
          sourceOffsetThetaE: optionalNumber(v.sourceOffsetThetaE),
          properMotionMasPerYr: optionalNumber(v.properMotionMasPerYr),
          priority: optionalNumber(v.priority),
          tags: (v.tags ?? "").split(/[\s,]+/).filter(Boolean),
        };
        void run(async () => {
          const { target } = await apiFetch<{ target: TargetView }>(`/api/proposals/${proposalId}/targets`, { method: "POST", body });
          setAdded(target);
          form.reset();
          // Every cached page of this proposal's table and its feed may now be out of date.
          await mutate((key) => typeof key === "string" && key.startsWith(`/api/proposals/${proposalId}/`));
        });
      }}
    >
      <h2 className="text-xl font-semibold">Add a target</h2>
      <div className="grid gap-4 md:grid-cols-3">
        <Field label="Target name" name="name" required errors={fields.name} />
        <Field label="Right ascension" name="ra" placeholder="17 57 12.4 or 269.30" required errors={fields.ra} />
        <Field label="Declination" name="dec" placeholder="-29 12 05 or -29.20" required errors={fields.dec} />
      </div>
      <div className="flex flex-wrap gap-6 text-sm">
        <label className="flex flex-col">
          Lens model
          <select name="lensModel" value={model} onChange={(e) => setModel(e.target.value as LensModel)} className="mt-1 rounded border border-void-edge bg-void px-2 py-1">
            <ChoiceOptions values={lensModels} labels={lensModelLabels} />
          </select>
        </label>
        <label className="flex flex-col">
          Geometry from
          <select value={geometry} onChange={(e) => setGeometry(e.target.value as "distance" | "redshift")} className="mt-1 rounded border border-void-edge bg-void px-2 py-1">
            <option value="distance">Distances (pc)</option>
            <option value="redshift">Redshifts</option>
          </select>
        </label>
      </div>
      <div className="grid gap-4 md:grid-cols-3">
        {model === "point" ? (
          <Field label="Lens mass (M☉)" name="lensMassSolar" inputMode="decimal" errors={fields.lensMassSolar} />
        ) : (
          <Field label="Velocity dispersion (km/s)" name="velocityDispersionKmPerS" inputMode="decimal" errors={fields.velocityDispersionKmPerS} />
        )}
        {geometry === "distance" ? (
          <>
            <Field label="Lens distance (pc)" name="lensDistancePc" inputMode="decimal" errors={fields.lensDistancePc} />
            <Field label="Source distance (pc)" name="sourceDistancePc" inputMode="decimal" errors={fields.sourceDistancePc} />
          </>
        ) : (
          <>
            <Field label="Lens redshift" name="lensRedshift" inputMode="decimal" errors={fields.lensRedshift} />
            <Field label="Source redshift" name="sourceRedshift" inputMode="decimal" errors={fields.sourceRedshift} />
          </>
        )}
        <Field label="Source offset (θE)" name="sourceOffsetThetaE" inputMode="decimal" defaultValue="0.3" required errors={fields.sourceOffsetThetaE} />
        <Field label="Relative proper motion (mas/yr)" name="properMotionMasPerYr" inputMode="decimal" errors={fields.properMotionMasPerYr} />
        <Field label="Priority (1–5)" name="priority" inputMode="numeric" defaultValue="3" required errors={fields.priority} />
        <Field label="Tags" name="tags" placeholder="bulge, high-mag" errors={fields.tags} />
      </div>
      <FormError message={message} />
      {added && (
        <p role="status" className="text-glint" data-testid="added-target">
          Added {added.name}: Einstein radius {formatQuantity(added.einsteinRadiusMas)} mas.
        </p>
      )}
      <button type="submit" className={buttonClass} disabled={isBusy}>
        Add target
      </button>
    </form>
  );
}
