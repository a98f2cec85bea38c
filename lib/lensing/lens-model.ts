/**
 * What a lens model declares to the rest of the product: its id (stored in the database), its label,
 * the parameter that sets its strength, the spellings an imported table may use for it, and one
 * `solve` that turns a hypothesis into every lensing quantity (`LensSolution`). The list of models is
 * in `registry.ts`; nothing outside a model's own file computes a lensing number for it.
 */

import type { AcceptedRange } from "@/lib/physics/accepted-ranges";
import type { QuantityKind } from "@/lib/physics/units";
import type { LensSolution } from "./solution";

/** The hypothesis keys of the models' parameters; each is a stored column of a target. */
export type LensParameterKey = "lensMassSolar" | "velocityDispersionKmPerS";

/** One input of a model, read with the quantity parser of `lib/physics/units.ts`. */
export interface LensParameter<K extends LensParameterKey = LensParameterKey> {
  /** The target's field (and stored column) that holds it, in the unit its name says. */
  key: K;
  /** The field as a sentence names it: "Lens mass". */
  label: string;
  /** The parser's kind for this quantity. */
  kind: QuantityKind;
  /** The stored unit in the parser's spelling ("Msun"); a bare number is read in it. */
  unit: string;
  /** The stored unit as a reader writes it ("M☉"). */
  unitWords: string;
  /** A value the field accepts, shown in refusals: "0.3 Msun". */
  example: string;
  /** The accepted range, from `lib/physics/accepted-ranges.ts`. */
  range: AcceptedRange;
  /** The range refusal's words: what ("The lens mass"), the unit in words, and why the bounds are there. */
  rangeWords: { what: string; unitWords: string; why: string };
  /** Why a hypothesis of this model without the parameter cannot be solved. */
  missingMessage: string;
}

/**
 * Distances of the hypothesis, parsecs (angular-diameter distances for a cosmological lens), and the
 * lens redshift: 0 inside the Galaxy, where D_LS = D_S − D_L and delays are not stretched by (1 + z).
 */
export interface LensGeometry {
  dLensPc: number;
  dSourcePc: number;
  dLensSourcePc: number;
  zLens: number;
}

/** Everything a model solves: its parameters, the distances, the source's offset and the relative motion. */
export interface LensProblem<K extends LensParameterKey = LensParameterKey> {
  parameters: Record<K, number>;
  geometry: LensGeometry;
  /** u = β / θ_E. */
  sourceOffsetThetaE: number;
  /** Relative lens–source proper motion, rad/s; null when unknown. */
  properMotionRadPerS: number | null;
}

/**
 * The timescale over which a hypothesis varies for an observer: the Einstein crossing time of an
 * event (a compact lens moving across the source) or the delay between two images (a galaxy lens
 * and a variable source).
 */
export type LensTimescale = "einsteinTime" | "timeDelay";

export interface LensModel<Id extends string = string, K extends LensParameterKey = LensParameterKey> {
  /** Stored in the database (`lens_model` enum): never renamed. */
  id: Id;
  label: string;
  /** Short name where space is scarce (a table cell): "Point", "SIS". */
  shortLabel: string;
  parameters: readonly LensParameter<K>[];
  /** Spellings of the model in imported tables, lower case letters only (the import strips the rest). */
  importAliases: readonly string[];
  /** The timescale the sampling and campaign questions are asked about. */
  timescale: LensTimescale;
  /** θ_E of the hypothesis, radians (needed before solving when β is given as an angle). */
  einsteinRadiusRad(parameters: Record<K, number>, geometry: LensGeometry): number;
  /** Every lensing quantity of the hypothesis. Inside the accepted ranges it never throws. */
  solve(problem: LensProblem<K>): LensSolution;
}
