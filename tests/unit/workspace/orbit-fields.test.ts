import { describe, expect, it } from "vitest";
import { targetBodyOf, SEMI_MAJOR_AXIS_INPUT } from "@/components/targets/target-edit-fields";
import { targetFieldTexts } from "@/components/targets/target-edit-form";
import { createTargetSchema, lensHypothesisErrors, orbitErrors, semiMajorAxisKeyOf, updateTargetSchema } from "@/lib/workspace/target-schema";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";
import type { TargetView } from "@/lib/workspace/target-view";
import { exportRows } from "../exports/fixtures";

/**
 * The orbiting star's fields of a target (the relativistic-orbit case): one semi-major axis input
 * stored in au or as an angle, the other elements with their units and ranges, and the refusals in
 * words. Conversions checked against astropy 5.2.1 (Debian's python3-astropy): 16 yr = 5844 d (Julian
 * year), 0.125 arcsec = 125 mas, Time("2018-05-19 00:00", scale="utc").jd = 2458257.5, 0.1 pc = 20626.48 au.
 */

const typed = { name: "Invented orbit", ra: "17 45 40", dec: "-29 00 28", lensMassSolar: "4e6 Msun", lensDistancePc: "8 kpc", sourceDistancePc: "9 kpc", sourceOffsetThetaE: "1", priority: "1", tags: "" };
const point = { lensModel: "point" as const, lensMassSolar: 4e6, lensDistancePc: 8000, sourceDistancePc: 9000, sourceOffsetThetaE: 1 };
const base = { name: "T", ra: "10 00 00", dec: "-10 00 00", lensModel: "point", lensMassSolar: 4e6, lensDistancePc: 8000, sourceDistancePc: 9000, sourceOffsetThetaE: 1, priority: 1 };

describe("the semi-major axis typed once", () => {
  it("goes to the angle for an angle and to au for anything else", () => {
    expect(["125 mas", "0.125 arcsec", "0.125″", "45 µas", "2 deg"].map(semiMajorAxisKeyOf)).toEqual(Array(5).fill("orbitSemiMajorAxisMas"));
    expect(["1000", "1000 au", "0.1 pc", "xyz", ""].map(semiMajorAxisKeyOf)).toEqual(Array(5).fill("orbitSemiMajorAxisAu"));
  });

  it("the form sends it in the matching field and the other as null; the server stores the matching column", () => {
    const inAu = createTargetSchema.parse(targetBodyOf({ ...typed, [SEMI_MAJOR_AXIS_INPUT]: "0.1 pc" }, "point", "distance"));
    expect(inAu.orbitSemiMajorAxisAu).toBeCloseTo(20626.48062470964, 9);
    expect(inAu.orbitSemiMajorAxisMas).toBeNull();
    const asAngle = createTargetSchema.parse(targetBodyOf({ ...typed, [SEMI_MAJOR_AXIS_INPUT]: "0.125 arcsec" }, "point", "distance"));
    expect([asAngle.orbitSemiMajorAxisAu, asAngle.orbitSemiMajorAxisMas]).toEqual([null, 125]);
    const blank = createTargetSchema.parse(targetBodyOf({ ...typed, [SEMI_MAJOR_AXIS_INPUT]: " " }, "point", "distance"));
    expect([blank.orbitSemiMajorAxisAu, blank.orbitSemiMajorAxisMas]).toEqual([null, null]);
  });

  it("an untouched edit form sends the stored axis back into the same column with the same value", () => {
    for (const axis of [{ orbitSemiMajorAxisAu: 1031.32, orbitSemiMajorAxisMas: null }, { orbitSemiMajorAxisAu: null, orbitSemiMajorAxisMas: 125.058 }]) {
      const stored: TargetView = { ...exportRows[0], lensModel: "point", ...axis, orbitEccentricity: 0.884, orbitPeriapsisJdUtc: 2458257.5, orbitNodeDeg: 228.2 };
      const parsed = createTargetSchema.parse(targetBodyOf(targetFieldTexts(stored), "point", "distance"));
      expect(parsed).toMatchObject({ ...axis, orbitEccentricity: 0.884, orbitPeriapsisJdUtc: 2458257.5, orbitNodeDeg: 228.2 });
    }
  });
});

describe("the orbit's elements", () => {
  it("read with their units: the period in years, T_p as a UTC date or JD, the angles in degrees or radians", () => {
    const parsed = createTargetSchema.parse({ ...base, orbitSemiMajorAxisAu: "1000 au", orbitEccentricity: "0.88", orbitPeriodDays: "16 yr", orbitPeriapsisJdUtc: "2018-05-19", orbitInclinationDeg: "134 deg", orbitNodeDeg: "228", orbitPeriapsisArgumentDeg: `${Math.PI / 2} rad` });
    expect(parsed).toMatchObject({ orbitSemiMajorAxisAu: 1000, orbitEccentricity: 0.88, orbitPeriodDays: 5844, orbitPeriapsisJdUtc: 2458257.5, orbitInclinationDeg: 134, orbitNodeDeg: 228 });
    expect(parsed.orbitPeriapsisArgumentDeg).toBeCloseTo(90, 12);
    expect(updateTargetSchema.parse({ orbitPeriapsisJdUtc: "JD 2458257.5" }).orbitPeriapsisJdUtc).toBe(2458257.5);
  });

  it("are refused outside their ranges in words naming the field", () => {
    const refusal = (field: string, value: unknown) => {
      const result = createTargetSchema.safeParse({ ...base, [field]: value });
      expect(result.success, `${field} ${String(value)}`).toBe(false);
      return result.error!.issues.find((issue) => issue.path[0] === field)!.message;
    };
    expect(refusal("orbitEccentricity", 1)).toBe("The eccentricity is from 0 (a circle) to 0.9999: a bound orbit has e below 1.");
    expect(refusal("orbitEccentricity", -0.1)).toMatch(/^The eccentricity is from 0/);
    expect(refusal("orbitInclinationDeg", "200 deg")).toMatch(/^The inclination is from 0° to 180°/);
    expect(refusal("orbitNodeDeg", 361)).toMatch(/^The longitude of the ascending node Ω is from 0° to 360°/);
    expect(refusal("orbitPeriapsisArgumentDeg", "5 kpc")).toMatch(/^Argument of periapsis ω: '5 kpc' is a distance, not an angle/);
    expect(refusal("orbitSemiMajorAxisAu", "1e6 au")).toMatch(/^The semi-major axis is from 1 × 10⁻⁴ to 100\u202f000 au/);
    expect(refusal("orbitSemiMajorAxisMas", "2 deg")).toMatch(/^The semi-major axis as an angle is from 0.001 to 1\u202f000\u202f000 mas/);
    expect(refusal("orbitPeriodDays", "1e5 yr")).toMatch(/^The orbital period is from 0.001 to 10\u202f000\u202f000 days/);
    expect(refusal("orbitPeriapsisJdUtc", "1850-01-01")).toBe(
      "The time of periapsis must fall between 1900 and 2099 (JD 2415020.5 to 2488069.5); type a UTC date such as 2027-06-15 04:30, or a Julian date such as JD 2461571.69.",
    );
    expect(refusal("orbitPeriapsisJdUtc", "next May")).toMatch(/^The time of periapsis "next May" is not a date/);
  });
});

describe("the checks across fields", () => {
  it("refuse an orbit on a lens that is no point mass, in words naming what to do", () => {
    const sis = { lensModel: "sis" as const, velocityDispersionKmPerS: 250, lensRedshift: 0.4, sourceRedshift: 1.8, sourceOffsetThetaE: 0.3 };
    expect(lensHypothesisErrors({ ...sis, orbitEccentricity: 0.5, orbitNodeDeg: 10 })).toEqual({
      orbitEccentricity: [
        "An orbiting star's elements describe an orbit around a compact mass: this target has a singular isothermal sphere lens. Change its lens model to a point mass, or clear the orbit's fields.",
      ],
    });
    expect(lensHypothesisErrors({ ...point, orbitEccentricity: 0.5, orbitNodeDeg: 10 })).toEqual({});
  });

  it("refuse a semi-major axis given both in au and as an angle", () => {
    expect(orbitErrors({ ...point, orbitSemiMajorAxisAu: 1000, orbitSemiMajorAxisMas: 125 })).toEqual({
      orbitSemiMajorAxisMas: ["Give the semi-major axis in au or as an angle at the lens distance, not both."],
    });
  });
});

describe("the proposal's spectroscopic precision per epoch", () => {
  it("reads km/s or m/s, defaults to unset, and refuses outside 1 m/s to 1000 km/s in words", () => {
    const defaults = { resolutionMas: 50, cadenceHours: 24, campaignLengthDays: 90 };
    expect(instrumentSchema.parse(defaults).spectroscopicPrecisionKmPerS).toBeNull();
    expect(instrumentSchema.parse({ ...defaults, spectroscopicPrecisionKmPerS: "500 m/s" }).spectroscopicPrecisionKmPerS).toBe(0.5);
    const refused = instrumentSchema.safeParse({ ...defaults, spectroscopicPrecisionKmPerS: "2000 km/s" });
    expect(refused.error?.issues[0].message).toBe("The spectroscopic precision per epoch is from 0.001 km/s (1 m/s) to 1000 km/s.");
  });
});
