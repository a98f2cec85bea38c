import type { RelativisticOrbit, RelativisticOrbitOutcome } from "@/lib/lensing/relativistic-orbit";
import { nextPeriapsisJdUtc } from "@/lib/lensing/relativistic-orbit";
import { dateWords, daysWords, numberWords, speedWords } from "@/lib/lensing/science-case-words";
import { ARCSECOND_RAD, SPEED_OF_LIGHT_KM_PER_S } from "@/lib/physics/constants";
import { orbitSkyTitle, orbitSkyView } from "@/lib/figures/orbit-sky-view";
import { ORBIT_SKY_SIZE_PX, orbitSkyPlot } from "@/lib/figures/orbit-sky-plot";
import { FigureSvg } from "@/components/figures/figure-svg";
import { OrbitScenePanel } from "@/components/lensing/orbit-scene-panel";

/** An advance per orbit both ways: "12.1′ (727″)". */
function precessionWords(angleRad: number): string {
  return `${numberWords(angleRad / (60 * ARCSECOND_RAD))}′ (${numberWords(angleRad / ARCSECOND_RAD)}″)`;
}

/** A light-travel time in seconds, with hours or days beside it when long. */
function delayWords(seconds: number): string {
  return seconds < 120 ? `${numberWords(seconds)} s` : `${numberWords(seconds)} s (${daysWords(seconds / 86_400)})`;
}

/** One quantity: the exact value (or the only one) and the first-order value, each with the formula it comes from. */
interface OrbitRow {
  id: string;
  quantity: string;
  exact: string;
  firstOrder: string;
}

function orbitRows(orbit: RelativisticOrbit): OrbitRow[] {
  const { redshift } = orbit;
  const relativeDifference = (orbit.precessionExactRad - orbit.precessionFirstOrderRad) / orbit.precessionExactRad;
  return [
    {
      id: "mass",
      quantity: "Compact mass",
      exact: `${numberWords(orbit.massSolar)} M☉ (${orbit.massFrom === "lens mass" ? "the lens mass" : "from the period by Kepler's third law"})`,
      firstOrder: "—",
    },
    { id: "orbit", quantity: "Semi-major axis, eccentricity, period", exact: `${numberWords(orbit.semiMajorAxisAu)} au, e = ${numberWords(orbit.eccentricity)}, ${daysWords(orbit.periodDays)}`, firstOrder: "—" },
    {
      id: "periapsis",
      quantity: "Periapsis distance a (1 − e)",
      exact: `${numberWords(orbit.periapsisAu)} au = ${numberWords(orbit.periapsisM)} M (M = GM/c²)`,
      firstOrder: `apoapsis a (1 + e) = ${numberWords(orbit.apoapsisAu)} au`,
    },
    {
      id: "precession",
      quantity: "Periapsis advance per orbit",
      exact: `${precessionWords(orbit.precessionExactRad)}: exact Schwarzschild orbit (the physics core's elliptic integral)`,
      firstOrder: `${precessionWords(orbit.precessionFirstOrderRad)}: 6πGM/(c² a (1 − e²)), first order in GM/(c² a); exact − first order = ${numberWords(100 * relativeDifference)} %`,
    },
    {
      id: "periapsis-speed",
      quantity: "Speed at periapsis",
      exact: `${speedWords(orbit.periapsisSpeedExactKmPerS)}: measured by a static observer there, exact Schwarzschild orbit (its energy and angular momentum)`,
      firstOrder: `${speedWords(orbit.periapsisSpeedKmPerS)} (v/c = ${numberWords(orbit.periapsisSpeedKmPerS / SPEED_OF_LIGHT_KM_PER_S)}): vis-viva √(GM (1 + e)/(a (1 − e))), Newtonian`,
    },
    { id: "redshift-gravitational", quantity: "Gravitational redshift at periapsis, c·z", exact: "—", firstOrder: `${speedWords(redshift.gravitationalKmPerS)}: GM/(c r_p), first order in GM/(c² r)` },
    { id: "redshift-transverse", quantity: "Transverse Doppler shift at periapsis, c·z", exact: "—", firstOrder: `${speedWords(redshift.transverseDopplerKmPerS)}: v_p²/(2c), second order in v/c` },
    {
      id: "redshift-combined",
      quantity: "Relativistic redshift at periapsis, c·z",
      exact: `${speedWords(redshift.exactKmPerS)}: c (u^t − 1), exact Schwarzschild, for light leaving across the star's motion`,
      firstOrder: `${speedWords(redshift.combinedKmPerS)}: the sum, first post-Newtonian order (the line-of-sight Doppler shift of the Newtonian orbit is apart)`,
    },
    {
      id: "roemer",
      quantity: "Rømer delay across the orbit",
      exact: `${delayWords(orbit.roemerDelayS)}${orbit.orientationGiven ? ": the range of the light-travel time, 2a sin i √(1 − e² cos² ω)/c" : ": upper bound 2a/c (set the inclination and argument of periapsis to project it)"}`,
      firstOrder: "—",
    },
    {
      id: "apoapsis-shift",
      quantity: "Apoapsis shift per orbit on the sky",
      exact:
        orbit.apoapsisShiftMicroarcsec === null
          ? "— (set the lens distance)"
          : `${numberWords(orbit.apoapsisShiftMicroarcsec)} µas${orbit.orientationGiven ? ", projected" : ", face-on (an upper bound: set the inclination and argument of periapsis)"}: from the exact advance`,
      firstOrder: "—",
    },
  ];
}

interface RelativisticOrbitSectionProps {
  targetName: string;
  outcome: RelativisticOrbitOutcome;
  /** The target's time of a periapsis passage (JD UTC), or null. */
  periapsisJdUtc: number | null;
  /** The date the next periapsis is counted from (JD UTC): now. */
  fromJdUtc: number;
}

/**
 * The relativistic-orbit case's numbers on the target page: the exact and first-order values side by
 * side, each named with its formula and order; the orbit on the sky over one period (Newtonian,
 * precessing, and the precession magnified); and the 3D view of the orbit from the physics core's
 * tracer with its periapses.
 */
export function RelativisticOrbitSection({ targetName, outcome, periapsisJdUtc, fromJdUtc }: RelativisticOrbitSectionProps) {
  const heading = (
    <h2 id="orbit-heading" className="text-xl font-semibold">
      The orbiting star
    </h2>
  );
  if ("missing" in outcome) {
    return (
      <section aria-labelledby="orbit-heading" className="space-y-2" data-testid="relativistic-orbit">
        {heading}
        <p className="text-sm" data-testid="orbit-missing">
          {outcome.missing}
        </p>
      </section>
    );
  }
  const { orbit } = outcome;
  const view = orbitSkyView(orbit);
  const next = periapsisJdUtc === null ? null : nextPeriapsisJdUtc(orbit, periapsisJdUtc, fromJdUtc);
  return (
    <section aria-labelledby="orbit-heading" className="space-y-4" data-testid="relativistic-orbit">
      {heading}
      <p className="text-sm" data-testid="orbit-next-periapsis">
        {next === null ? "Set a time of periapsis to date the next passage." : `Next periapsis: ${dateWords(next)}.`}
      </p>
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm" aria-label="Relativistic orbit: exact and first-order values">
          <thead className="text-dusk-dim">
            <tr>
              <th scope="col" className="py-1 pr-4 font-normal">
                Quantity
              </th>
              <th scope="col" className="py-1 pr-4 font-normal">
                Exact (or the only value)
              </th>
              <th scope="col" className="py-1 font-normal">
                First order, with its formula
              </th>
            </tr>
          </thead>
          <tbody>
            {orbitRows(orbit).map((row) => (
              <tr key={row.id} data-testid={`orbit-${row.id}`} className="border-t border-void-edge align-top">
                <th scope="row" className="py-1 pr-4 font-normal text-dusk-dim">
                  {row.quantity}
                </th>
                <td className="py-1 pr-4 tabular-nums text-glint">{row.exact}</td>
                <td className="py-1 tabular-nums">{row.firstOrder}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="grid gap-6 lg:grid-cols-2">
        {view === null ? (
          <p className="text-sm text-dusk-dim" data-testid="orbit-sky-missing">
            The orbit on the sky needs the lens distance, the inclination, the ascending node and the argument of periapsis.
          </p>
        ) : (
          <figure className="space-y-2" data-testid="orbit-sky" data-magnification={view.magnification}>
            <FigureSvg tree={orbitSkyPlot({ view, title: orbitSkyTitle(targetName), size: ORBIT_SKY_SIZE_PX })} />
            <figcaption className="text-xs text-dusk-dim">
              Offsets from the compact mass in mas at the lens distance, north up, east left.{" "}
              {view.magnification > 1
                ? `The exact precessing orbit departs from the Newtonian ellipse by too little to see at this scale; its departure is drawn again magnified × ${view.magnification.toLocaleString("en-GB")}.`
                : "The exact precessing orbit departs visibly from the Newtonian ellipse; no magnification is needed."}
            </figcaption>
          </figure>
        )}
        <OrbitScenePanel semiLatusRectumM={orbit.periapsisM * (1 + orbit.eccentricity)} eccentricity={orbit.eccentricity} />
      </div>
    </section>
  );
}
