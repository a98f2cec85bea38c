/**
 * The invented demo scenario: an invented collaboration, site, proposals and targets. Nothing here
 * names a real team, observatory, survey or object; the numbers are plausible, not measured.
 */
import type { ProposalRole, SiteRole } from "@/lib/workspace/roles";
import type { TargetStatus } from "@/lib/workspace/status";
import type { LensModel } from "@/lib/workspace/target-schema";
import type { ScienceCaseId } from "@/lib/lensing/science-case-inputs";
import { parseEventPeakJdUtc, parsePeriapsisJdUtc } from "@/lib/workspace/event-peak";

export interface DemoAccount {
  key: "pi" | "coi" | "viewer" | "admin";
  email: string;
  name: string;
  password: string;
  siteRole: SiteRole;
}

/** One account per role; the passwords are printed by the seed, they guard only local demo data. */
export const demoAccounts: DemoAccount[] = [
  { key: "pi", email: "ilse.varrow@tessellate.example", name: "Ilse Varrow", password: "varrow-demo-arcs", siteRole: "member" },
  { key: "coi", email: "tomas.brenneke@tessellate.example", name: "Tomas Brenneke", password: "brenneke-demo-arcs", siteRole: "member" },
  { key: "viewer", email: "priya.delacourt@tessellate.example", name: "Priya Delacourt", password: "delacourt-demo-arcs", siteRole: "member" },
  { key: "admin", email: "ody.halvorsen@tessellate.example", name: "Ody Halvorsen", password: "halvorsen-demo-arcs", siteRole: "admin" },
];

export const demoMembers: [DemoAccount["key"], ProposalRole][] = [
  ["pi", "pi"],
  ["coi", "coi"],
  ["viewer", "viewer"],
];

/** The invented site: a high desert plateau station. */
export const demoSite = { name: "Mesa Lucerna Station", latitudeDeg: -31.27, longitudeDeg: -68.93, elevationM: 2480, horizonLimitDeg: 20 };

export interface DemoTarget {
  name: string;
  ra: string;
  dec: string;
  lensModel: LensModel;
  lensMassSolar?: number;
  velocityDispersionKmPerS?: number;
  lensDistancePc?: number;
  sourceDistancePc?: number;
  lensRedshift?: number;
  sourceRedshift?: number;
  sourceOffsetThetaE: number;
  properMotionMasPerYr?: number;
  /** The team's science case; absent: the inferred one. */
  scienceCase?: ScienceCaseId;
  eventPeakJdUtc?: number;
  sourceRadiusSolar?: number;
  limbDarkeningU?: number;
  /** A star orbiting a compact lens (the relativistic-orbit case): a in au, e, P in days, T_p as JD UTC, i, Ω, ω in degrees. */
  orbitSemiMajorAxisAu?: number;
  orbitEccentricity?: number;
  orbitPeriapsisJdUtc?: number;
  orbitInclinationDeg?: number;
  orbitNodeDeg?: number;
  orbitPeriapsisArgumentDeg?: number;
  /** The source's own magnitude in the proposal's band and f_s (the photon budget), where the scenario gives them with the target. */
  sourceMagnitude?: number;
  blendFraction?: number;
  priority: number;
  status: TargetStatus;
  tags: string[];
  notes: string[];
}

export const demoProposal = {
  title: "Bending starlight in the Cinder bulge window",
  cycle: "2031A",
  abstract:
    "The Tessellate Lensing Collaboration follows stellar microlensing candidates toward the Cinder window of the bulge with adaptive-optics imaging, and re-observes five galaxy-scale lenses for image separations and time delays. One compact object is kept for a separate shadow-imaging request.",
  site: demoSite,
  // Adaptive-optics imaging: 50 mas FWHM, 0.1 mas astrometry per epoch on a bright source, 5 mag of
  // contrast at arcsecond separations (invented, plausible figures).
  // An integral-field spectrograph behind the same optics: 15 km/s radial velocities per epoch (invented).
  instrument: { resolutionMas: 50, cadenceHours: 4, campaignLengthDays: 90, astrometricPrecisionMas: 0.1, reachableContrast: 100, spectroscopicPrecisionKmPerS: 15 },
};

/** A second, small proposal: the compact object against an interferometer's resolution. */
export const demoShadowProposal = {
  title: "Shadow-scale imaging of the K-17 core",
  cycle: "2031A",
  abstract: "Can a millimetre interferometer resolve the shadow of the compact object K-17? Its predicted diameter is within a factor of two of the array's resolution.",
  site: demoSite,
  instrument: { resolutionMas: 0.025, cadenceHours: 24, campaignLengthDays: 10 },
};

export const compactObject: DemoTarget = {
  name: "K-17 core",
  ra: "17 46 02.7",
  dec: "-28 58 11",
  lensModel: "point",
  lensMassSolar: 3.1e6,
  lensDistancePc: 7600,
  sourceDistancePc: 8300,
  sourceOffsetThetaE: 2,
  priority: 1,
  status: "candidate",
  scienceCase: "horizon-scale",
  tags: ["compact", "shadow"],
  notes: [
    "Predicted **shadow diameter** is about 42 µas: close to the ~25 µas resolution of the long-baseline array, so a detection hinges on the longest baselines.",
  ],
};

/** A peak time typed as the team would, stored as a Julian date (UTC). */
const peak = (text: string) => parseEventPeakJdUtc(text);

/** A lighter nucleus kept in the shadow request as the counter-case: its shadow is below λ/B. */
export const faintCore: DemoTarget = {
  name: "Wick-4 core",
  ra: "17 47 19.3",
  dec: "-28 31 40",
  lensModel: "point",
  lensMassSolar: 8e5,
  lensDistancePc: 9000,
  sourceDistancePc: 9600,
  sourceOffsetThetaE: 2,
  scienceCase: "horizon-scale",
  priority: 3,
  status: "candidate",
  tags: ["compact", "shadow"],
  notes: ["A lighter, farther nucleus: its shadow (about 9 µas) is a third of the array's λ/B. Kept to show the panel why K-17 is the one to image."],
};

/**
 * An invented star on an eight-year orbit around an invented compact mass of 5.2 million M☉ in the
 * bulge (plausible, not measured): periapsis about 49 au, some 950 GM/c², passed in the demo cycle,
 * so the relativistic-orbit case has a passage to plan for. The period follows from the mass.
 */
export const orbitingStar: DemoTarget = {
  name: "Larkspur-3 b",
  ra: "17 45 51.2",
  dec: "-29 03 12",
  lensModel: "point",
  lensMassSolar: 5.2e6,
  lensDistancePc: 8300,
  sourceDistancePc: 9000,
  sourceOffsetThetaE: 2,
  scienceCase: "relativistic-orbit",
  orbitSemiMajorAxisAu: 700,
  orbitEccentricity: 0.93,
  orbitPeriapsisJdUtc: parsePeriapsisJdUtc("2031-05-20 12:00"),
  orbitInclinationDeg: 122,
  orbitNodeDeg: 61,
  orbitPeriapsisArgumentDeg: 248,
  // A bright giant in Ks, alone in the core's crowded field at 60 mas (invented).
  sourceMagnitude: 14.1,
  blendFraction: 1,
  priority: 1,
  status: "candidate",
  tags: ["compact", "orbit"],
  notes: [
    "Periapsis passage expected on 20 May 2031: the **redshift** peaks at a few hundred km/s within days of it, and the orbit's advance shifts the apoapsis by about a milliarcsecond per orbit.",
  ],
};

const bulge = (t: Omit<DemoTarget, "lensModel" | "tags"> & { tags?: string[] }): DemoTarget => ({
  lensModel: "point",
  ...t,
  tags: ["bulge", ...(t.tags ?? [])],
});
const galaxy = (t: Omit<DemoTarget, "lensModel" | "tags"> & { tags?: string[] }): DemoTarget => ({
  lensModel: "sis",
  ...t,
  tags: ["galaxy", ...(t.tags ?? [])],
});

export const demoTargets: DemoTarget[] = [
  bulge({ name: "Cinder Avocet", ra: "17 52 31.8", dec: "-29 41 07", lensMassSolar: 0.32, lensDistancePc: 5200, sourceDistancePc: 8100, sourceOffsetThetaE: 0.12, properMotionMasPerYr: 6.1, eventPeakJdUtc: peak("2031-06-11 04:00"), priority: 1, status: "accepted", tags: ["high-mag"], notes: ["Rising since night 3; peak expected in about 9 days.\n\n- seeing 0.8″\n- baseline flat over 40 nights"] }),
  bulge({ name: "Cinder Bunting", ra: "17 55 02.3", dec: "-30 02 44", lensMassSolar: 0.65, lensDistancePc: 3900, sourceDistancePc: 8300, sourceOffsetThetaE: 0.45, properMotionMasPerYr: 4.2, eventPeakJdUtc: peak("2031-05-02 06:00"), priority: 2, status: "candidate", notes: [] }),
  bulge({ name: "Cinder Curlew", ra: "17 58 44.0", dec: "-28 47 19", lensMassSolar: 0.08, lensDistancePc: 6400, sourceDistancePc: 8000, sourceOffsetThetaE: 0.05, properMotionMasPerYr: 7.5, eventPeakJdUtc: peak("2031-04-18 07:30"), sourceRadiusSolar: 1.4, limbDarkeningU: 0.6, priority: 1, status: "scheduled", tags: ["brown-dwarf"], notes: ["Short event: a low-mass lens. Ask for the 2-hour cadence slot if it opens."] }),
  bulge({ name: "Cinder Dunlin", ra: "18 01 15.6", dec: "-27 55 03", lensMassSolar: 7.4, lensDistancePc: 2100, sourceDistancePc: 8200, sourceOffsetThetaE: 0.8, properMotionMasPerYr: 3.0, eventPeakJdUtc: peak("2031-06-25"), scienceCase: "astrometric-microlensing", priority: 1, status: "candidate", tags: ["remnant"], notes: ["Long timescale and no light from the lens: a dark remnant? Astrometric shift should be measurable."] }),
  bulge({ name: "Cinder Egret", ra: "17 49 58.1", dec: "-30 33 12", lensMassSolar: 0.45, lensDistancePc: 6900, sourceDistancePc: 8800, sourceOffsetThetaE: 1.6, properMotionMasPerYr: 5.5, eventPeakJdUtc: peak("2031-03-20"), priority: 4, status: "dropped", notes: ["Dropped: blended with a bright neighbour."] }),
  bulge({ name: "Cinder Fieldfare", ra: "17 53 40.9", dec: "-29 10 26", lensMassSolar: 1.1, lensDistancePc: 4500, sourceDistancePc: 7900, sourceOffsetThetaE: 0.25, properMotionMasPerYr: 2.2, eventPeakJdUtc: peak("2031-07-14"), priority: 2, status: "observed", notes: [] }),
  bulge({ name: "Cinder Godwit", ra: "18 03 27.2", dec: "-28 20 51", lensMassSolar: 0.21, lensDistancePc: 7100, sourceDistancePc: 8400, sourceOffsetThetaE: 0.6, properMotionMasPerYr: 4.8, eventPeakJdUtc: peak("2031-02-05 08:00"), priority: 3, status: "candidate", notes: ["Peak predicted for 5 February, before the bulge clears the morning twilight here: only the falling wing can be caught."] }),
  galaxy({ name: "Lantern Arc", ra: "04 12 09.5", dec: "-15 33 40", velocityDispersionKmPerS: 245, lensRedshift: 0.42, sourceRedshift: 1.85, sourceOffsetThetaE: 0.35, scienceCase: "time-delay", priority: 1, status: "accepted", tags: ["double"], notes: ["Two images resolved in archival imaging; the delay sets the monitoring length."] }),
  galaxy({ name: "Quillfeather Lens", ra: "10 49 33.1", dec: "+22 17 05", velocityDispersionKmPerS: 290, lensRedshift: 0.61, sourceRedshift: 2.4, sourceOffsetThetaE: 0.6, scienceCase: "time-delay", priority: 2, status: "candidate", notes: ["A delay of about nine months: longer than the field's season here, so each season sees only one image's half of any variation."] }),
  galaxy({ name: "Hollowmere Pair", ra: "22 31 54.8", dec: "-04 02 18", velocityDispersionKmPerS: 190, lensRedshift: 0.29, sourceRedshift: 1.12, sourceOffsetThetaE: 0.2, scienceCase: "time-delay", priority: 2, status: "scheduled", notes: [] }),
  galaxy({ name: "Saltmarsh Arc", ra: "08 55 12.0", dec: "+01 30 47", velocityDispersionKmPerS: 320, lensRedshift: 0.78, sourceRedshift: 3.05, sourceOffsetThetaE: 1.3, priority: 3, status: "candidate", tags: ["single"], notes: ["Source outside the Einstein radius for this model: one image only, no delay."] }),
  galaxy({ name: "Vesper Ring", ra: "13 18 26.4", dec: "-28 45 09", velocityDispersionKmPerS: 210, lensRedshift: 0.35, sourceRedshift: 0.98, sourceOffsetThetaE: 0.05, priority: 1, status: "accepted", tags: ["ring"], notes: [] }),
  compactObject,
];
