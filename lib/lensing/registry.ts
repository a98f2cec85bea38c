/**
 * The lens models, listed once. The database enum, the zod schemas, the labels, the form fields and
 * the import's spellings all derive from this list; adding a model is one file in `models/`, one
 * entry here and a migration adding its id to the `lens_model` enum (DEVELOPERS.md).
 */

import type { LensGeometry, LensModel, LensParameter, LensParameterKey } from "./lens-model";
import { isothermalSphereModel } from "./models/isothermal-sphere";
import { pointMassModel } from "./models/point-mass";
import type { LensSolution } from "./solution";

const registeredModels = [pointMassModel, isothermalSphereModel] as const;

type IdsOf<T extends readonly { id: string }[]> = { -readonly [I in keyof T]: T[I]["id"] };

/** Every model's id, in the registry's order: the values of the `lens_model` enum and of `z.enum`. */
export const lensModelIds = registeredModels.map((model) => model.id) as IdsOf<typeof registeredModels>;
export type LensModelId = (typeof lensModelIds)[number];

/** Every model, in the registry's order. */
export const lensModels: readonly LensModel<LensModelId>[] = registeredModels;

type RegisteredModel = (typeof registeredModels)[number];

const byId = Object.fromEntries(registeredModels.map((model) => [model.id, model])) as Record<LensModelId, RegisteredModel>;

/** The model of an id, typed with its own parameters (ids come from the enum, so every one has a model). */
export function lensModelOf<Id extends LensModelId>(id: Id): Extract<RegisteredModel, { id: Id }> {
  return byId[id] as Extract<RegisteredModel, { id: Id }>;
}

/** Each model's label ("Point mass"), by id. */
export const lensModelLabels = Object.fromEntries(registeredModels.map((model) => [model.id, model.label])) as Record<LensModelId, string>;

/** Every parameter of every model, each once (a target stores each in its own column). */
export const lensParameters: readonly LensParameter[] = registeredModels.flatMap((model): readonly LensParameter[] => model.parameters);

/** The model an imported cell names, after lower-casing and dropping all but letters; undefined when none does. */
export function lensModelOfAlias(text: string): LensModelId | undefined {
  const spelling = text.toLowerCase().replace(/[^a-z]/g, "");
  return registeredModels.find((model) => (model.importAliases as readonly string[]).includes(spelling))?.id;
}

/** Whether a model's own parameter is this key. */
export function usesParameter(id: LensModelId, key: LensParameterKey): boolean {
  return lensModelOf(id).parameters.some((parameter) => parameter.key === key);
}

/** The model whose parameters are exactly the ones given (a table with a mass and no dispersion is a point mass); undefined when none or several fit. */
export function lensModelOfParameters(given: Partial<Record<LensParameterKey, unknown>>): LensModelId | undefined {
  const fitting = registeredModels.filter((model) => lensParameters.every((p) => (given[p.key] !== undefined) === usesParameter(model.id, p.key)));
  return fitting.length === 1 ? fitting[0].id : undefined;
}

/** A model's parameters read from a record holding every parameter key; null when one of the model's is missing. */
export function parametersOf(id: LensModelId, values: Partial<Record<LensParameterKey, number | null>>): Record<LensParameterKey, number> | null {
  const parameters: Partial<Record<LensParameterKey, number>> = {};
  for (const { key } of lensModelOf(id).parameters) {
    const value = values[key];
    if (value === null || value === undefined) return null;
    parameters[key] = value;
  }
  return parameters as Record<LensParameterKey, number>;
}

/**
 * Solves a hypothesis given with every parameter key (the unused ones ignored); null when the
 * model's own parameter is missing.
 */
export function solveLens(
  id: LensModelId,
  values: Partial<Record<LensParameterKey, number | null>>,
  geometry: LensGeometry,
  sourceOffsetThetaE: number,
  properMotionRadPerS: number | null,
): LensSolution | null {
  const parameters = parametersOf(id, values);
  return parameters === null ? null : lensModelOf(id).solve({ parameters, geometry, sourceOffsetThetaE, properMotionRadPerS });
}
