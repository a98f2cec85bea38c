import type { InstrumentDefaults } from "@/lib/workspace/proposal-schema";
import type { LensHypothesis } from "@/lib/workspace/target-schema";

/**
 * The lens bench URL that opens a target's hypothesis with its proposal's instrument: the bench keeps
 * its inputs as typed text with units, so each value is written with its unit.
 */
export function benchLink(h: LensHypothesis, instrument: InstrumentDefaults): string {
  const query = new URLSearchParams({ lens: h.lensModel, beta: String(h.sourceOffsetThetaE), betaUnit: "thetaE" });
  if (h.lensMassSolar != null) query.set("mass", `${h.lensMassSolar} Msun`);
  if (h.velocityDispersionKmPerS != null) query.set("sigma", `${h.velocityDispersionKmPerS} km/s`);
  if (h.lensRedshift != null && h.sourceRedshift != null) {
    query.set("geometry", "redshift");
    query.set("zl", String(h.lensRedshift));
    query.set("zs", String(h.sourceRedshift));
  } else if (h.lensDistancePc != null && h.sourceDistancePc != null) {
    query.set("geometry", "distance");
    query.set("dl", `${h.lensDistancePc} pc`);
    query.set("ds", `${h.sourceDistancePc} pc`);
  }
  if (h.properMotionMasPerYr != null) query.set("mu", `${h.properMotionMasPerYr} mas/yr`);
  query.set("resolution", "fwhm");
  query.set("fwhm", `${instrument.resolutionMas} mas`);
  query.set("cadence", `${instrument.cadenceHours} h`);
  query.set("campaign", `${instrument.campaignLengthDays} d`);
  return `/bench?${query}`;
}
