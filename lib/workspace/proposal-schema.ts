import { z } from "zod";

/** The observing site: where the telescope stands and how low it can point. */
export const siteSchema = z.object({
  name: z.string().trim().min(1, "Name the site.").max(120),
  latitudeDeg: z.number().min(-90, "Latitude is between -90 and 90 degrees.").max(90, "Latitude is between -90 and 90 degrees."),
  longitudeDeg: z.number().min(-180, "Longitude is between -180 and 180 degrees (east positive).").max(180, "Longitude is between -180 and 180 degrees (east positive)."),
  elevationM: z.number().min(-500, "Elevation is at least -500 m.").max(9000, "Elevation is at most 9000 m."),
  horizonLimitDeg: z.number().min(0, "The horizon limit is 0 to 60 degrees of altitude.").max(60, "The horizon limit is 0 to 60 degrees of altitude."),
});

/** The instrument defaults the feasibility verdicts compare each target with. */
export const instrumentSchema = z.object({
  resolutionMas: z.number().positive("Resolution must be a positive angle in milliarcseconds.").max(3.6e6),
  cadenceHours: z.number().positive("Cadence must be a positive number of hours.").max(24 * 365),
  campaignLengthDays: z.number().positive("Campaign length must be a positive number of days.").max(3653),
});

export const proposalSchema = z.object({
  title: z.string().trim().min(1, "Give the proposal a title.").max(200),
  cycle: z.string().trim().min(1, "Name the observing cycle (e.g. 2027B).").max(40),
  abstract: z.string().max(5000, "The abstract is at most 5000 characters.").default(""),
  site: siteSchema,
  instrument: instrumentSchema,
});

export type ProposalInput = z.infer<typeof proposalSchema>;
export type InstrumentDefaults = z.infer<typeof instrumentSchema>;

export const createProposalSchema = proposalSchema;
/** A PATCH replaces whole groups: `site` and `instrument` are sent complete or not at all. */
export const updateProposalSchema = proposalSchema.partial();
