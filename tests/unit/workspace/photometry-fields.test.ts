import { describe, expect, it } from "vitest";
import { photometryBody, photometryFieldTexts, skyInputName, skyOwnMarkerName } from "@/components/shared/photometry-body";
import { targetBodyOf } from "@/components/targets/target-edit-fields";
import { targetFieldTexts } from "@/components/targets/target-edit-form";
import { typicalDarkSiteConditions } from "@/lib/photometry/bands";
import { defaultPhotometrySettings, photometrySettingsSchema, type PhotometrySettings } from "@/lib/workspace/photometry-schema";
import { createTargetSchema } from "@/lib/workspace/target-schema";
import { exportRows } from "../exports/fixtures";

/** The form's values as the browser sends them: every input's text, sky rows at their typical values. */
function formValuesOf(p: PhotometrySettings): Record<string, string> {
  const values = photometryFieldTexts(p);
  for (const [bandId, typical] of Object.entries(typicalDarkSiteConditions)) {
    const own = p.skyByBand[bandId] ?? typical;
    values[skyInputName(bandId, "darkSkyMagPerArcsec2")] = String(own.darkSkyMagPerArcsec2);
    values[skyInputName(bandId, "extinctionMagPerAirmass")] = String(own.extinctionMagPerAirmass);
  }
  for (const bandId of Object.keys(p.skyByBand)) values[skyOwnMarkerName(bandId)] = "1";
  return values;
}

describe("the settings page's photometry: the request body from the inputs", () => {
  it("an untouched section sends the stored settings back unchanged, the missing aperture as null", () => {
    const body = photometryBody(formValuesOf(defaultPhotometrySettings));
    expect(body.apertureM).toBeNull();
    expect(body.customBand).toBeNull();
    expect(body.skyByBand).toEqual({});
    expect(photometrySettingsSchema.parse(body)).toEqual(defaultPhotometrySettings);
  });

  it("sends the typed text with its unit; the server reads 1.0 m and 2 min", () => {
    const values = { ...formValuesOf(defaultPhotometrySettings), "photometry.apertureM": "1.0 m", "photometry.overheadS": "2 min" };
    const parsed = photometrySettingsSchema.parse(photometryBody(values));
    expect(parsed.apertureM).toBe(1);
    expect(parsed.overheadS).toBe(120);
  });

  it("sends only the sky rows the team made its own; a row at the typical values is left out", () => {
    const values = formValuesOf(defaultPhotometrySettings);
    values[skyInputName("jc-v", "darkSkyMagPerArcsec2")] = "21,2";
    values[skyOwnMarkerName("jc-v")] = "1";
    const parsed = photometrySettingsSchema.parse(photometryBody(values));
    // "21,2" is a decimal comma (lib/physics/quantity-text.ts), and the V row keeps its typical extinction as typed.
    expect(parsed.skyByBand).toEqual({ "jc-v": { darkSkyMagPerArcsec2: 21.2, extinctionMagPerAirmass: typicalDarkSiteConditions["jc-v"].extinctionMagPerAirmass } });
    // The row reset to typical: its marker is gone, so is its entry.
    delete values[skyOwnMarkerName("jc-v")];
    expect(photometrySettingsSchema.parse(photometryBody(values)).skyByBand).toEqual({});
  });

  it("a stored custom band and its own sky row round-trip through the inputs", () => {
    const stored: PhotometrySettings = {
      ...defaultPhotometrySettings,
      apertureM: 1.2,
      bandId: "custom",
      customBand: { label: "Hα narrow", effectiveWavelengthNm: 656.3, widthNm: 3, zeroPointWPerM2PerNm: 1.8e-11, zeroPointSystem: "vega", abMinusVegaMag: null },
      skyByBand: { custom: { darkSkyMagPerArcsec2: 20.5, extinctionMagPerAirmass: 0.08 } },
    };
    const values = formValuesOf(stored);
    values[skyInputName("custom", "darkSkyMagPerArcsec2")] = "20.5";
    values[skyInputName("custom", "extinctionMagPerAirmass")] = "0.08";
    expect(photometrySettingsSchema.parse(photometryBody(values))).toEqual(stored);
  });

  it("a custom band's field that is not a number reaches the server as typed, which names the field", () => {
    const values = { ...formValuesOf(defaultPhotometrySettings), "photometry.customBand.label": "Hα", "photometry.customBand.effectiveWavelengthNm": "red" };
    const result = photometrySettingsSchema.safeParse(photometryBody(values));
    expect(result.success).toBe(false);
    expect(result.error?.issues.find((issue) => issue.path.join(".") === "customBand.effectiveWavelengthNm")?.message).toBe("Effective wavelength: a number of nm.");
  });
});

describe("the target form's source brightness", () => {
  const typed = { name: "OB-31-0042", ra: "17 57 12.4", dec: "-29 12 05", lensMassSolar: "0.3", lensDistancePc: "4000", sourceDistancePc: "8000", sourceOffsetThetaE: "0.1", priority: "2", tags: "" };

  it("sends the magnitude, band and blend fraction as typed; an empty band is the proposal's (null)", () => {
    const parsed = createTargetSchema.parse(targetBodyOf({ ...typed, sourceMagnitude: "19.5", sourceBand: "", blendFraction: "0,6" }, "point", "distance"));
    expect(parsed).toMatchObject({ sourceMagnitude: 19.5, sourceBand: null, blendFraction: 0.6 });
    expect(createTargetSchema.parse(targetBodyOf({ ...typed, sourceBand: "jc-i" }, "point", "distance"))).toMatchObject({ sourceMagnitude: null, sourceBand: "jc-i", blendFraction: null });
  });

  it("an untouched edit form sends the stored magnitude, band and blend fraction back exactly", () => {
    const stored = { ...exportRows[0], sourceMagnitude: 18.37, sourceBand: "sdss-r", blendFraction: 0.125 };
    const parsed = createTargetSchema.parse(targetBodyOf(targetFieldTexts(stored), stored.lensModel, "distance"));
    expect(parsed).toMatchObject({ sourceMagnitude: 18.37, sourceBand: "sdss-r", blendFraction: 0.125 });
  });
});
