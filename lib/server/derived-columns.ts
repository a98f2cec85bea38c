// Not marked server-only: the startup script (scripts/migrate.ts) and the seeds re-derive through it
// too. It holds no secret and runs no request.
import { eq, inArray, lt, sql } from "drizzle-orm";
import type { Database } from "@/db/client";
import { proposals, targets, type Proposal, type Target } from "@/db/schema";
import { DERIVATION_VERSION, deriveTargetColumns, targetSchedules, type DerivedColumns, type FeasibilitySettings } from "@/lib/workspace/derived";
import type { InstrumentSettings } from "@/lib/workspace/proposal-schema";
import { storedPhotometrySettings } from "@/lib/workspace/photometry-schema";

/** Every instrument default of a proposal: the lensing scales, the airmass limit, λ and B, the schedule's constraints. */
export function instrumentSettingsOf(p: Proposal): InstrumentSettings {
  return {
    resolutionMas: p.resolutionMas,
    cadenceHours: p.cadenceHours,
    campaignLengthDays: p.campaignLengthDays,
    airmassLimit: p.airmassLimit,
    interferometerWavelengthMm: p.interferometerWavelengthMm,
    interferometerBaselineKm: p.interferometerBaselineKm,
    moonMinSeparationDeg: p.moonMinSeparationDeg,
    moonMaxIllumination: p.moonMaxIllumination,
    visitMinutes: p.visitMinutes,
    clearNightFraction: p.clearNightFraction,
    astrometricPrecisionMas: p.astrometricPrecisionMas,
    reachableContrast: p.reachableContrast,
    spectroscopicPrecisionKmPerS: p.spectroscopicPrecisionKmPerS,
  };
}

/** What the derived columns of a proposal's targets are computed against: instrument, site and cycle. */
export function feasibilitySettingsOf(p: Proposal): FeasibilitySettings {
  return {
    site: { name: p.siteName, latitudeDeg: p.siteLatitudeDeg, longitudeDeg: p.siteLongitudeDeg, elevationM: p.siteElevationM, horizonLimitDeg: p.siteHorizonLimitDeg },
    instrument: instrumentSettingsOf(p),
    photometry: storedPhotometrySettings(p.photometry),
    cycleStartDate: p.cycleStartDate,
    cycleEndDate: p.cycleEndDate,
  };
}

/** Whether a change of a proposal moves anything its targets' derived columns depend on. */
export function changesDerivation(before: FeasibilitySettings, after: FeasibilitySettings): boolean {
  return JSON.stringify(before) !== JSON.stringify(after);
}

type TargetInputs = Parameters<typeof deriveTargetColumns>[0] & { raDeg: number; decDeg: number };

/**
 * Targets whose schedules are computed together: the night grid is shared within a batch, and a
 * batch's visits are dropped before the next (at the finest cadence a target collects about 10⁵
 * visits a cycle, so 250 targets hold at most ~200 MB of visit times at once).
 */
const SCHEDULE_BATCH_TARGETS = 250;

/** The derived columns of many targets of one proposal, their schedules computed in shared batches. */
export function deriveMany(rows: readonly TargetInputs[], settings: FeasibilitySettings): DerivedColumns[] {
  const derived: DerivedColumns[] = [];
  for (let start = 0; start < rows.length; start += SCHEDULE_BATCH_TARGETS) {
    const batch = rows.slice(start, start + SCHEDULE_BATCH_TARGETS);
    const schedules = targetSchedules(settings, batch);
    for (const [index, row] of batch.entries()) derived.push(deriveTargetColumns(row, settings, schedules[index]));
  }
  return derived;
}

/** The derived columns of one target (create, update). */
export function deriveOne(row: TargetInputs, settings: FeasibilitySettings): DerivedColumns {
  return deriveMany([row], settings)[0];
}

/** Rows per UPDATE statement: JSON of a few thousand rows stays a few MB. */
const REDERIVE_CHUNK_ROWS = 2000;

/**
 * Recomputes the derived columns of the given targets of one proposal. One UPDATE per chunk from a
 * JSON record set instead of one per row: 10,000 targets stay five statements.
 */
async function writeDerived(tx: Pick<Database, "execute">, rows: readonly Target[], settings: FeasibilitySettings) {
  for (let start = 0; start < rows.length; start += REDERIVE_CHUNK_ROWS) {
    const chunk = rows.slice(start, start + REDERIVE_CHUNK_ROWS);
    const derived = deriveMany(chunk, settings).map((d, index) => ({
      id: chunk[index].id,
      einstein_radius_mas: d.einsteinRadiusMas,
      image_separation_mas: d.imageSeparationMas,
      magnification_total: d.magnificationTotal,
      time_delay_days: d.timeDelayDays,
      crossing_time_days: d.crossingTimeDays,
      shadow_diameter_microarcsec: d.shadowDiameterMicroarcsec,
      time_request_hours: d.timeRequestHours,
      peak_signal_to_noise: d.peakSignalToNoise,
      answered_case: d.answeredCase,
      case_verdict: d.caseVerdict,
      case_answers: d.caseAnswers,
      derivation_version: d.derivationVersion,
    }));
    await tx.execute(sql`
      update ${targets} set
        einstein_radius_mas = d.einstein_radius_mas,
        image_separation_mas = d.image_separation_mas,
        magnification_total = d.magnification_total,
        time_delay_days = d.time_delay_days,
        crossing_time_days = d.crossing_time_days,
        shadow_diameter_microarcsec = d.shadow_diameter_microarcsec,
        time_request_hours = d.time_request_hours,
        peak_signal_to_noise = d.peak_signal_to_noise,
        answered_case = d.answered_case,
        case_verdict = d.case_verdict,
        case_answers = d.case_answers,
        derivation_version = d.derivation_version
      from jsonb_to_recordset(${JSON.stringify(derived)}::jsonb) as d(
        id uuid, einstein_radius_mas float8, image_separation_mas float8, magnification_total float8,
        time_delay_days float8, crossing_time_days float8, shadow_diameter_microarcsec float8, time_request_hours float8, peak_signal_to_noise float8,
        answered_case science_case, case_verdict feasibility_verdict, case_answers jsonb, derivation_version int)
      where ${targets.id} = d.id`);
  }
}

/** Recomputes the derived columns of every target of a proposal (after its settings changed). */
export async function rederiveTargets(tx: Pick<Database, "select" | "execute">, proposal: Proposal) {
  const rows = await tx.select().from(targets).where(eq(targets.proposalId, proposal.id));
  await writeDerived(tx, rows, feasibilitySettingsOf(proposal));
}

/**
 * Re-derives every target whose columns were computed by older rules (`derivation_version` below
 * `DERIVATION_VERSION`), proposal by proposal; run at startup after the migrations, so no stored
 * verdict outlives a rule change. Returns the number of targets re-derived.
 */
export async function rederiveStaleTargets(db: Pick<Database, "select" | "execute" | "selectDistinct">): Promise<number> {
  const stale = await db.selectDistinct({ proposalId: targets.proposalId }).from(targets).where(lt(targets.derivationVersion, DERIVATION_VERSION));
  if (stale.length === 0) return 0;
  const owners = await db.select().from(proposals).where(inArray(proposals.id, stale.map((row) => row.proposalId)));
  let count = 0;
  for (const proposal of owners) {
    const rows = await db.select().from(targets).where(sql`${targets.proposalId} = ${proposal.id} and ${targets.derivationVersion} < ${DERIVATION_VERSION}`);
    await writeDerived(db, rows, feasibilitySettingsOf(proposal));
    count += rows.length;
  }
  return count;
}
