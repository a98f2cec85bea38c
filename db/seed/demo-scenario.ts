/**
 * The invented demo scenario: an invented collaboration, site, proposals and targets. Nothing here
 * names a real team, observatory, survey or object; the numbers are plausible, not measured.
 */
import type { ProposalRole, SiteRole } from "@/lib/workspace/roles";
import type { TargetStatus } from "@/lib/workspace/status";
import type { LensModel } from "@/lib/workspace/target-schema";

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
  instrument: { resolutionMas: 50, cadenceHours: 4, campaignLengthDays: 90 },
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
  tags: ["compact", "shadow"],
  notes: [
    "Predicted **shadow diameter** is about 42 µas: close to the ~25 µas resolution of the long-baseline array, so a detection hinges on the longest baselines.",
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
  bulge({ name: "CBW-24-0117", ra: "17 52 31.8", dec: "-29 41 07", lensMassSolar: 0.32, lensDistancePc: 5200, sourceDistancePc: 8100, sourceOffsetThetaE: 0.12, properMotionMasPerYr: 6.1, priority: 1, status: "accepted", tags: ["high-mag"], notes: ["Rising since night 3; peak expected in about 9 days.\n\n- seeing 0.8″\n- baseline flat over 40 nights"] }),
  bulge({ name: "CBW-24-0203", ra: "17 55 02.3", dec: "-30 02 44", lensMassSolar: 0.65, lensDistancePc: 3900, sourceDistancePc: 8300, sourceOffsetThetaE: 0.45, properMotionMasPerYr: 4.2, priority: 2, status: "candidate", notes: [] }),
  bulge({ name: "CBW-24-0311", ra: "17 58 44.0", dec: "-28 47 19", lensMassSolar: 0.08, lensDistancePc: 6400, sourceDistancePc: 8000, sourceOffsetThetaE: 0.05, properMotionMasPerYr: 7.5, priority: 1, status: "scheduled", tags: ["brown-dwarf"], notes: ["Short event: a low-mass lens. Ask for the 2-hour cadence slot if it opens."] }),
  bulge({ name: "CBW-24-0422", ra: "18 01 15.6", dec: "-27 55 03", lensMassSolar: 7.4, lensDistancePc: 2100, sourceDistancePc: 8200, sourceOffsetThetaE: 0.8, properMotionMasPerYr: 3.0, priority: 1, status: "candidate", tags: ["remnant"], notes: ["Long timescale and no light from the lens: a dark remnant? Astrometric shift should be measurable."] }),
  bulge({ name: "CBW-24-0518", ra: "17 49 58.1", dec: "-30 33 12", lensMassSolar: 0.45, lensDistancePc: 6900, sourceDistancePc: 8800, sourceOffsetThetaE: 1.6, properMotionMasPerYr: 5.5, priority: 4, status: "dropped", notes: ["Dropped: blended with a bright neighbour."] }),
  bulge({ name: "CBW-24-0604", ra: "17 53 40.9", dec: "-29 10 26", lensMassSolar: 1.1, lensDistancePc: 4500, sourceDistancePc: 7900, sourceOffsetThetaE: 0.25, properMotionMasPerYr: 2.2, priority: 2, status: "observed", notes: [] }),
  bulge({ name: "CBW-24-0733", ra: "18 03 27.2", dec: "-28 20 51", lensMassSolar: 0.21, lensDistancePc: 7100, sourceDistancePc: 8400, sourceOffsetThetaE: 0.6, properMotionMasPerYr: 4.8, priority: 3, status: "candidate", notes: [] }),
  galaxy({ name: "Lantern Arc", ra: "04 12 09.5", dec: "-15 33 40", velocityDispersionKmPerS: 245, lensRedshift: 0.42, sourceRedshift: 1.85, sourceOffsetThetaE: 0.35, priority: 1, status: "accepted", tags: ["double"], notes: ["Two images resolved in archival imaging; the delay sets the monitoring length."] }),
  galaxy({ name: "Quillfeather Lens", ra: "10 49 33.1", dec: "+22 17 05", velocityDispersionKmPerS: 290, lensRedshift: 0.61, sourceRedshift: 2.4, sourceOffsetThetaE: 0.6, priority: 2, status: "candidate", notes: [] }),
  galaxy({ name: "Hollowmere Pair", ra: "22 31 54.8", dec: "-04 02 18", velocityDispersionKmPerS: 190, lensRedshift: 0.29, sourceRedshift: 1.12, sourceOffsetThetaE: 0.2, priority: 2, status: "scheduled", notes: [] }),
  galaxy({ name: "Saltmarsh Arc", ra: "08 55 12.0", dec: "+01 30 47", velocityDispersionKmPerS: 320, lensRedshift: 0.78, sourceRedshift: 3.05, sourceOffsetThetaE: 1.3, priority: 3, status: "candidate", tags: ["single"], notes: ["Source outside the Einstein radius for this model: one image only, no delay."] }),
  galaxy({ name: "Vesper Ring", ra: "13 18 26.4", dec: "-28 45 09", velocityDispersionKmPerS: 210, lensRedshift: 0.35, sourceRedshift: 0.98, sourceOffsetThetaE: 0.05, priority: 1, status: "accepted", tags: ["ring"], notes: [] }),
  compactObject,
];
