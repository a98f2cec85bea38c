import { measuredLightWords, type PhotonBudgetOutcome, type TargetPhotonBudget } from "@/lib/lensing/photon-budget";
import type { VisitPhotometry } from "@/lib/photometry/visit-budget";
import { dateWords } from "@/lib/lensing/science-case-words";
import { formatSignificant } from "@/lib/numbers/significant";

/** Rows of the per-visit table shown at once; the rest are counted (the figures carry every visit). */
const SHOWN_VISITS = 400;

function snrText(snr: number, precisionMmag: number): string {
  return `S/N ${formatSignificant(snr, 3)} (${formatSignificant(precisionMmag, 3)} mmag)`;
}

function ReferenceRow({ label, photometry, exposureS }: { label: string; photometry: VisitPhotometry; exposureS: number }) {
  return (
    <div className="contents">
      <dt className="text-dusk-dim">{label}</dt>
      <dd className="tabular-nums">
        {snrText(photometry.signalToNoise, photometry.precisionMmag)} in {formatSignificant(exposureS, 3)} s; goal reached in {formatSignificant(photometry.exposureForGoalS, 3)} s
        {photometry.isSaturated ? " (saturates: split the exposure)" : ""}
      </dd>
    </div>
  );
}

/**
 * A target's photon budget: what is measured and in which band, S/N and precision at baseline and at
 * the peak (at the conditions of the visit nearest the peak), the hours requested, and every visit the
 * case needs with its air mass, Moon, sky and S/N. Why there is none, when an input is missing.
 */
export function PhotonBudgetPanel({ outcome }: { outcome: PhotonBudgetOutcome }) {
  if ("notApplicable" in outcome) return null;
  return (
    <section aria-labelledby="photon-budget-heading" className="space-y-3" data-testid="photon-budget">
      <h2 id="photon-budget-heading" className="text-xl font-semibold">
        Photon budget
      </h2>
      {"missing" in outcome ? (
        <p className="text-sm text-dusk-dim" data-testid="photon-budget-missing">
          {outcome.missing}
        </p>
      ) : (
        <BudgetDetails budget={outcome.budget} />
      )}
    </section>
  );
}

function BudgetDetails({ budget }: { budget: TargetPhotonBudget }) {
  const count = budget.visitsJdUtc.length;
  const { series, visitSky } = budget;
  const shown = Math.min(count, SHOWN_VISITS);
  return (
    <>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="text-dusk-dim">Measured</dt>
        <dd>
          {measuredLightWords[budget.measured]}, in {budget.bandLabel}; S/N goal {formatSignificant(budget.signalToNoiseGoal, 3)}, up to {formatSignificant(budget.visitExposureS, 3)} s
          of exposure per visit after {formatSignificant(budget.overheadS, 3)} s of overhead
        </dd>
        {budget.imageMagnitudes.length > 0 && (
          <>
            <dt className="text-dusk-dim">Images</dt>
            <dd className="tabular-nums" data-testid="image-magnitudes">
              {budget.imageMagnitudes.map((magnitude) => formatSignificant(magnitude, 4)).join(", ")} mag (the source's magnitude less 2.5 log₁₀ |μ| of each image, brightest first)
            </dd>
          </>
        )}
        {budget.baseline !== null && <ReferenceRow label="Baseline" photometry={budget.baseline} exposureS={budget.visitExposureS} />}
        {budget.peak !== null && <ReferenceRow label="Peak" photometry={budget.peak} exposureS={budget.visitExposureS} />}
        <dt className="text-dusk-dim">Hours requested</dt>
        <dd className="tabular-nums" data-testid="target-time-request">
          {formatSignificant(budget.timeRequestHours, 3)} h over {count} {count === 1 ? "visit" : "visits"}
        </dd>
      </dl>
      {count > 0 && (
        <details className="text-sm">
          <summary className="cursor-pointer">Every visit the case needs ({count})</summary>
          <div className="max-h-96 overflow-auto">
            <table className="w-full border-collapse tabular-nums" data-testid="visit-budget-table">
              <thead>
                <tr className="text-left text-dusk-dim">
                  <th scope="col" className="px-2 py-1">Visit start (UTC)</th>
                  <th scope="col" className="px-2 py-1">Magnitude</th>
                  <th scope="col" className="px-2 py-1">Air mass</th>
                  <th scope="col" className="px-2 py-1">Moon</th>
                  <th scope="col" className="px-2 py-1">Sky (mag/arcsec²)</th>
                  <th scope="col" className="px-2 py-1">S/N</th>
                  <th scope="col" className="px-2 py-1">Exposure for the goal (s)</th>
                </tr>
              </thead>
              <tbody>
                {Array.from({ length: shown }, (_, i) => (
                  <tr key={i} className={i === budget.worstVisit ? "font-semibold" : undefined}>
                    <td className="px-2 py-0.5">{dateWords(budget.visitsJdUtc[i])}{i === budget.worstVisit ? " (worst)" : ""}</td>
                    <td className="px-2 py-0.5">{formatSignificant(budget.magnitudes[i], 4)}</td>
                    <td className="px-2 py-0.5">{formatSignificant(visitSky.airmass[i], 3)}</td>
                    <td className="px-2 py-0.5">{visitSky.moonZenithDeg[i] > 90 ? "down" : `${Math.round(visitSky.moonSeparationDeg[i])}° away`}</td>
                    <td className="px-2 py-0.5">{formatSignificant(series.skyMagPerArcsec2[i], 4)}</td>
                    <td className="px-2 py-0.5">{formatSignificant(series.signalToNoise[i], 3)}</td>
                    <td className="px-2 py-0.5">
                      {formatSignificant(series.exposureForGoalS[i], 3)}
                      {series.saturated[i] ? " (saturates)" : ""}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            {count > shown && <p className="text-dusk-dim">… and {count - shown} more visits.</p>}
          </div>
        </details>
      )}
    </>
  );
}
