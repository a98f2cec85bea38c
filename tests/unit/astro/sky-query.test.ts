import { describe, expect, it } from "vitest";
import { defaultSkyQuery, parseSkyQuery, type SkyQuery } from "@/lib/astro/sky-query";

const base: SkyQuery = defaultSkyQuery("2031-06-15");
const parsedWith = (changes: Partial<SkyQuery>) => parseSkyQuery({ ...base, ...changes });

describe("the sky page reads its site as the proposal settings do (issue 15: one parser for every field)", () => {
  it("takes units, decimal commas and spaced thousands in the site fields", () => {
    // Conversions exact by definition: 1 km = 1000 m (SI); 1 arcmin = 1/60 degree.
    const { value, errors } = parsedWith({ lat: "-27,5", lon: "-66.9 deg", elev: "2.3 km", horizon: "900 arcmin", airmass: "1,5", nights: "183" });
    expect(errors).toBeNull();
    expect(value?.site).toMatchObject({ latitudeDeg: -27.5, longitudeEastDeg: -66.9, elevationM: 2300, horizonLimitDeg: 15 });
    expect(value?.limits.airmassLimit).toBe(1.5);
    expect(parsedWith({ elev: "2 300" }).value?.site.elevationM).toBe(2300);
  });

  it("refuses a lone comma before three digits, offering both readings, instead of reading 2,300 m as 2.3 m", () => {
    const { errors } = parsedWith({ elev: "2,300" });
    expect(errors?.elev).toMatch(/^Elevation: '2,300' .*2300.*2\.3/);
  });

  it("names the field and says what to type, with no variable names", () => {
    const { errors } = parsedWith({ lat: "5 kpc", lon: "", airmass: "a lot", nights: "1,83" });
    expect(errors?.lat).toMatch(/^Latitude: '5 kpc' .*; type e\.g\. -24\.6 deg\.$/);
    expect(errors?.lon).toMatch(/^Longitude is empty; type e\.g\./);
    expect(errors?.airmass).toMatch(/^Airmass limit: 'a lot' /);
    expect(errors?.nights).toBe("The season is a whole number of nights from 1 to 366.");
    for (const message of Object.values(errors ?? {})) expect(message).not.toMatch(/[a-z][A-Z]|Deg\b|NaN|Invalid input/);
  });

  it("keeps the ranges of the site", () => {
    expect(parsedWith({ lat: "95" }).errors?.lat).toBe("Latitude is between -90 and 90 degrees.");
    expect(parsedWith({ horizon: "61 deg" }).errors?.horizon).toBe("The horizon limit is 0 to 60 degrees of altitude.");
  });
});
