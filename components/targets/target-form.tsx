"use client";

import { useState } from "react";
import { useSWRConfig } from "swr";
import { lensModels, targetQuantities, type LensModel } from "@/lib/workspace/target-schema";
import { readQuantityField } from "@/lib/workspace/quantity-field";
import { unsolvedColumns } from "@/lib/workspace/derived";
import type { TargetPage, TargetView } from "@/lib/workspace/target-view";
import { apiFetch } from "@/components/shared/api-client";
import { FormError, buttonClass } from "@/components/shared/field";
import { formatSignificant } from "@/lib/numbers/significant";
import { TargetFieldset, targetBodyOf, type GeometrySource } from "@/components/targets/target-edit-fields";
import { emptyFilters, initialTargetSorting, targetListUrl, targetPageSize } from "@/components/targets/target-table-state";
import { formValues, useFormSubmit } from "@/components/shared/use-form-submit";

type TargetBody = ReturnType<typeof targetBodyOf>;

/** A typed quantity as the server will read it, for the optimistic row; `fallback` until it reads. */
function numberOr(field: keyof typeof targetQuantities, value: string | null, fallback: number | null): number | null {
  if (value === null) return fallback;
  const reading = readQuantityField(targetQuantities[field], value);
  return reading.ok ? reading.value : fallback;
}

/** The row the table shows while the server works: the typed values, no computed columns yet. */
function pendingRowOf(proposalId: string, body: TargetBody): TargetView {
  return {
    id: `pending-${Date.now()}`,
    proposalId,
    name: `${body.name} (saving…)`,
    raDeg: Number.NaN,
    decDeg: Number.NaN,
    raText: body.ra,
    decText: body.dec,
    lensModel: body.lensModel,
    lensMassSolar: numberOr("lensMassSolar", body.lensMassSolar, null),
    velocityDispersionKmPerS: numberOr("velocityDispersionKmPerS", body.velocityDispersionKmPerS, null),
    lensDistancePc: numberOr("lensDistancePc", body.lensDistancePc, null),
    sourceDistancePc: numberOr("sourceDistancePc", body.sourceDistancePc, null),
    lensRedshift: numberOr("lensRedshift", body.lensRedshift, null),
    sourceRedshift: numberOr("sourceRedshift", body.sourceRedshift, null),
    sourceOffsetThetaE: numberOr("sourceOffsetThetaE", body.sourceOffsetThetaE, Number.NaN) as number,
    properMotionMasPerYr: numberOr("properMotionMasPerYr", body.properMotionMasPerYr, null),
    scienceCase: body.scienceCase,
    // The table shows no peak time; the server's answer brings it.
    eventPeakJdUtc: null,
    sourceRadiusSolar: numberOr("sourceRadiusSolar", body.sourceRadiusSolar, null),
    sourceRadiusThetaE: numberOr("sourceRadiusThetaE", body.sourceRadiusThetaE, null),
    limbDarkeningU: numberOr("limbDarkeningU", body.limbDarkeningU, null),
    sourceMagnitude: numberOr("sourceMagnitude", body.sourceMagnitude, null),
    sourceBand: body.sourceBand,
    blendFraction: numberOr("blendFraction", body.blendFraction, null),
    priority: numberOr("priority", body.priority, Number.NaN) as number,
    status: "candidate",
    tags: body.tags,
    ...unsolvedColumns,
    updatedAt: new Date().toISOString(),
  };
}

/**
 * Adds a target (Co-I and PI); the server computes its lensing columns and answers with them.
 * `initialPage` is the table's first page as the server rendered it: SWR keeps no cache entry for a
 * page that still equals its fallback data, so the optimistic row is added to this one instead.
 */
export function TargetForm({ proposalId, initialPage }: { proposalId: string; initialPage?: TargetPage }) {
  const { cache, mutate } = useSWRConfig();
  const { fields, message, isBusy, run } = useFormSubmit();
  const [model, setModel] = useState<LensModel>(lensModels[0]);
  const [geometry, setGeometry] = useState<GeometrySource>("distance");
  const [added, setAdded] = useState<TargetView | null>(null);

  return (
    <form
      aria-label="Add a target"
      className="space-y-4 rounded-lg border border-void-edge bg-void-raised p-5"
      onSubmit={(event) => {
        event.preventDefault();
        const form = event.currentTarget;
        const body = targetBodyOf(formValues(form), model, geometry);
        const listPrefix = `/api/proposals/${proposalId}/targets?`;
        const initialUrl = targetListUrl(proposalId, initialTargetSorting, 1, targetPageSize, emptyFilters);
        const pending = pendingRowOf(proposalId, body);
        void run(async () => {
          setAdded(null);
          const request = apiFetch<{ target: TargetView }>(`/api/proposals/${proposalId}/targets`, { method: "POST", body });
          // Optimistic, like the team panel: the row shows at once at the top of every cached page of
          // the table, and SWR takes it out again if the server refuses.
          // One mutate per key: with a key filter SWR would apply the first page's optimistic data to all.
          const listKeys = [...cache.keys()].filter((key) => key.startsWith(listPrefix));
          await Promise.all(
            listKeys.map((key) =>
              mutate<TargetPage>(
                key,
                async (current) => {
                  await request;
                  return current;
                },
                {
                  optimisticData: (current) => {
                    const shown = current ?? (key === initialUrl ? initialPage : undefined);
                    return (shown ? { ...shown, rows: [pending, ...shown.rows], total: shown.total + 1 } : shown) as TargetPage;
                  },
                  rollbackOnError: true,
                  populateCache: false,
                  revalidate: false,
                },
              ),
            ),
          );
          const { target } = await request;
          setAdded(target);
          form.reset();
          // The server's rows (sorted, with computed columns) replace the optimistic one; the activity
          // feed has a new entry too. Awaited, so the answer is on screen when this resolves.
          await mutate((key) => typeof key === "string" && key.startsWith(`/api/proposals/${proposalId}/`));
        });
      }}
    >
      <h2 className="text-xl font-semibold">Add a target</h2>
      <TargetFieldset
        fields={fields}
        initial={{ sourceOffsetThetaE: "0.3", priority: "3" }}
        model={model}
        geometry={geometry}
        onModelChange={setModel}
        onGeometryChange={setGeometry}
      />
      <FormError message={message} />
      {added && (
        <p role="status" className="text-glint" data-testid="added-target">
          Added {added.name}: Einstein radius {formatSignificant(added.einsteinRadiusMas)} mas.
        </p>
      )}
      <button type="submit" className={buttonClass} disabled={isBusy}>
        Add target
      </button>
    </form>
  );
}
