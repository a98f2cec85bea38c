/**
 * What a lens model derives from one hypothesis: every lensing quantity the product shows, in the
 * units the names say, or null where the model (or the hypothesis) gives no such quantity. Each
 * model's `solve` returns one; the bench, the stored target columns, the exports, the summary and the
 * science cases read it and compute no lensing number of their own.
 */

/** One image of the source: position along the lens–source axis and signed magnification. */
export interface LensImage {
  /** Angular position from the lens, units of θ_E, signed (negative: on the far side from the source). */
  positionThetaE: number;
  /** Signed magnification (negative: a parity-flipped image). */
  magnification: number;
}

export interface LensSolution {
  /** Id of the lens model that solved the hypothesis (a key of the model registry). */
  modelId: string;
  einsteinRadiusRad: number;
  /** The source's angular offset from the lens, u = β / θ_E. */
  sourceOffsetThetaE: number;
  /** Images of the thin-lens equation, brightest first. */
  images: LensImage[];
  /** Separation of the two primary images; null when the model forms one image. */
  imageSeparationRad: number | null;
  /** Sum of |μ| over the images (point source). */
  magnificationTotal: number;
  /** Brighter over fainter primary image, |μ₁/μ₂| ≥ 1; null with one image. */
  fluxRatio: number | null;
  /** Arrival-time difference of the two primary images (observer's clock); null with one image. */
  timeDelayS: number | null;
  /** Einstein crossing time t_E = θ_E / μ_rel; null without a relative proper motion. */
  einsteinTimeS: number | null;
  /** Offset of the unresolved images' light centroid from the source at this offset (u/(u² + 2) θ_E for a point lens); null for models without one. */
  centroidShiftRad: number | null;
  /** Largest centroid shift of the unresolved images over an event, θ_E/√8 at u = √2; null for models without one. */
  maxAstrometricShiftRad: number | null;
  /** Angular diameter of the black-hole shadow (critical impact parameter 3√3 M); null for extended lenses. */
  shadowDiameterRad: number | null;
  /** Angular diameter of the first relativistic (n = 1) Einstein ring from the exact deflection; null for extended lenses. */
  photonRingDiameterRad: number | null;
  /** Microlens parallax π_E = π_rel / θ_E; null without Galactic distances. */
  microlensParallax: number | null;
}
