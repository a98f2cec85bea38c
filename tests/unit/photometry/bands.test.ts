import { describe, expect, it } from "vitest";
import {
  AB_ZERO_POINT_JY,
  standardBand,
  standardBandIds,
  standardBands,
  typicalDarkSiteConditions,
  validateCustomBand,
  zeroPointPhotonsPerSPerM2PerNm,
  type CustomBandInput,
} from "@/lib/photometry/bands";
import { loadPhotometryFixture, relativeError } from "./fixtures";

/** 1 erg s⁻¹ cm⁻² Å⁻¹ = 1e-2 W m⁻² nm⁻¹; 1 W cm⁻² µm⁻¹ = 10 W m⁻² nm⁻¹ (by hand). */
const ERG_TO_SI = 1e-2;
const W_CM2_UM_TO_SI = 10;

/** Checks a built-in row against a table's wavelength and width (µm) and zero point (W m⁻² nm⁻¹). */
function expectRow(id: string, wavelengthUm: number, widthUm: number, zeroPointWPerM2PerNm: number) {
  const row = band(id);
  expect(row.effectiveWavelengthNm).toBeCloseTo(wavelengthUm * 1000, 9);
  expect(row.widthNm).toBeCloseTo(widthUm * 1000, 9);
  expect(relativeError(row.zeroPointWPerM2PerNm, zeroPointWPerM2PerNm)).toBeLessThan(1e-15);
  expect(row.zeroPointSystem).toBe("vega");
}

function band(id: string) {
  const found = standardBand(id);
  if (!found) throw new Error(`no band ${id}`);
  return found;
}

describe("Johnson–Cousins zero points: Bessell 2005, ARA&A 43, 293, Table 1 (= Bessell, Castelli & Plez 1998, Table A2)", () => {
  // λ_eff (µm) and f_λ of a 0-mag star (erg s⁻¹ cm⁻² Å⁻¹) as printed; the same numbers are widely
  // reproduced, e.g. with the table's f_ν column. Widths (Δλ, µm) are from memory.
  const table: [string, number, number, number][] = [
    ["jc-u", 0.366, 0.065, 417.5e-11],
    ["jc-b", 0.438, 0.089, 632.0e-11],
    ["jc-v", 0.545, 0.084, 363.1e-11],
    ["jc-r", 0.641, 0.158, 217.7e-11],
    ["jc-i", 0.798, 0.154, 112.6e-11],
  ];
  it.each(table)("%s: λ_eff %f µm, Δλ %f µm, f_λ %f erg s⁻¹ cm⁻² Å⁻¹", (id, wavelengthUm, widthUm, fLambda) => {
    expectRow(id, wavelengthUm, widthUm, fLambda * ERG_TO_SI);
  });
});

describe("2MASS zero points: Cohen, Wheaton & Megeath 2003, AJ 126, 1090, Table 2", () => {
  // λ_iso (µm), bandwidth (µm), F_λ (W cm⁻² µm⁻¹) as printed (and on the 2MASS explanatory supplement).
  const table: [string, number, number, number][] = [
    ["2mass-j", 1.235, 0.162, 3.129e-13],
    ["2mass-h", 1.662, 0.251, 1.133e-13],
    ["2mass-ks", 2.159, 0.262, 4.283e-14],
  ];
  it.each(table)("%s: λ_iso %f µm, bandwidth %f µm, F_λ %f W cm⁻² µm⁻¹", (id, wavelengthUm, widthUm, fLambda) => {
    expectRow(id, wavelengthUm, widthUm, fLambda * W_CM2_UM_TO_SI);
  });

  it("agrees with Bessell's J, H, K f_λ (31.47, 11.38, 3.961 × 10⁻¹¹ erg s⁻¹ cm⁻² Å⁻¹) within 2%, another system's filters", () => {
    expect(relativeError(band("2mass-j").zeroPointWPerM2PerNm, 31.47e-11 * ERG_TO_SI)).toBeLessThan(0.02);
    expect(relativeError(band("2mass-h").zeroPointWPerM2PerNm, 11.38e-11 * ERG_TO_SI)).toBeLessThan(0.02);
    // K (2.19 µm) against Ks (2.159 µm): the bluer Ks sees a brighter Vega, 8% more
    expect(band("2mass-ks").zeroPointWPerM2PerNm).toBeGreaterThan(3.961e-11 * ERG_TO_SI);
  });
});

describe("SDSS: Fukugita et al. 1996, AJ 111, 1748, Table 2 (from memory), AB zero point", () => {
  // λ_eff and FWHM in Å, from memory of the table
  const table: [string, number, number][] = [
    ["sdss-u", 3557, 599],
    ["sdss-g", 4825, 1379],
    ["sdss-r", 6261, 1382],
    ["sdss-i", 7672, 1535],
    ["sdss-z", 9097, 1370],
  ];
  it.each(table)("%s: λ_eff %f Å, FWHM %f Å, magnitudes AB", (id, wavelengthA, fwhmA) => {
    const row = band(id);
    expect(row.effectiveWavelengthNm).toBeCloseTo(wavelengthA / 10, 9);
    expect(row.widthNm).toBeCloseTo(fwhmA / 10, 9);
    expect(row.zeroPointSystem).toBe("ab");
  });

  it("AB 0 is 3631 Jy (Oke & Gunn 1983: 10^(−0.4 × 48.60) erg s⁻¹ cm⁻² Hz⁻¹)", () => {
    expect(AB_ZERO_POINT_JY).toBeCloseTo(3630.78, 2);
  });

  it("g: f_λ = f_ν c / λ² = 3631 Jy × c / (482.5 nm)² = 4.675 × 10⁻¹¹ W m⁻² nm⁻¹ (by hand)", () => {
    expect(band("sdss-g").zeroPointWPerM2PerNm).toBeCloseTo(4.675e-11, 13);
  });
});

describe("AB − Vega offsets: Blanton & Roweis 2007, AJ 133, 734, Table 1", () => {
  // m_AB − m_Vega as printed (B, V, J, H, Ks also quoted in many papers; the rest from memory)
  const table: [string, number][] = [
    ["jc-u", 0.79],
    ["jc-b", -0.09],
    ["jc-v", 0.02],
    ["jc-r", 0.21],
    ["jc-i", 0.45],
    ["sdss-u", 0.91],
    ["sdss-g", -0.08],
    ["sdss-r", 0.16],
    ["sdss-i", 0.37],
    ["sdss-z", 0.54],
    ["2mass-j", 0.91],
    ["2mass-h", 1.39],
    ["2mass-ks", 1.85],
  ];
  it.each(table)("%s: %f mag", (id, offset) => {
    expect(band(id).abMinusVegaMag).toBe(offset);
    expect(band(id).offsetSource).toMatch(/Blanton & Roweis 2007/);
  });

  it("the table holds exactly these thirteen bands, each with a source", () => {
    expect([...standardBandIds].sort()).toEqual(table.map(([id]) => id).sort());
    for (const row of standardBands) expect(row.source.length).toBeGreaterThan(10);
  });

  it("the Vega bands' zero points imply offsets near Blanton & Roweis's (within 0.1 mag; filters and Vega spectra differ)", () => {
    // AB magnitude of a Vega-0 star: −2.5 log₁₀(f_λ λ² / c / 3631 Jy)
    for (const id of ["jc-b", "jc-v", "jc-r", "jc-i", "2mass-j", "2mass-h", "2mass-ks"]) {
      const row = band(id);
      const wavelengthM = row.effectiveWavelengthNm * 1e-9;
      const fNuJy = (row.zeroPointWPerM2PerNm * 1e9 * wavelengthM * wavelengthM) / 299_792_458 / 1e-26;
      const implied = -2.5 * Math.log10(fNuJy / AB_ZERO_POINT_JY);
      expect(Math.abs(implied - (row.abMinusVegaMag ?? Number.NaN))).toBeLessThan(0.1);
    }
  });
});

describe("photon zero points against astropy's spectral_density conversion (tests/fixtures/generate_psf.py)", () => {
  const fixture = loadPhotometryFixture<{ photonZeroPoints: { rows: { id: string; wPerM2PerNm: number; photonsPerSPerM2PerNm: number }[] } }>();

  it("every band's f_λ and photon rate agree to 1e-12", () => {
    let largest = 0;
    for (const row of fixture.photonZeroPoints.rows) {
      const ours = band(row.id);
      largest = Math.max(largest, relativeError(ours.zeroPointWPerM2PerNm, row.wPerM2PerNm));
      largest = Math.max(largest, relativeError(zeroPointPhotonsPerSPerM2PerNm(ours), row.photonsPerSPerM2PerNm));
    }
    expect(largest).toBeLessThan(1e-12);
  });

  it("V = 0 gives about 1000 photons s⁻¹ cm⁻² Å⁻¹ (common practice rule of thumb): 9.962 × 10⁷ s⁻¹ m⁻² nm⁻¹", () => {
    expect(zeroPointPhotonsPerSPerM2PerNm(band("jc-v"))).toBeCloseTo(9.962e7, -4);
  });
});

describe("typical dark site", () => {
  it("gives sky and extinction for every built-in band, each marked as typical with its source", () => {
    for (const id of standardBandIds) {
      const site = typicalDarkSiteConditions[id];
      expect(site?.source).toMatch(/^typical dark site/);
      expect(site?.extinctionMagPerAirmass).toBeGreaterThan(0);
    }
    // Benn & Ellison 1998 (La Palma, solar minimum), from memory: V 21.9, B 22.7 mag/arcsec²
    expect(typicalDarkSiteConditions["jc-v"]?.darkSkyMagPerArcsec2).toBe(21.9);
    expect(typicalDarkSiteConditions["jc-b"]?.darkSkyMagPerArcsec2).toBe(22.7);
  });
});

describe("custom band", () => {
  const good: CustomBandInput = {
    label: "Hα narrow",
    effectiveWavelengthNm: 656.3,
    widthNm: 3,
    zeroPointWPerM2PerNm: 2.2e-11,
    zeroPointSystem: "vega",
    abMinusVegaMag: null,
  };

  it("accepts a sound band and keeps its numbers", () => {
    const result = validateCustomBand(good);
    expect("band" in result && result.band.widthNm).toBe(3);
    expect("band" in result && result.band.abMinusVegaMag).toBeNull();
  });

  it("answers each bad field in words naming it", () => {
    const result = validateCustomBand({
      ...good,
      label: "  ",
      effectiveWavelengthNm: -5,
      widthNm: 0,
      zeroPointWPerM2PerNm: Number.NaN,
      abMinusVegaMag: 40,
    });
    if (!("fieldErrors" in result)) throw new Error("expected field errors");
    expect(result.fieldErrors.label?.[0]).toMatch(/^Band name:/);
    expect(result.fieldErrors.effectiveWavelengthNm?.[0]).toBe("Effective wavelength: must be between 100 nm and 30000 nm.");
    expect(result.fieldErrors.widthNm?.[0]).toMatch(/^Band width: must be a number above 0 nm/);
    expect(result.fieldErrors.zeroPointWPerM2PerNm?.[0]).toMatch(/^Zero point:/);
    expect(result.fieldErrors.abMinusVegaMag?.[0]).toMatch(/^AB − Vega offset:/);
  });

  it("refuses a band wider than its wavelength", () => {
    const result = validateCustomBand({ ...good, widthNm: 700 });
    expect("fieldErrors" in result && result.fieldErrors.widthNm).toEqual(["Band width: must be narrower than the effective wavelength."]);
  });
});
