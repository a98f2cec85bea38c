/**
 * Sky brightness added by scattered moonlight, in V, after K. Krisciunas & B. E. Schaefer 1991,
 * "A model of the brightness of moonlight", PASP 103, 1033 (K&S below), implemented as published.
 * The paper states its predictions agree with its Mauna Kea data to 8–23%; that is this module's
 * accuracy, not the arithmetic's (which is exact to a few ulp; tests/fixtures/generate_photometry.py).
 *
 * Equation labels follow issue 17 (eq. 1 conversion, eq. 3 air mass, eq. 8 illuminance, eq. 15
 * moonlight, eq. 21 scattering). The formulas and constants are written from memory of the paper and
 * should be checked against the printed page; so are these remarks of the paper, also from memory:
 * the Moon is up to 35% brighter than eq. 8 within 7° of full (opposition effect); eq. 21 is fitted
 * to separations above about 10°, nearer the Moon the forward (Mie) peak is steeper than eq. 21, so
 * within 10° of the Moon the moonlight returned here is an underestimate.
 *
 * The air mass here is K&S eq. 3, not `lib/astro/airmass.ts` (Pickering 2002): the model's
 * coefficients were fitted with eq. 3, so it is part of the model.
 */
import { domainError, requireFinite } from "@/lib/physics/domain";

const DEG = Math.PI / 180;

/** K&S eq. 1 constants: B_nL = 34.08 exp(20.7233 − 0.92104 V) (0.92104 = 0.4 ln 10). */
const NANOLAMBERT_SCALE = 34.08;
const NANOLAMBERT_EXPONENT_OFFSET = 20.7233;
const NANOLAMBERT_PER_MAG = 0.92104;

/**
 * Smallest Moon–target separation the model is fitted to, degrees (K&S's data; from memory): nearer
 * the Moon its forward-scattering peak is steeper than eq. 21 and the moonlight is underestimated.
 */
export const MOONLIGHT_MODEL_MIN_SEPARATION_DEG = 10;

/** Opposition surge (our rule, from K&S's "up to 35% within 7°"): ×1.35 at full, linearly to ×1 at 7°. */
const OPPOSITION_SURGE_AT_FULL = 0.35;
const OPPOSITION_SURGE_WIDTH_DEG = 7;

function requireInRange(label: string, value: number, lowDeg: number, highDeg: number): void {
  requireFinite(label, value);
  if (value < lowDeg || value > highDeg) throw domainError(label, value, `between ${lowDeg}° and ${highDeg}°`);
}

/**
 * Relative air mass at zenith distance `zenithDeg` (degrees, [0, 90]), K&S eq. 3:
 * X(Z) = (1 − 0.96 sin²Z)^−0.5. X(0) = 1, X(90°) = 5 (the model's own horizon air mass).
 */
export function krisciunasSchaeferAirmass(zenithDeg: number): number {
  const s = Math.sin(zenithDeg * DEG);
  return 1 / Math.sqrt(1 - 0.96 * s * s);
}

/**
 * Illuminance of the Moon outside the atmosphere at phase angle `moonPhaseAngleDeg` (degrees, |α| ≤
 * 180; 0 is full), in the paper's units (foot-candles, from memory), K&S eq. 8:
 * I* = 10^(−0.4 (3.84 + 0.026 |α| + 4×10⁻⁹ α⁴)), times 1.35 − 0.05 |α| for |α| < 7° (opposition
 * surge; the linear taper, continuous at 7°, is our reading of the paper's "up to 35%").
 */
export function moonIlluminance(moonPhaseAngleDeg: number): number {
  const a = Math.abs(moonPhaseAngleDeg);
  const illuminance = 10 ** (-0.4 * (3.84 + 0.026 * a + 4e-9 * a ** 4));
  if (a >= OPPOSITION_SURGE_WIDTH_DEG) return illuminance;
  return illuminance * (1 + OPPOSITION_SURGE_AT_FULL * (1 - a / OPPOSITION_SURGE_WIDTH_DEG));
}

/**
 * Scattering function at angle `separationDeg` (degrees, [0, 180]) from the Moon, K&S eq. 21:
 * f(ρ) = 10^5.36 (1.06 + cos²ρ) [Rayleigh] + 10^(6.15 − ρ/40) [Mie, ρ in degrees].
 */
export function moonScattering(separationDeg: number): number {
  const c = Math.cos(separationDeg * DEG);
  return 10 ** 5.36 * (1.06 + c * c) + 10 ** (6.15 - separationDeg / 40);
}

export interface MoonSkyInput {
  /** Sun–Moon–Earth phase angle α (degrees, [−180, 180]; 0 full, 180 new; only |α| matters). */
  moonPhaseAngleDeg: number;
  /** Zenith distance of the Moon (degrees, [0, 180]); beyond 90 the Moon is below the horizon. */
  moonZenithDeg: number;
  /** Zenith distance of the sky position (degrees, [0, 90]). */
  targetZenithDeg: number;
  /** Angle between the Moon and the sky position (degrees, [0, 180]). */
  moonTargetSeparationDeg: number;
  /** V-band extinction coefficient k (magnitudes per air mass, ≥ 0). */
  extinctionV: number;
}

/**
 * Surface brightness of scattered moonlight at a sky position, in nanolamberts (V band), K&S eq. 15:
 * B_moon = f(ρ) I*(α) 10^(−0.4 k X(Z_moon)) [1 − 10^(−0.4 k X(Z))], with I* eq. 8, f eq. 21, X eq. 3.
 * Returns 0 when the Moon is below the horizon (`moonZenithDeg` > 90°): it adds no light then (the
 * model leaves twilight-lit Moon-set skies out). Throws a RangeError naming the field in words when an
 * input is not a finite number in its domain (see `MoonSkyInput`).
 * Accuracy: the model's, 8–23% in the paper's comparison (see the module comment).
 */
export function moonSkyBrightnessNanolamberts(input: MoonSkyInput): number {
  const { moonPhaseAngleDeg, moonZenithDeg, targetZenithDeg, moonTargetSeparationDeg, extinctionV } = input;
  requireMoonGeometry(moonPhaseAngleDeg, moonZenithDeg, targetZenithDeg, moonTargetSeparationDeg);
  requireExtinctionV(extinctionV);
  return scatteredMoonlightNanolamberts(moonPhaseAngleDeg, moonZenithDeg, targetZenithDeg, moonTargetSeparationDeg, extinctionV);
}

/**
 * Checks the angles of `MoonSkyInput` (degrees), throwing a RangeError naming the field in words; for
 * callers that check once and then call `scatteredMoonlightNanolamberts` in a loop.
 */
export function requireMoonGeometry(moonPhaseAngleDeg: number, moonZenithDeg: number, targetZenithDeg: number, moonTargetSeparationDeg: number): void {
  requireInRange("Moon phase angle", moonPhaseAngleDeg, -180, 180);
  requireInRange("Moon zenith distance", moonZenithDeg, 0, 180);
  requireInRange("Target zenith distance", targetZenithDeg, 0, 90);
  requireInRange("Moon–target separation", moonTargetSeparationDeg, 0, 180);
}

/** Checks a V-band extinction coefficient (mag per air mass, ≥ 0), naming the field in words. */
export function requireExtinctionV(extinctionV: number): void {
  requireFinite("V-band extinction", extinctionV);
  if (extinctionV < 0) throw domainError("V-band extinction", extinctionV, "at least 0 magnitudes per air mass");
}

/**
 * K&S eq. 15 as `moonSkyBrightnessNanolamberts`, with positional arguments in the same units and no
 * checks (callers check with `requireMoonGeometry` and `requireExtinctionV`): the per-visit loop of
 * the photon budget calls it without building an object per visit.
 */
export function scatteredMoonlightNanolamberts(
  moonPhaseAngleDeg: number,
  moonZenithDeg: number,
  targetZenithDeg: number,
  moonTargetSeparationDeg: number,
  extinctionV: number,
): number {
  if (moonZenithDeg > 90) return 0;
  const moonTransmission = 10 ** (-0.4 * extinctionV * krisciunasSchaeferAirmass(moonZenithDeg));
  const scatteredShare = -Math.expm1(-0.4 * Math.LN10 * extinctionV * krisciunasSchaeferAirmass(targetZenithDeg));
  return moonScattering(moonTargetSeparationDeg) * moonIlluminance(moonPhaseAngleDeg) * moonTransmission * scatteredShare;
}

/**
 * Nanolamberts for a V surface brightness `vMagPerArcsec2` (mag/arcsec², finite), K&S eq. 1:
 * B = 34.08 exp(20.7233 − 0.92104 V).
 */
export function nanolambertsFromVMagPerArcsec2(vMagPerArcsec2: number): number {
  requireFinite("Sky brightness (mag/arcsec²)", vMagPerArcsec2);
  return NANOLAMBERT_SCALE * Math.exp(NANOLAMBERT_EXPONENT_OFFSET - NANOLAMBERT_PER_MAG * vMagPerArcsec2);
}

/**
 * V surface brightness (mag/arcsec²) of `nanolamberts` (≥ 0), the inverse of K&S eq. 1:
 * V = (20.7233 − ln(B / 34.08)) / 0.92104. Zero nanolamberts is +Infinity (no light).
 */
export function vMagPerArcsec2FromNanolamberts(nanolamberts: number): number {
  requireFinite("Sky brightness (nanolamberts)", nanolamberts);
  if (nanolamberts < 0) throw domainError("Sky brightness (nanolamberts)", nanolamberts, "at least 0");
  return (NANOLAMBERT_EXPONENT_OFFSET - Math.log(nanolamberts / NANOLAMBERT_SCALE)) / NANOLAMBERT_PER_MAG;
}

/**
 * Dark-sky brightness at zenith distance `targetZenithDeg` (degrees, [0, 90]) from its zenith value
 * `zenithNanolamberts` (≥ 0), K&S eq. 2 (from memory): B = B_zen 10^(−0.4 k (X − 1)) X, X from eq. 3,
 * k = `extinctionV` (mag per air mass, ≥ 0). Airglow seen through more air, dimmed by extinction.
 */
export function darkSkyNanolamberts(input: {
  zenithNanolamberts: number;
  targetZenithDeg: number;
  extinctionV: number;
}): number {
  const { zenithNanolamberts, targetZenithDeg, extinctionV } = input;
  requireFinite("Dark sky at the zenith", zenithNanolamberts);
  if (zenithNanolamberts < 0) throw domainError("Dark sky at the zenith", zenithNanolamberts, "at least 0");
  requireInRange("Target zenith distance", targetZenithDeg, 0, 90);
  requireExtinctionV(extinctionV);
  return zenithNanolamberts * darkSkyZenithDistanceFactor(targetZenithDeg, extinctionV);
}

/**
 * The factor of K&S eq. 2 (from memory): B(Z) / B_zen = 10^(−0.4 k (X − 1)) X, X from eq. 3, for
 * zenith distance `targetZenithDeg` (degrees, [0, 90]) and extinction k (mag per air mass, ≥ 0).
 * Dimensionless, so it applies to a surface brightness in any unit; no checks (callers check).
 */
export function darkSkyZenithDistanceFactor(targetZenithDeg: number, extinctionMagPerAirmass: number): number {
  const x = krisciunasSchaeferAirmass(targetZenithDeg);
  return 10 ** (-0.4 * extinctionMagPerAirmass * (x - 1)) * x;
}

/**
 * Surface brightness (V mag/arcsec²) of a dark sky `darkSkyVMagPerArcsec2` (at the sky position)
 * with `moonNanolamberts` (≥ 0, from `moonSkyBrightnessNanolamberts`) added: the two are summed in
 * nanolamberts (K&S eq. 1 both ways), since surface brightnesses add in flux, not magnitudes.
 */
export function skyWithMoonVMagPerArcsec2(input: { darkSkyVMagPerArcsec2: number; moonNanolamberts: number }): number {
  const { darkSkyVMagPerArcsec2, moonNanolamberts } = input;
  requireFinite("Moonlight (nanolamberts)", moonNanolamberts);
  if (moonNanolamberts < 0) throw domainError("Moonlight (nanolamberts)", moonNanolamberts, "at least 0");
  return vMagPerArcsec2FromNanolamberts(nanolambertsFromVMagPerArcsec2(darkSkyVMagPerArcsec2) + moonNanolamberts);
}
