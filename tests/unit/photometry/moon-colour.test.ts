import { describe, expect, it } from "vitest";
import {
  moonMagPerArcsec2InBand,
  SOLAR_ABSOLUTE_MAGNITUDES,
  solarAbsoluteMagnitude,
  standardBand,
  standardBandIds,
  sunColourVMinusBandMag,
  validateCustomBand,
} from "@/lib/photometry";
import type { CustomBandInput } from "@/lib/photometry/bands";

function band(id: string) {
  const found = standardBand(id);
  if (!found) throw new Error(`no band ${id}`);
  return found;
}

function custom(input: Partial<CustomBandInput>) {
  const result = validateCustomBand({
    label: "Custom",
    effectiveWavelengthNm: 656.3,
    widthNm: 3,
    zeroPointWPerM2PerNm: 2e-11,
    zeroPointSystem: "vega",
    abMinusVegaMag: null,
    ...input,
  });
  if (!("band" in result)) throw new Error("expected a band");
  return result.band;
}

describe("the Sun's absolute magnitudes: Willmer 2018, ApJS 236, 47, Table 3 (from memory)", () => {
  const table: [string, number][] = [
    ["jc-u", 5.61],
    ["jc-b", 5.44],
    ["jc-v", 4.81],
    ["jc-r", 4.43],
    ["jc-i", 4.1],
    ["sdss-u", 6.39],
    ["sdss-g", 5.11],
    ["sdss-r", 4.65],
    ["sdss-i", 4.53],
    ["sdss-z", 4.5],
    ["2mass-j", 3.67],
    ["2mass-h", 3.32],
    ["2mass-ks", 3.27],
  ];
  it.each(table)("%s: %f mag", (id, value) => {
    expect(solarAbsoluteMagnitude(band(id))).toBe(value);
  });

  it("covers every built-in band", () => {
    expect(Object.keys(SOLAR_ABSOLUTE_MAGNITUDES).sort()).toEqual([...standardBandIds].sort());
  });

  it("give solar colours near independent measurements (from memory, within 0.03 mag)", () => {
    // (B − V)☉ = 0.653 (Ramírez et al. 2012, ApJ 752, 5); (V − Ks)☉ = 1.560 (Casagrande et al. 2012, ApJ 761, 16)
    expect(Math.abs(sunColourVMinusBandMag(band("jc-b")) + 0.653)).toBeLessThan(0.03);
    expect(Math.abs(sunColourVMinusBandMag(band("2mass-ks")) - 1.56)).toBeLessThan(0.03);
  });

  it("agree across systems through Blanton & Roweis's offsets where filters neighbour (within 0.05 mag)", () => {
    // R_C (641 nm, Vega) + (AB − Vega) 0.21 against SDSS r (626 nm, AB); I_C + 0.45 against SDSS i
    expect(Math.abs(4.43 + 0.21 - SOLAR_ABSOLUTE_MAGNITUDES["sdss-r"])).toBeLessThan(0.05);
    expect(Math.abs(4.1 + 0.45 - SOLAR_ABSOLUTE_MAGNITUDES["sdss-i"])).toBeLessThan(0.05);
  });
});

describe("moonlight in other bands by the colour of sunlight", () => {
  it("leaves V as K&S give it and makes I 0.71 mag brighter (M_☉,V − M_☉,I = 4.81 − 4.10)", () => {
    expect(moonMagPerArcsec2InBand(20, band("jc-v"))).toBe(20);
    expect(moonMagPerArcsec2InBand(20, band("jc-i"))).toBeCloseTo(19.29, 12);
    expect(moonMagPerArcsec2InBand(20, band("jc-u"))).toBeCloseTo(20.8, 12);
    expect(moonMagPerArcsec2InBand(Number.POSITIVE_INFINITY, band("2mass-h"))).toBe(Number.POSITIVE_INFINITY);
  });

  it("gives a custom band the nearest built-in band's value in log wavelength, in its own system (our rule)", () => {
    // Hα (656.3 nm, Vega): nearest is R_C (641 nm), 4.43
    expect(solarAbsoluteMagnitude(custom({}))).toBe(4.43);
    // 650 nm in AB: R_C (641 nm) is nearer than SDSS r (626.1 nm); 4.43 + 0.21 = 4.64, next to SDSS r's 4.65
    expect(solarAbsoluteMagnitude(custom({ effectiveWavelengthNm: 650, zeroPointSystem: "ab" }))).toBeCloseTo(4.64, 12);
    // 2.2 µm in AB: Ks (2159 nm), 3.27 + 1.85 = 5.12
    expect(solarAbsoluteMagnitude(custom({ effectiveWavelengthNm: 2200, widthNm: 300, zeroPointSystem: "ab" }))).toBeCloseTo(5.12, 12);
    // 500 nm in AB: SDSS g (482.5 nm), 5.11, already AB
    expect(solarAbsoluteMagnitude(custom({ effectiveWavelengthNm: 500, zeroPointSystem: "ab" }))).toBe(5.11);
  });
});
