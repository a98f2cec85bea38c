import { sql } from "drizzle-orm";
import {
  bigserial,
  check,
  date,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { lensModelIds } from "../lib/lensing/registry";
import { scienceCaseIds } from "../lib/lensing/science-case-inputs";

/** Which seed sets have been applied to this database, so seeding runs once and never duplicates. */
export const seedRuns = pgTable("seed_runs", {
  name: text("name").primaryKey(),
  appliedAt: timestamp("applied_at", { withTimezone: true }).notNull().defaultNow(),
});

export type SeedRun = typeof seedRuns.$inferSelect;

const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();
const updatedAt = () => timestamp("updated_at", { withTimezone: true }).notNull().defaultNow();

export const siteRole = pgEnum("site_role", ["admin", "member"]);
export const proposalRole = pgEnum("proposal_role", ["pi", "coi", "viewer"]);
export const authTokenPurpose = pgEnum("auth_token_purpose", ["password_reset", "sign_in_link", "account_confirmation"]);
/** The lens models of the registry (`lib/lensing/registry.ts`); a new model's id needs a migration. */
export const lensModel = pgEnum("lens_model", lensModelIds);
export const targetStatus = pgEnum("target_status", ["candidate", "accepted", "scheduled", "observed", "dropped"]);
export const verdict = pgEnum("feasibility_verdict", ["feasible", "marginal", "infeasible", "unknown"]);
/** The science cases of `lib/lensing/science-cases.ts`; a new case's id needs a migration. */
export const scienceCase = pgEnum("science_case", scienceCaseIds);

/** People who can sign in. E-mail is stored lower-cased so uniqueness ignores case. */
export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    /** bcrypt hash; null for an account that has only ever signed in by e-mailed link. */
    passwordHash: text("password_hash"),
    siteRole: siteRole("site_role").notNull().default("member"),
    /**
     * When the owner of the address proved they read its mail (followed a link sent there). Null for a
     * sign-up that was not confirmed yet, which cannot sign in with its password. Accounts made any
     * other way (invitation links, the seed, an admin) count as confirmed when created.
     */
    emailConfirmedAt: timestamp("email_confirmed_at", { withTimezone: true }).defaultNow(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("users_email_key").on(t.email), check("users_email_lower", sql`${t.email} = lower(${t.email})`)],
);

export type User = typeof users.$inferSelect;

/**
 * Single-use secrets sent by e-mail (password reset, sign-in link, confirmation of a new account).
 * Only the SHA-256 of the token is kept, so a leaked database cannot be replayed as links.
 */
export const authTokens = pgTable(
  "auth_tokens",
  {
    tokenHash: text("token_hash").primaryKey(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    purpose: authTokenPurpose("purpose").notNull(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    /**
     * A sign-up's password (bcrypt) and name, carried by the confirmation link issued with them: the
     * account takes them only when that very link is followed, so nobody else's sign-up for the same
     * address, and no other link, can set the password of an account that is not confirmed yet.
     */
    pendingPasswordHash: text("pending_password_hash"),
    pendingName: text("pending_name"),
    createdAt: createdAt(),
  },
  (t) => [index("auth_tokens_user_idx").on(t.userId)],
);

export type AuthToken = typeof authTokens.$inferSelect;

/**
 * Signed-in sessions. The session cookie (a signed next-auth JWT) names one row, and a request counts
 * as signed in only while that row exists: deleting it ends the session for every copy of the cookie
 * (sign-out, "sign out everywhere", a password reset; removing the account removes its rows).
 */
export const userSessions = pgTable(
  "user_sessions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("user_sessions_user_idx").on(t.userId)],
);

export type UserSession = typeof userSessions.$inferSelect;

/**
 * Fixed-window attempt counters (sign-in per account and per address). Kept in PostgreSQL so every
 * app instance counts against the same limit.
 */
export const rateLimitCounters = pgTable(
  "rate_limit_counters",
  {
    bucket: text("bucket").notNull(),
    windowStart: timestamp("window_start", { withTimezone: true }).notNull(),
    hits: integer("hits").notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.bucket, t.windowStart] })],
);

export type RateLimitCounter = typeof rateLimitCounters.$inferSelect;

/** A proposal, with the observing site and the instrument defaults its feasibility verdicts use. */
export const proposals = pgTable("proposals", {
  id: uuid("id").primaryKey().defaultRandom(),
  title: text("title").notNull(),
  cycle: text("cycle").notNull(),
  abstract: text("abstract").notNull().default(""),
  siteName: text("site_name").notNull(),
  siteLatitudeDeg: doublePrecision("site_latitude_deg").notNull(),
  siteLongitudeDeg: doublePrecision("site_longitude_deg").notNull(),
  siteElevationM: doublePrecision("site_elevation_m").notNull(),
  siteHorizonLimitDeg: doublePrecision("site_horizon_limit_deg").notNull(),
  resolutionMas: doublePrecision("resolution_mas").notNull(),
  cadenceHours: doublePrecision("cadence_hours").notNull(),
  campaignLengthDays: doublePrecision("campaign_length_days").notNull(),
  /** The observing cycle's first and last nights (local evening dates); the season view spans them. */
  cycleStartDate: date("cycle_start_date", { mode: "string" }),
  cycleEndDate: date("cycle_end_date", { mode: "string" }),
  /** Largest airmass the team will observe at (sky windows count dark hours below it). */
  airmassLimit: doublePrecision("airmass_limit").notNull().default(2),
  /** An interferometer's observing wavelength and longest baseline, for the shadow against λ/B. */
  interferometerWavelengthMm: doublePrecision("interferometer_wavelength_mm"),
  interferometerBaselineKm: doublePrecision("interferometer_baseline_km"),
  /** The simulated schedule's constraints: Moon (null: none), time per visit, share of clear nights. */
  moonMinSeparationDeg: doublePrecision("moon_min_separation_deg").default(30),
  moonMaxIllumination: doublePrecision("moon_max_illumination"),
  visitMinutes: doublePrecision("visit_minutes").notNull().default(20),
  clearNightFraction: doublePrecision("clear_night_fraction").notNull().default(1),
  /** Astrometric precision of one epoch, and the largest flux ratio of two images the instrument separates. */
  astrometricPrecisionMas: doublePrecision("astrometric_precision_mas"),
  reachableContrast: doublePrecision("reachable_contrast"),
  /** Radial-velocity precision of one spectroscopic epoch, km/s (the relativistic-orbit case's redshift signal). */
  spectroscopicPrecisionKmPerS: doublePrecision("spectroscopic_precision_km_per_s"),
  /** The photon budget's telescope, detector, band and site sky (`lib/workspace/photometry-schema.ts`; read through its schema). */
  photometry: jsonb("photometry").notNull().default(sql`'{}'::jsonb`),
  createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export type Proposal = typeof proposals.$inferSelect;

export const proposalMembers = pgTable(
  "proposal_members",
  {
    proposalId: uuid("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: proposalRole("role").notNull(),
    joinedAt: timestamp("joined_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.proposalId, t.userId] }), index("proposal_members_user_idx").on(t.userId)],
);

export type ProposalMember = typeof proposalMembers.$inferSelect;

/** An e-mailed offer to join a proposal with a role; the token is stored hashed, like auth tokens. */
export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    proposalId: uuid("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: proposalRole("role").notNull(),
    tokenHash: text("token_hash").notNull(),
    invitedBy: uuid("invited_by").references(() => users.id, { onDelete: "set null" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    acceptedBy: uuid("accepted_by").references(() => users.id, { onDelete: "set null" }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("invitations_token_key").on(t.tokenHash), index("invitations_proposal_idx").on(t.proposalId)],
);

export type Invitation = typeof invitations.$inferSelect;

/**
 * A target and its lens hypothesis. The derived columns (Einstein radius and the rest) are computed by
 * `lib/workspace/derived.ts` whenever the target or its proposal's instrument defaults change, and
 * stored so that the table can sort and filter on them in SQL at 10,000 rows.
 */
export const targets = pgTable(
  "targets",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    proposalId: uuid("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    raDeg: doublePrecision("ra_deg").notNull(),
    decDeg: doublePrecision("dec_deg").notNull(),
    lensModel: lensModel("lens_model").notNull(),
    lensMassSolar: doublePrecision("lens_mass_solar"),
    velocityDispersionKmPerS: doublePrecision("velocity_dispersion_km_per_s"),
    lensDistancePc: doublePrecision("lens_distance_pc"),
    sourceDistancePc: doublePrecision("source_distance_pc"),
    lensRedshift: doublePrecision("lens_redshift"),
    sourceRedshift: doublePrecision("source_redshift"),
    sourceOffsetThetaE: doublePrecision("source_offset_theta_e").notNull(),
    properMotionMasPerYr: doublePrecision("proper_motion_mas_per_yr"),
    /** The team's science case; null while the case inferred from the model and numbers applies. */
    scienceCase: scienceCase("science_case"),
    /** The event's peak time t0 (Julian date, UTC), the source's radius (R☉) or ρ (its angular radius in θ_E) typed directly, and its linear limb darkening. */
    eventPeakJdUtc: doublePrecision("event_peak_jd_utc"),
    sourceRadiusSolar: doublePrecision("source_radius_solar"),
    sourceRadiusThetaE: doublePrecision("source_radius_theta_e"),
    limbDarkeningU: doublePrecision("limb_darkening_u"),
    /** The lensed source's own magnitude (unmagnified, without blended light) in a band's own system; the band (null: the proposal's); its share f_s of the baseline flux (null: 1, no blend). */
    sourceMagnitude: doublePrecision("source_magnitude"),
    sourceBand: text("source_band"),
    blendFraction: doublePrecision("blend_fraction"),
    /**
     * The event's Einstein time t_E (days) as measured by a light-curve fit; null while it is derived
     * from θ_E and the relative proper motion. The microlens parallax (π_E,N, π_E,E; dimensionless,
     * Gould 2004's geocentric frame) from the same fit, when it was fitted.
     */
    einsteinTimeDays: doublePrecision("einstein_time_days"),
    parallaxNorth: doublePrecision("parallax_north"),
    parallaxEast: doublePrecision("parallax_east"),
    /**
     * A star (or pulsar) orbiting the compact lens, for the relativistic-orbit case: the semi-major axis
     * in au or as an angle (mas) at the lens distance (one of the two), eccentricity, period (days; the
     * lens mass, when set, takes precedence), time of periapsis (Julian date, UTC), and the inclination,
     * longitude of the ascending node and argument of periapsis (degrees).
     */
    orbitSemiMajorAxisAu: doublePrecision("orbit_semi_major_axis_au"),
    orbitSemiMajorAxisMas: doublePrecision("orbit_semi_major_axis_mas"),
    orbitEccentricity: doublePrecision("orbit_eccentricity"),
    orbitPeriodDays: doublePrecision("orbit_period_days"),
    orbitPeriapsisJdUtc: doublePrecision("orbit_periapsis_jd_utc"),
    orbitInclinationDeg: doublePrecision("orbit_inclination_deg"),
    orbitNodeDeg: doublePrecision("orbit_node_deg"),
    orbitPeriapsisArgumentDeg: doublePrecision("orbit_periapsis_argument_deg"),
    priority: integer("priority").notNull(),
    status: targetStatus("status").notNull().default("candidate"),
    tags: text("tags").array().notNull().default(sql`'{}'::text[]`),
    einsteinRadiusMas: doublePrecision("einstein_radius_mas"),
    imageSeparationMas: doublePrecision("image_separation_mas"),
    magnificationTotal: doublePrecision("magnification_total"),
    timeDelayDays: doublePrecision("time_delay_days"),
    crossingTimeDays: doublePrecision("crossing_time_days"),
    shadowDiameterMicroarcsec: doublePrecision("shadow_diameter_microarcsec"),
    /** The photon budget: hours requested over the visits the case needs (exposures and overheads), and the S/N at the brightest of them. */
    timeRequestHours: doublePrecision("time_request_hours"),
    peakSignalToNoise: doublePrecision("peak_signal_to_noise"),
    /** The science case the answers below were given for (the chosen one, or the inferred one). */
    answeredCase: scienceCase("answered_case"),
    /** The worst verdict among the case's answers, and the answers themselves (`CaseAnswer[]`). */
    caseVerdict: verdict("case_verdict").notNull().default("unknown"),
    caseAnswers: jsonb("case_answers").notNull().default(sql`'[]'::jsonb`),
    /** The rules' version the derived columns were computed with; startup re-derives older rows. */
    derivationVersion: integer("derivation_version").notNull().default(0),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("targets_proposal_name_idx").on(t.proposalId, t.name),
    index("targets_proposal_einstein_idx").on(t.proposalId, t.einsteinRadiusMas),
    index("targets_proposal_priority_idx").on(t.proposalId, t.priority),
  ],
);

export type Target = typeof targets.$inferSelect;
export type NewTarget = typeof targets.$inferInsert;

/** One Markdown observation note per row; `version` rises by one on every save (optimistic locking). */
export const notes = pgTable(
  "notes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    targetId: uuid("target_id")
      .notNull()
      .references(() => targets.id, { onDelete: "cascade" }),
    authorId: uuid("author_id").references(() => users.id, { onDelete: "set null" }),
    body: text("body").notNull(),
    version: integer("version").notNull().default(1),
    updatedBy: uuid("updated_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("notes_target_idx").on(t.targetId)],
);

export type Note = typeof notes.$inferSelect;

/** Every saved text of a note, the first one included. */
export const noteRevisions = pgTable(
  "note_revisions",
  {
    noteId: uuid("note_id")
      .notNull()
      .references(() => notes.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    body: text("body").notNull(),
    editedBy: uuid("edited_by").references(() => users.id, { onDelete: "set null" }),
    editedAt: timestamp("edited_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.noteId, t.version] })],
);

export type NoteRevision = typeof noteRevisions.$inferSelect;

/** Who added, changed or removed what in a proposal, and when. */
export const activity = pgTable(
  "activity",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    proposalId: uuid("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    subject: text("subject").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("activity_proposal_idx").on(t.proposalId, t.id)],
);

export type Activity = typeof activity.$inferSelect;

export const uploadPurpose = pgEnum("upload_purpose", ["target_list", "note_attachment", "event_photometry"]);
export const importFormat = pgEnum("import_format", ["csv", "votable"]);
export const attachmentKind = pgEnum("attachment_kind", ["png", "jpeg", "pdf", "fits"]);

/**
 * A file held by the upload service, recorded when its upload completed and its content was checked.
 * Only the service's key is stored, never a URL: the service's host can change, the key does not.
 */
export const uploadedFiles = pgTable(
  "uploaded_files",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    key: text("key").notNull(),
    name: text("name").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    /** The media type found from the content (magic bytes), not the one the browser declared. */
    contentType: text("content_type").notNull(),
    proposalId: uuid("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    uploadedBy: uuid("uploaded_by").references(() => users.id, { onDelete: "set null" }),
    purpose: uploadPurpose("purpose").notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("uploaded_files_key_key").on(t.key), index("uploaded_files_proposal_idx").on(t.proposalId)],
);

export type UploadedFile = typeof uploadedFiles.$inferSelect;

/** One committed target-list import: the file it came from (kept), how it was read, what it changed. */
export const imports = pgTable(
  "imports",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    proposalId: uuid("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    fileId: uuid("file_id")
      .notNull()
      .references(() => uploadedFiles.id),
    format: importFormat("format").notNull(),
    /** The column mapping and fill values used (lib/imports/columns ColumnMapping, rows ImportFill). */
    mapping: jsonb("mapping").notNull(),
    fill: jsonb("fill").notNull(),
    toleranceArcsec: doublePrecision("tolerance_arcsec").notNull(),
    addedCount: integer("added_count").notNull(),
    updatedCount: integer("updated_count").notNull(),
    skippedCount: integer("skipped_count").notNull(),
    importedBy: uuid("imported_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("imports_proposal_idx").on(t.proposalId, t.createdAt)],
);

export type ImportRecord = typeof imports.$inferSelect;

/** A file attached to an observation note; FITS files keep their primary header's keywords. */
export const noteAttachments = pgTable(
  "note_attachments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    noteId: uuid("note_id")
      .notNull()
      .references(() => notes.id, { onDelete: "cascade" }),
    fileId: uuid("file_id")
      .notNull()
      .references(() => uploadedFiles.id, { onDelete: "cascade" }),
    kind: attachmentKind("kind").notNull(),
    /** lib/imports/fits-header FitsHeader (each HDU: type, keywords, BITPIX, axes, sizes) for FITS; null otherwise. */
    fitsHeader: jsonb("fits_header"),
    sizeBytes: integer("size_bytes").notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("note_attachments_file_key").on(t.fileId), index("note_attachments_note_idx").on(t.noteId)],
);

export type NoteAttachment = typeof noteAttachments.$inferSelect;

/**
 * One photometry file of an ongoing event, as read with its confirmed mapping: the points of every
 * dataset it holds (times as geocentric JD in UTC, fluxes on REFERENCE_MAGNITUDE's scale of
 * lib/event-photometry/read-event-photometry.ts), kept with the file they came from. Deleting the row
 * deletes the file (the data-access layer also removes it from the upload service).
 */
export const eventPhotometry = pgTable(
  "event_photometry",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    targetId: uuid("target_id")
      .notNull()
      .references(() => targets.id, { onDelete: "cascade" }),
    fileId: uuid("file_id")
      .notNull()
      .references(() => uploadedFiles.id, { onDelete: "cascade" }),
    /** lib/event-photometry/mapping PhotometryMapping, as confirmed. */
    mapping: jsonb("mapping").notNull(),
    /** lib/event-photometry/read-event-photometry PhotometryDataset[] of the file, in order. */
    datasets: jsonb("datasets").notNull(),
    /** The points, one array element each: time (geocentric JD, UTC), flux and its 1σ error, index into `datasets`. */
    timesJdUtc: doublePrecision("times_jd_utc").array().notNull(),
    fluxes: doublePrecision("fluxes").array().notNull(),
    fluxErrors: doublePrecision("flux_errors").array().notNull(),
    datasetIndices: integer("dataset_indices").array().notNull(),
    /** Rows of the file refused on reading (1-based row numbers), kept to show with the file. */
    refusedRows: integer("refused_rows").array().notNull().default(sql`'{}'::integer[]`),
    addedBy: uuid("added_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("event_photometry_file_key").on(t.fileId), index("event_photometry_target_idx").on(t.targetId, t.createdAt)],
);

export type EventPhotometryRecord = typeof eventPhotometry.$inferSelect;

export const targetRevisionKind = pgEnum("target_revision_kind", ["light_curve_fit", "undo"]);

/**
 * A change of a target's event parameters made in one step (a light-curve fit applied, or its undo):
 * the values before and after (lib/workspace target fields by name), and for a fit its summary
 * (χ²/dof, points, datasets, the parameters' 1σ errors). Undo restores `before` while the target still
 * holds `after`.
 */
export const targetRevisions = pgTable(
  "target_revisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    targetId: uuid("target_id")
      .notNull()
      .references(() => targets.id, { onDelete: "cascade" }),
    kind: targetRevisionKind("kind").notNull(),
    before: jsonb("before").notNull(),
    after: jsonb("after").notNull(),
    summary: jsonb("summary"),
    /** The revision this one undid (for an undo). */
    undoes: uuid("undoes"),
    /** When it was undone (for an applied fit). */
    undoneAt: timestamp("undone_at", { withTimezone: true }),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("target_revisions_target_idx").on(t.targetId, t.createdAt)],
);

export type TargetRevision = typeof targetRevisions.$inferSelect;
