import { Body, Equator, EquatorFromVector, Horizon, Illumination, Observer, RotateVector, Rotation_EQJ_EQD, Spherical, VectorFromSphere } from "astronomy-engine";
import { describe, expect, it } from "vitest";
import { apparentAltitudeDeg, refractionScale } from "@/lib/astro/refraction";
import { astroTimeFromJdUtc } from "@/lib/astro/time";
import { moonSkyBrightnessNanolamberts, sunColourVMinusBandMag, vMagPerArcsec2FromNanolamberts, type BandSky } from "@/lib/photometry";
import { nightSkyBrightness, type NightSkyBrightness } from "@/lib/photometry/night-sky";
import { bandSkyOf, defaultPhotometrySettings, photometrySettingsSchema } from "@/lib/workspace/photometry-schema";
import { bulge, southSite } from "../schedule/sites";

const DEG = Math.PI / 180;
const observer = new Observer(southSite.latitudeDeg, southSite.longitudeEastDeg, southSite.elevationM);

function skyIn(bandId: string): BandSky {
  const found = bandSkyOf(defaultPhotometrySettings, bandId);
  if (!("sky" in found)) throw new Error(found.missing);
  return found.sky;
}

const vSky = skyIn("jc-v");
const night = (nightDateIso: string, bandSky = vSky, site: typeof southSite & { horizonLimitDeg?: number } = southSite) => nightSkyBrightness({ site, target: bulge, nightDateIso, bandSky });
// Nights of 2022 (astronomy-engine's phases, checked in these tests): full Moon on 14 June near the
// bulge, last quarter on the 20th (the Moon rises in the small hours), new Moon on the 28th.
const fullMoon = night("2022-06-14");
const quarterMoon = night("2022-06-20");
const newMoon = night("2022-06-28");

/**
 * Independent conditions at `jdUtc` from astronomy-engine: zenith distances (geometric, no
 * refraction) and the Moon–target separation; the bulge field precessed to the equator of date
 * without aberration (20″ at most).
 */
function conditionsAt(jdUtc: number) {
  const time = astroTimeFromJdUtc(jdUtc);
  const targetVector = RotateVector(Rotation_EQJ_EQD(time), VectorFromSphere(new Spherical(bulge.decDeg, bulge.raDeg, 1), time));
  const target = [targetVector.x, targetVector.y, targetVector.z];
  const targetEq = EquatorFromVector(targetVector);
  const moon = Equator(Body.Moon, time, observer, true, true);
  const moonUnit = [moon.vec.x, moon.vec.y, moon.vec.z].map((c) => c / Math.hypot(moon.vec.x, moon.vec.y, moon.vec.z));
  const cosSeparation = target[0] * moonUnit[0] + target[1] * moonUnit[1] + target[2] * moonUnit[2];
  return {
    targetZenithDeg: 90 - Horizon(time, observer, targetEq.ra, targetEq.dec).altitude,
    moonZenithDeg: 90 - Horizon(time, observer, moon.ra, moon.dec).altitude,
    moonSeparationDeg: Math.acos(Math.max(-1, Math.min(1, cosSeparation))) / DEG,
  };
}

/** K&S 1991 eq. 2 with eq. 3's air mass (from memory, as lib/photometry/moon-sky.ts): B(Z) = B_zen 10^(−0.4 k (X − 1)) X, X = (1 − 0.96 sin²Z)^−½. */
function darkSkyModelMag(zenithMag: number, extinction: number, zenithDeg: number): number {
  const x = 1 / Math.sqrt(1 - 0.96 * Math.sin(zenithDeg * DEG) ** 2);
  return zenithMag - 2.5 * Math.log10(10 ** (-0.4 * extinction * (x - 1)) * x);
}

const indices = (sky: NightSkyBrightness) => Array.from(sky.jdUtc, (_, i) => i);

describe("the sky brightness through a night (night-sky.ts)", () => {
  it("with the Moon down adds no moonlight: the sky is K&S eq. 2's dark sky at the target's zenith distance (astronomy-engine), to 0.002 mag", () => {
    const moonDown = indices(newMoon).filter((i) => newMoon.moonMagPerArcsec2[i] === Infinity);
    expect(moonDown.length).toBe(newMoon.jdUtc.length);
    let worst = 0;
    for (const i of moonDown) {
      // Summed in flux with nothing: the same magnitude to rounding (the 10^(−0.4 m) round trip).
      expect(Math.abs(newMoon.totalMagPerArcsec2[i] - newMoon.darkMagPerArcsec2[i])).toBeLessThan(1e-12);
      const { targetZenithDeg } = conditionsAt(newMoon.jdUtc[i]);
      worst = Math.max(worst, Math.abs(newMoon.darkMagPerArcsec2[i] - darkSkyModelMag(21.9, 0.15, targetZenithDeg)));
    }
    // Worst seen when written: 1.3e-4 mag (the zenith distances agree to about 0.1′, aberration left out here).
    expect(worst).toBeLessThan(0.002);
    expect(newMoon.largestMoonBrighteningMag).toBe(0);
    expect(newMoon.moonIlluminatedFraction).toBeLessThan(0.01);
  });

  it("near the full Moon is brighter by K&S eq. 15's moonlight, summed in flux, in V and carried to I by the Sun's colour", () => {
    expect(fullMoon.moonIlluminatedFraction).toBeGreaterThan(0.98);
    const midDarkJdUtc = (fullMoon.darkness!.startJdUtc + fullMoon.darkness!.endJdUtc) / 2;
    // The night's one phase angle, at the middle of darkness (as the schedule's visits take it).
    const moonPhaseAngleDeg = Illumination(Body.Moon, astroTimeFromJdUtc(midDarkJdUtc)).phase_angle;
    const iBand = night("2022-06-14", skyIn("jc-i"));
    let worst = 0;
    for (const i of indices(fullMoon).filter((n) => n % 10 === 0)) {
      const conditions = conditionsAt(fullMoon.jdUtc[i]);
      const moonV = vMagPerArcsec2FromNanolamberts(moonSkyBrightnessNanolamberts({ ...conditions, moonTargetSeparationDeg: conditions.moonSeparationDeg, moonPhaseAngleDeg, extinctionV: 0.15 }));
      const darkV = darkSkyModelMag(21.9, 0.15, conditions.targetZenithDeg);
      const expectedV = -2.5 * Math.log10(10 ** (-0.4 * darkV) + 10 ** (-0.4 * moonV));
      worst = Math.max(worst, Math.abs(fullMoon.totalMagPerArcsec2[i] - expectedV), Math.abs(fullMoon.moonMagPerArcsec2[i] - moonV));
      const moonI = moonV - sunColourVMinusBandMag(skyIn("jc-i").band);
      const darkI = darkSkyModelMag(20.0, 0.07, conditions.targetZenithDeg);
      worst = Math.max(worst, Math.abs(iBand.totalMagPerArcsec2[i] - -2.5 * Math.log10(10 ** (-0.4 * darkI) + 10 ** (-0.4 * moonI))));
    }
    // Moon directions agree to under 1′ (visit-sky.test.ts); worst seen when written 3e-4 mag.
    expect(worst).toBeLessThan(0.01);
    // A full Moon a few tens of degrees away brightens a 21.9 mag V sky by over 4 magnitudes.
    expect(fullMoon.largestMoonBrighteningMag).toBeGreaterThan(4);
  });

  it("never makes the sky fainter than the dark sky, and the dark sky brightens as the target sinks (eq. 2 is monotone in Z for k < 0.9)", () => {
    for (const sky of [fullMoon, quarterMoon, newMoon]) {
      for (const i of indices(sky)) expect(sky.totalMagPerArcsec2[i]).toBeLessThanOrEqual(sky.darkMagPerArcsec2[i] + 1e-12);
    }
    const byZenith = indices(newMoon)
      .map((i) => ({ zenithDeg: conditionsAt(newMoon.jdUtc[i]).targetZenithDeg, mag: newMoon.darkMagPerArcsec2[i] }))
      .sort((a, b) => a.zenithDeg - b.zenithDeg);
    for (let n = 1; n < byZenith.length; n++) expect(byZenith[n].mag).toBeLessThanOrEqual(byZenith[n - 1].mag + 1e-9);
  });

  it("marks the Moon rising where its centre crosses the geometric horizon (astronomy-engine altitude within 0.1°), with moonlight only after it", () => {
    expect(quarterMoon.moonCrossings.map((crossing) => crossing.kind)).toEqual(["rise"]);
    const rise = quarterMoon.moonCrossings[0].jdUtc;
    expect(Math.abs(conditionsAt(rise).moonZenithDeg - 90)).toBeLessThan(0.1);
    for (const i of indices(quarterMoon)) {
      const isUp = quarterMoon.jdUtc[i] > rise;
      expect(quarterMoon.moonMagPerArcsec2[i] === Infinity).toBe(!isUp);
    }
  });

  it("spans astronomical darkness (the Sun at −18° at both ends, astronomy-engine, within 0.05°) and only the samples with the target above the site's horizon", () => {
    const sunAltitudeDeg = (jdUtc: number) => {
      const time = astroTimeFromJdUtc(jdUtc);
      const sun = Equator(Body.Sun, time, observer, true, true);
      return Horizon(time, observer, sun.ra, sun.dec).altitude;
    };
    expect(Math.abs(sunAltitudeDeg(newMoon.darkness!.startJdUtc) + 18)).toBeLessThan(0.05);
    expect(Math.abs(sunAltitudeDeg(newMoon.darkness!.endJdUtc) + 18)).toBeLessThan(0.05);
    expect(newMoon.jdUtc[0]).toBe(newMoon.darkness!.startJdUtc);

    const high = night("2022-06-28", vSky, { ...southSite, horizonLimitDeg: 45 });
    expect(high.jdUtc.length).toBeGreaterThan(10);
    expect(high.jdUtc.length).toBeLessThan(newMoon.jdUtc.length);
    const scale = refractionScale(southSite.elevationM);
    for (const i of indices(high)) expect(apparentAltitudeDeg(90 - conditionsAt(high.jdUtc[i]).targetZenithDeg, scale)).toBeGreaterThan(45 - 0.05);
  });

  it("has no samples on a night without astronomical darkness (65° N at midsummer)", () => {
    const sky = nightSkyBrightness({ site: { name: "Far north (invented)", latitudeDeg: 65, longitudeEastDeg: 20, elevationM: 100 }, target: { raDeg: 270, decDeg: 40 }, nightDateIso: "2022-06-21", bandSky: vSky });
    expect(sky.darkness).toBeNull();
    expect(sky.jdUtc.length).toBe(0);
  });
});

describe("the band a target's sky is drawn in (bandSkyOf)", () => {
  it("reads a built-in band with the typical dark site, the V extinction for the moonlight", () => {
    const sky = skyIn("jc-i");
    expect(sky.band.label).toContain("I");
    expect([sky.darkSkyZenithMagPerArcsec2, sky.extinctionMagPerAirmass, sky.extinctionV]).toEqual([20.0, 0.07, 0.15]);
  });

  it("says in words what is missing: an undescribed custom band, or the site's sky in a custom band", () => {
    expect(bandSkyOf(defaultPhotometrySettings, "custom")).toEqual({ missing: expect.stringContaining("Set the proposal's own band") });
    const described = photometrySettingsSchema.parse({
      customBand: { label: "Hα narrow", effectiveWavelengthNm: 656.3, widthNm: 3, zeroPointWPerM2PerNm: 1.8e-11, zeroPointSystem: "vega", abMinusVegaMag: null },
    });
    expect(bandSkyOf(described, "custom")).toEqual({ missing: "Set the site's dark sky and extinction in Hα narrow in the photometry settings." });
  });
});
