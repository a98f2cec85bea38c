"use client";

import { useRouter } from "next/navigation";
import { apiFetch } from "@/components/workspace/api-client";
import { Field, FormError, buttonClass } from "@/components/workspace/field";
import { formValues, useFormSubmit } from "@/components/workspace/use-form-submit";

const numberOrText = (text: string) => (text.trim() !== "" && Number.isFinite(Number(text)) ? Number(text) : text);

/** Starts a proposal; its author becomes the PI. Site and instrument defaults can be changed later. */
export function NewProposalForm() {
  const router = useRouter();
  const { fields, message, isBusy, run } = useFormSubmit();
  return (
    <form
      aria-label="New proposal"
      className="space-y-4 rounded-lg border border-void-edge bg-void-raised p-5"
      onSubmit={(event) => {
        event.preventDefault();
        const v = formValues(event.currentTarget);
        const body = {
          title: v.title,
          cycle: v.cycle,
          abstract: v.abstract ?? "",
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
          },
        };
        void run(async () => {
          const { proposal } = await apiFetch<{ proposal: { id: string } }>("/api/proposals", { method: "POST", body });
          router.push(`/proposals/${proposal.id}`);
        });
      }}
    >
      <h2 className="text-xl font-semibold">Start a proposal</h2>
      <div className="grid gap-4 md:grid-cols-2">
        <Field label="Title" name="title" required errors={fields.title} />
        <Field label="Observing cycle" name="cycle" placeholder="2031A" required errors={fields.cycle} />
      </div>
      <label className="block text-sm font-semibold">
        Abstract
        <textarea name="abstract" rows={3} className="mt-1 w-full rounded-md border border-void-edge bg-void px-3 py-2 font-normal" />
      </label>
      <fieldset className="grid gap-4 md:grid-cols-5">
        <legend className="mb-2 text-sm font-semibold text-dusk-dim">Observing site</legend>
        <Field label="Site name" name="siteName" required errors={fields["site.name"]} />
        <Field label="Latitude (deg)" name="latitudeDeg" inputMode="decimal" required errors={fields["site.latitudeDeg"]} />
        <Field label="Longitude (deg, east +)" name="longitudeDeg" inputMode="decimal" required errors={fields["site.longitudeDeg"]} />
        <Field label="Elevation (m)" name="elevationM" inputMode="decimal" required errors={fields["site.elevationM"]} />
        <Field label="Horizon limit (deg)" name="horizonLimitDeg" inputMode="decimal" defaultValue="20" required errors={fields["site.horizonLimitDeg"]} />
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-dusk-dim">Instrument defaults</legend>
        <Field label="Resolution (mas)" name="resolutionMas" inputMode="decimal" required errors={fields["instrument.resolutionMas"]} />
        <Field label="Cadence (hours)" name="cadenceHours" inputMode="decimal" required errors={fields["instrument.cadenceHours"]} />
        <Field label="Campaign length (days)" name="campaignLengthDays" inputMode="decimal" required errors={fields["instrument.campaignLengthDays"]} />
      </fieldset>
      <FormError message={message} />
      <button type="submit" className={buttonClass} disabled={isBusy}>
        Create proposal
      </button>
    </form>
  );
}
