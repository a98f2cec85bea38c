/**
 * The settings page's photometry inputs as text and back: each input's name (the API's field path,
 * so a refusal lands beside its input), the stored settings as the inputs' starting text, and the
 * `photometry` object of the settings request, sent complete as typed (the server reads each
 * quantity with its unit). A band's sky row is sent only when the team has made it its own; a row
 * left at, or reset to, the typical dark site is left out, so it follows the built-in values.
 */
import { standardBandIds } from "@/lib/photometry/bands";
import { parseNumber } from "@/lib/physics/units";
import { CUSTOM_BAND_ID, type PhotometrySettings, type photometryQuantities } from "@/lib/workspace/photometry-schema";

/** The settings typed as one quantity each (the per-band sky values are in the sky table). */
export type PhotometrySettingKey = Exclude<keyof typeof photometryQuantities, SkyField>;
type SkyField = "darkSkyMagPerArcsec2" | "extinctionMagPerAirmass";
export const skyFields: readonly SkyField[] = ["darkSkyMagPerArcsec2", "extinctionMagPerAirmass"];

/** In the order the page shows them. */
export const photometrySettingKeys: readonly PhotometrySettingKey[] = [
  "apertureM",
  "centralObstructionM",
  "throughput",
  "readNoiseElectrons",
  "darkElectronsPerSPerPixel",
  "gainElectronsPerAdu",
  "fullWellElectrons",
  "pixelScaleArcsec",
  "seeingFwhmArcsec",
  "apertureRadiusFwhm",
  "overheadS",
  "signalToNoiseGoal",
];

type CustomBandField = keyof NonNullable<PhotometrySettings["customBand"]>;
const customBandNumbers = ["effectiveWavelengthNm", "widthNm", "zeroPointWPerM2PerNm"] as const satisfies readonly CustomBandField[];

/** The bands of the sky table: the built-in ones, then the team's own. */
export const skyBandIds: readonly string[] = [...standardBandIds, CUSTOM_BAND_ID];

/** An input's name: the field's path in the API's answer (`photometry.apertureM`). */
export const photometryInputName = (key: PhotometrySettingKey | "psfShape" | "bandId") => `photometry.${key}`;
export const customBandInputName = (field: CustomBandField) => `photometry.customBand.${field}`;
export const skyInputName = (bandId: string, field: SkyField) => `photometry.skyByBand.${bandId}.${field}`;
/** A hidden input present while a band's sky row is the team's own (edited, or stored so). */
export const skyOwnMarkerName = (bandId: string) => `photometry.skyByBand.${bandId}.own`;

const textOf = (value: number | null) => (value === null ? "" : String(value));

/** The stored settings as each input's starting text, by input name (sky rows are filled by the table). */
export function photometryFieldTexts(p: PhotometrySettings): Record<string, string> {
  const texts: Record<string, string> = {
    [photometryInputName("psfShape")]: p.psfShape,
    [photometryInputName("bandId")]: p.bandId,
  };
  for (const key of photometrySettingKeys) texts[photometryInputName(key)] = textOf(p[key]);
  const custom = p.customBand;
  texts[customBandInputName("label")] = custom?.label ?? "";
  for (const field of customBandNumbers) texts[customBandInputName(field)] = textOf(custom?.[field] ?? null);
  texts[customBandInputName("zeroPointSystem")] = custom?.zeroPointSystem ?? "vega";
  texts[customBandInputName("abMinusVegaMag")] = textOf(custom?.abMinusVegaMag ?? null);
  return texts;
}

const isBlank = (text: string | undefined) => text === undefined || text.trim() === "";

/**
 * The custom band's fields are numbers in the API: what reads as one is sent as it, anything else as
 * typed, so the server names the field and says what it wants.
 */
function numberOrText(text: string | undefined): number | string {
  try {
    return parseNumber(text ?? "");
  } catch {
    return text ?? "";
  }
}

/** The `photometry` object of the settings request, from the form's values by input name. */
export function photometryBody(v: Record<string, string>) {
  const quantities: Partial<Record<PhotometrySettingKey, string | null>> = {};
  for (const key of photometrySettingKeys) quantities[key] = v[photometryInputName(key)] ?? "";
  // No aperture yet is a setting of its own (the photon budget waits for it), not an empty field.
  if (isBlank(quantities.apertureM ?? "")) quantities.apertureM = null;

  const customTexts = [customBandInputName("label"), ...customBandNumbers.map(customBandInputName), customBandInputName("abMinusVegaMag")].map((name) => v[name]);
  const customBand = customTexts.every(isBlank)
    ? null
    : {
        label: v[customBandInputName("label")] ?? "",
        effectiveWavelengthNm: numberOrText(v[customBandInputName("effectiveWavelengthNm")]),
        widthNm: numberOrText(v[customBandInputName("widthNm")]),
        zeroPointWPerM2PerNm: numberOrText(v[customBandInputName("zeroPointWPerM2PerNm")]),
        zeroPointSystem: v[customBandInputName("zeroPointSystem")] ?? "",
        abMinusVegaMag: isBlank(v[customBandInputName("abMinusVegaMag")]) ? null : numberOrText(v[customBandInputName("abMinusVegaMag")]),
      };

  const skyByBand: Record<string, Record<SkyField, string>> = {};
  for (const bandId of skyBandIds) {
    if (v[skyOwnMarkerName(bandId)] === undefined) continue;
    skyByBand[bandId] = { darkSkyMagPerArcsec2: v[skyInputName(bandId, "darkSkyMagPerArcsec2")] ?? "", extinctionMagPerAirmass: v[skyInputName(bandId, "extinctionMagPerAirmass")] ?? "" };
  }

  return {
    ...quantities,
    psfShape: v[photometryInputName("psfShape")],
    bandId: v[photometryInputName("bandId")],
    customBand,
    skyByBand,
  };
}
