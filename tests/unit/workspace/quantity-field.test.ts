import { describe, expect, it } from "vitest";
import { quantityEcho, readQuantityField } from "@/lib/workspace/quantity-field";
import { createProposalSchema, proposalQuantities } from "@/lib/workspace/proposal-schema";
import { createTargetSchema, targetQuantities } from "@/lib/workspace/target-schema";

const value = (reading: ReturnType<typeof readQuantityField>) => (reading.ok ? reading.value : reading.message);

describe("quantity fields read typed units into the stored unit", () => {
  it.each([
    // SI prefixes (exact): 2.2 µm = 0.0022 mm; c = 299 792 458 m/s exactly (SI definition), so
    // 230 GHz is c/ν = 1.3034454695652173 mm (Python: 299792458 / 230e9 * 1000), stored to 15 digits.
    ["interferometerWavelengthMm", "2.2 um", 0.0022],
    ["interferometerWavelengthMm", "2.2 µm", 0.0022],
    ["interferometerWavelengthMm", "230 GHz", 1.30344546956522],
    ["interferometerWavelengthMm", "1.3", 1.3],
    ["interferometerBaselineKm", "10700", 10700],
    ["interferometerBaselineKm", "1.07e7 m", 10700],
    ["resolutionMas", "50 uas", 0.05],
    ["resolutionMas", "0.05 arcsec", 50],
    ["cadenceHours", "30 min", 0.5],
    ["cadenceHours", "1 d", 24],
    ["campaignLengthDays", "48 h", 2],
    ["latitudeDeg", "-24.6", -24.6],
    ["latitudeDeg", "-24.6 deg", -24.6],
    ["elevationM", "2.6 km", 2600],
    ["elevationM", "-10 m", -10],
    ["elevationM", "0 m", 0],
    ["elevationM", "0", 0],
    ["airmassLimit", "2,5", 2.5],
  ] as const)("proposal %s: %s", (field, text, stored) => {
    expect(value(readQuantityField(proposalQuantities[field], text))).toBe(stored);
  });

  it.each([
    // Thousands groups of three (issue #15: "4,100,000 Msun" was read as 4,100 M☉).
    ["lensMassSolar", "4,100,000 Msun", 4.1e6],
    ["lensMassSolar", "4.1e6 M☉", 4.1e6],
    ["lensMassSolar", "0.5", 0.5],
    ["lensDistancePc", "4 kpc", 4000],
    ["lensDistancePc", "8,1 kpc", 8100],
    ["velocityDispersionKmPerS", "250 km/s", 250],
    ["properMotionMasPerYr", "5 mas/yr", 5],
    ["lensRedshift", "0,5", 0.5],
    ["priority", "3", 3],
  ] as const)("target %s: %s", (field, text, stored) => {
    expect(value(readQuantityField(targetQuantities[field], text))).toBe(stored);
  });

  it("a number from an API client is taken in the stored unit, as before", () => {
    expect(value(readQuantityField(targetQuantities.lensMassSolar, 0.5))).toBe(0.5);
    expect(value(readQuantityField(proposalQuantities.interferometerWavelengthMm, 1.3))).toBe(1.3);
  });
});

describe("a refused quantity says which field, what is wrong and what to type", () => {
  it.each([
    ["lensMassSolar", "5 kpc", /^Lens mass: '5 kpc' is a distance, not a mass.*; type e\.g\. 0\.3 Msun\.$/],
    ["lensMassSolar", "8,125 Msun", /^Lens mass: '8,125 Msun' .*8125.*8\.125/],
    ["lensMassSolar", "lots", /^Lens mass: 'lots' .*; type e\.g\. 0\.3 Msun\.$/],
    ["lensMassSolar", "-2", /^The lens mass is from 1 × 10⁻¹⁵ to 1 × 10¹⁶ solar masses/],
    ["interferometerWavelengthMm", "5 kg", /^Interferometer wavelength: '5 kg' .*; type e\.g\. 1\.3 mm or 230 GHz\.$/],
    ["priority", "2.5", /^Priority is a whole number; Priority runs from 1/],
    ["latitudeDeg", "95", /^Latitude is between -90 and 90 degrees\.$/],
  ] as const)("%s: %s", (field, text, message) => {
    const spec = field in targetQuantities ? targetQuantities[field as keyof typeof targetQuantities] : proposalQuantities[field as keyof typeof proposalQuantities];
    const reading = readQuantityField(spec, text);
    expect(reading.ok).toBe(false);
    expect(reading.ok ? "" : reading.message).toMatch(message);
  });
});

describe("the echo beside a quantity field", () => {
  it("shows the stored value in the stored unit, and says when a bare number took the field's unit", () => {
    const mass = quantityEcho(targetQuantities.lensMassSolar, "4,100,000 Msun");
    expect(mass).toMatchObject({ ok: true });
    expect(mass?.ok && mass.text).toMatch(/^= 4\.1 ?(?:× ?10⁶|e6|e\+6) M☉$/);
    const bare = quantityEcho(targetQuantities.lensMassSolar, "0.5");
    expect(bare?.ok && bare.text).toBe("= 0.5 M☉ (a bare number is read in M☉)");
    const wavelength = quantityEcho(proposalQuantities.interferometerWavelengthMm, "230 GHz");
    expect(wavelength?.ok && wavelength.text).toMatch(/^= 1\.303 mm$/);
    expect(quantityEcho(targetQuantities.lensMassSolar, "")).toBeNull();
    // A plain number shows an echo only when it is read as something other than typed.
    expect(quantityEcho(targetQuantities.priority, "3")).toBeNull();
    expect(quantityEcho(targetQuantities.lensRedshift, "0,5")).toEqual({ ok: true, text: "= 0.5" });
    expect(quantityEcho(targetQuantities.lensMassSolar, "5 kpc")).toMatchObject({ ok: false, message: expect.stringMatching(/^Lens mass: /) });
  });
});

describe("the schemas take typed units and numbers alike", () => {
  it("a target typed with units stores the same numbers as one posted in stored units", () => {
    const base = { name: "T", ra: "17 45 40", dec: "-29 00 28", lensModel: "point", sourceOffsetThetaE: 0.3, priority: 2 } as const;
    const typed = createTargetSchema.parse({ ...base, lensMassSolar: "4,100,000 Msun", lensDistancePc: "8.2 kpc", sourceDistancePc: "8.3 kpc", properMotionMasPerYr: "5 mas/yr" });
    const numeric = createTargetSchema.parse({ ...base, lensMassSolar: 4.1e6, lensDistancePc: 8200, sourceDistancePc: 8300, properMotionMasPerYr: 5 });
    expect(typed).toEqual(numeric);
  });

  it("tags refused by value, not by index (issue #15: 'check tags.1, tags.2')", () => {
    const result = createTargetSchema.safeParse({ name: "T", ra: 10, dec: 10, lensModel: "point", lensMassSolar: 1, lensDistancePc: 1, sourceDistancePc: 2, sourceOffsetThetaE: 0.3, priority: 1, tags: ["ok", "a b!"] });
    expect(result.error?.issues.map((issue) => issue.message)).toEqual(["Tag 'a b!' may use only letters, digits, . + - _."]);
  });

  it("a huge refused tag is quoted in part, not echoed whole", () => {
    const huge = `${"x".repeat(100_000)}!`;
    const result = createTargetSchema.safeParse({ name: "T", ra: 10, dec: 10, lensModel: "point", lensMassSolar: 1, lensDistancePc: 1, sourceDistancePc: 2, sourceOffsetThetaE: 0.3, priority: 1, tags: [huge] });
    const messages = result.error?.issues.map((issue) => issue.message) ?? [];
    expect(messages).toEqual([`Tag '${"x".repeat(20)}…' is longer than 32 characters.`, `Tag '${"x".repeat(20)}…' may use only letters, digits, . + - _.`]);
  });

  it("the proposal's instrument keeps its defaults and nulls", () => {
    const site = { name: "S", latitudeDeg: "-24.6 deg", longitudeDeg: "-70.4", elevationM: "2.6 km", horizonLimitDeg: "20" };
    const parsed = createProposalSchema.parse({ title: "P", cycle: "2031A", site, instrument: { resolutionMas: "50 uas", cadenceHours: "30 min", campaignLengthDays: "90" } });
    expect(parsed.site).toEqual({ name: "S", latitudeDeg: -24.6, longitudeDeg: -70.4, elevationM: 2600, horizonLimitDeg: 20 });
    expect(parsed.instrument).toEqual({
      resolutionMas: 0.05,
      cadenceHours: 0.5,
      campaignLengthDays: 90,
      airmassLimit: 2,
      interferometerWavelengthMm: null,
      interferometerBaselineKm: null,
      moonMinSeparationDeg: 30,
      moonMaxIllumination: null,
      visitMinutes: 20,
      clearNightFraction: 1,
      astrometricPrecisionMas: null,
      reachableContrast: null,
      spectroscopicPrecisionKmPerS: null,
    });
  });

  it("reads the schedule's constraints typed with units: a visit of 1 h is 60 min", () => {
    const site = { name: "S", latitudeDeg: "-24.6", longitudeDeg: "-70.4", elevationM: "2600", horizonLimitDeg: "20" };
    const instrument = { resolutionMas: "50", cadenceHours: "1 d", campaignLengthDays: "90", visitMinutes: "1 h", moonMinSeparationDeg: "0.5 rad", astrometricPrecisionMas: "100 uas" };
    const parsed = createProposalSchema.parse({ title: "P", cycle: "2031A", site, instrument });
    expect(parsed.instrument).toMatchObject({ visitMinutes: 60, astrometricPrecisionMas: 0.1, cadenceHours: 24 });
    // 0.5 rad = 28.6478897565412° (180/π × 0.5).
    expect(parsed.instrument.moonMinSeparationDeg).toBeCloseTo(28.6478897565412, 12);
  });
});
