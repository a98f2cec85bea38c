import type { ExistingTarget } from "@/lib/imports/plan";

/** A point lens's columns and one row of them, the start of the event lists these tests import. */
export const LENS = "name,ra,dec,mass [Msun],D_L [pc],D_S [pc]";
export const LENS_CELLS = "OB-1,268.1,-29.7,0.3,4000,8000";

/** The proposal's target that row matches (by name): the lens alone, every event and source input empty. */
export const existingPointTarget: ExistingTarget = {
  id: "t1",
  name: "OB-1",
  raDeg: 268.1,
  decDeg: -29.7,
  lensModel: "point",
  lensMassSolar: 0.3,
  velocityDispersionKmPerS: null,
  lensDistancePc: 4000,
  sourceDistancePc: 8000,
  lensRedshift: null,
  sourceRedshift: null,
  sourceOffsetThetaE: 0.2,
  properMotionMasPerYr: null,
  scienceCase: null,
  eventPeakJdUtc: null,
  sourceRadiusSolar: null,
  sourceRadiusThetaE: null,
  limbDarkeningU: null,
  sourceMagnitude: null,
  sourceBand: null,
  blendFraction: null,
  priority: 2,
  tags: [],
};
