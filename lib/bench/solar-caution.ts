/**
 * When a sketch describes deflection by the Sun, the bench says that optics must never be pointed
 * near the Sun without a proper solar filter. A sketch is solar when a compact lens of about one solar
 * mass sits within the Solar System's scale (the only such lens an observer can point at is the Sun).
 */

import { SUN_POINTING_CAUTION } from "@/lib/astro/sun-caution";
import { AU_M, PARSEC_M } from "@/lib/physics";
import type { SketchInputs } from "./parse-sketch";

/** Beyond ~1000 au no star but the Sun is that close; the bound is generous on purpose. */
const SOLAR_SYSTEM_LIMIT_PC = (1000 * AU_M) / PARSEC_M;

const SOLAR_MASS_RANGE = { low: 0.8, high: 1.25 } as const;

export const solarCautionText = `This sketch describes deflection by the Sun. ${SUN_POINTING_CAUTION}`;

export function isSolarSketch(inputs: SketchInputs): boolean {
  if (inputs.lens.model !== "point") return false;
  const { massSolar } = inputs.lens;
  return massSolar >= SOLAR_MASS_RANGE.low && massSolar <= SOLAR_MASS_RANGE.high && inputs.geometry.dLensPc <= SOLAR_SYSTEM_LIMIT_PC;
}
