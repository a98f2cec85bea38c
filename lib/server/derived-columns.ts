import "server-only";
import { eq, sql } from "drizzle-orm";
import type { Database } from "@/db/client";
import { targets, type Proposal } from "@/db/schema";
import { deriveTargetColumns } from "@/lib/workspace/derived";
import type { InstrumentDefaults, InstrumentSettings } from "@/lib/workspace/proposal-schema";

/** The lensing scales of a proposal, what the stored verdicts are graded against. */
export function instrumentOf(p: Pick<Proposal, "resolutionMas" | "cadenceHours" | "campaignLengthDays">): InstrumentDefaults {
  return { resolutionMas: p.resolutionMas, cadenceHours: p.cadenceHours, campaignLengthDays: p.campaignLengthDays };
}

/** Every instrument default of a proposal: the lensing scales, the airmass limit, λ and B. */
export function instrumentSettingsOf(p: Proposal): InstrumentSettings {
  return {
    ...instrumentOf(p),
    airmassLimit: p.airmassLimit,
    interferometerWavelengthMm: p.interferometerWavelengthMm,
    interferometerBaselineKm: p.interferometerBaselineKm,
  };
}

/** Whether a change of instrument defaults moves the scales the stored verdicts depend on. */
export function changesLensingScales(before: InstrumentDefaults, after: InstrumentDefaults): boolean {
  return before.resolutionMas !== after.resolutionMas || before.cadenceHours !== after.cadenceHours || before.campaignLengthDays !== after.campaignLengthDays;
}

/**
 * Recomputes the derived columns of every target of a proposal (after its instrument defaults
 * changed). One UPDATE from a JSON record set instead of one per row: 10,000 targets stay one statement.
 */
export async function rederiveTargets(tx: Pick<Database, "select" | "execute">, proposalId: string, instrument: InstrumentDefaults) {
  const rows = await tx.select().from(targets).where(eq(targets.proposalId, proposalId));
  if (rows.length === 0) return;
  const derived = rows.map((row) => {
    const d = deriveTargetColumns(row, instrument);
    return {
      id: row.id,
      einstein_radius_mas: d.einsteinRadiusMas,
      image_separation_mas: d.imageSeparationMas,
      magnification_total: d.magnificationTotal,
      time_delay_days: d.timeDelayDays,
      crossing_time_days: d.crossingTimeDays,
      shadow_diameter_microarcsec: d.shadowDiameterMicroarcsec,
      resolution_verdict: d.resolutionVerdict,
      cadence_verdict: d.cadenceVerdict,
      campaign_verdict: d.campaignVerdict,
    };
  });
  await tx.execute(sql`
    update ${targets} set
      einstein_radius_mas = d.einstein_radius_mas,
      image_separation_mas = d.image_separation_mas,
      magnification_total = d.magnification_total,
      time_delay_days = d.time_delay_days,
      crossing_time_days = d.crossing_time_days,
      shadow_diameter_microarcsec = d.shadow_diameter_microarcsec,
      resolution_verdict = d.resolution_verdict,
      cadence_verdict = d.cadence_verdict,
      campaign_verdict = d.campaign_verdict
    from jsonb_to_recordset(${JSON.stringify(derived)}::jsonb) as d(
      id uuid, einstein_radius_mas float8, image_separation_mas float8, magnification_total float8,
      time_delay_days float8, crossing_time_days float8, shadow_diameter_microarcsec float8,
      resolution_verdict feasibility_verdict, cadence_verdict feasibility_verdict, campaign_verdict feasibility_verdict)
    where ${targets.id} = d.id`);
}
