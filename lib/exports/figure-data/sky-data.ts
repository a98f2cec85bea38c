/**
 * The data behind the sky figures, from the same objects the charts draw: the night's samples
 * (`nightlyVisibility`), the sky brightness through a night (`nightSkyBrightness`) and a season's
 * hours per target and night (`SeasonView`). Every sample at full precision, one row each.
 */
import type { NightVisibility } from "@/lib/astro/visibility";
import type { Provenance } from "@/lib/exports/provenance";
import type { DataColumn, DataTable } from "@/lib/exports/tables/data-table";
import { nightSkyBrightnessTitle } from "@/lib/figures/night-sky-brightness";
import type { SeasonView } from "@/lib/figures/season-view";
import type { NightSkyBrightness } from "@/lib/photometry/night-sky";
import { jdUtcColumn, numberCell, utcIsoColumn, utcIsoOfJd } from "./columns";

const altitudeColumn = (name: string, label: string, description: string): DataColumn => ({ name, label, unit: "deg", voUnit: "deg", ucd: "pos.az.alt", kind: "double", description });

const placeOf = ({ target, site }: Pick<NightVisibility, "target" | "site">) =>
  `${target.name ?? `RA ${target.raDeg}°, Dec ${target.decDeg}°`} from ${site.name ?? `latitude ${site.latitudeDeg}°, longitude ${site.longitudeEastDeg}° E`}`;

/**
 * The night chart: the target's apparent altitude and air mass, the Sun's and the Moon's altitude at
 * every sample of the night, local noon to local noon (the chart shows the part from an hour before
 * sunset to an hour after sunrise).
 */
export function nightData(input: { visibility: NightVisibility; provenance: Provenance }): DataTable {
  const { visibility, provenance } = input;
  const { samples } = visibility;
  return {
    name: "night",
    title: `Altitude and air mass of ${placeOf(visibility)} through the night of ${visibility.nightDateIso}`,
    columns: [
      jdUtcColumn,
      utcIsoColumn,
      altitudeColumn("altitude", "Target altitude", "The target's apparent (refracted) altitude."),
      { name: "airmass", label: "Air mass", unit: "", voUnit: "", ucd: "obs.airMass", kind: "double", description: "Air mass at the target's apparent altitude (Pickering 2002); empty while the target is below the horizon." },
      altitudeColumn("sun_altitude", "Sun altitude", "The Sun's geometric altitude (twilight at -6, -12 and -18 deg)."),
      altitudeColumn("moon_altitude", "Moon altitude", "The Moon's apparent topocentric altitude."),
    ],
    rows: Array.from(samples.jdUtc, (jdUtc, k) => [jdUtc, utcIsoOfJd(jdUtc), samples.altitudeDeg[k], numberCell(samples.airmass[k]), samples.sunAltitudeDeg[k], samples.moonAltitudeDeg[k]]),
    provenance,
  };
}

const surfaceBrightnessColumn = (name: string, label: string, description: string): DataColumn => ({ name, label, unit: "mag/arcsec2", voUnit: "mag/arcsec**2", ucd: "phot.mag.sb", kind: "double", description });

/**
 * The sky brightness figure: at each sample in astronomical darkness with the target up, the sky
 * with the Moon, the moonless sky, the Moon's light alone and how much it brightens the sky.
 */
export function nightSkyData(input: { sky: NightSkyBrightness; provenance: Provenance }): DataTable {
  const { sky, provenance } = input;
  return {
    name: "night_sky",
    title: nightSkyBrightnessTitle(sky),
    columns: [
      jdUtcColumn,
      utcIsoColumn,
      surfaceBrightnessColumn("sky_brightness", "Sky brightness", "Surface brightness of the sky at the target with the Moon, in the band the title and the provenance name (in its own magnitude system)."),
      surfaceBrightnessColumn("dark_sky_brightness", "Dark sky brightness", "The sky at the target without the Moon (Krisciunas & Schaefer 1991 eq. 2)."),
      surfaceBrightnessColumn("moon_sky_brightness", "Moonlight brightness", "The Moon's light alone (Krisciunas & Schaefer 1991 eq. 15, carried to the band); empty while the Moon is down."),
      { name: "moon_brightening", label: "Brightening by the Moon", unit: "mag", voUnit: "mag", ucd: "phot.mag;arith.diff", kind: "double", description: "How much brighter the Moon makes the sky: dark sky less sky with the Moon (0 with the Moon down)." },
    ],
    rows: Array.from(sky.jdUtc, (jdUtc, k) => [
      jdUtc,
      utcIsoOfJd(jdUtc),
      sky.totalMagPerArcsec2[k],
      sky.darkMagPerArcsec2[k],
      numberCell(sky.moonMagPerArcsec2[k]),
      sky.darkMagPerArcsec2[k] - sky.totalMagPerArcsec2[k],
    ]),
    provenance,
  };
}

/**
 * The season chart: one row per target and night (targets in the chart's order, nights in date
 * order) with the usable hours shaded in the cell and whether the Sun rule took time that night.
 */
export function seasonData(input: { view: SeasonView; targetIndices: readonly number[]; provenance: Provenance }): DataTable {
  const { view, targetIndices, provenance } = input;
  const nights = view.nightDatesIso;
  return {
    name: "season",
    title: `Usable hours per target and night, ${nights[0] ?? "no nights"} to ${nights.at(-1) ?? "no nights"} (${nights.length} nights)`,
    columns: [
      { name: "target", label: "Target", unit: "", voUnit: "", ucd: "meta.id", kind: "text", description: "The target's name." },
      { name: "night", label: "Night", unit: "", voUnit: "", ucd: "time.epoch", kind: "text", description: "The night, by the local date of its evening (YYYY-MM-DD)." },
      { name: "usable_hours", label: "Usable hours", unit: "h", voUnit: "h", ucd: "time.duration", kind: "double", description: "Usable hours that night as the chart shades them (a proposal's: its simulated schedule's, in astronomical darkness above the limits with the Sun and Moon rules met)." },
      { name: "too_close_to_sun", label: "Too close to the Sun", unit: "", voUnit: "", ucd: "meta.code", kind: "int", description: "1 when time that night was lost to the Sun rule (the chart hatches the cell), else 0." },
    ],
    rows: targetIndices.flatMap((index) => {
      const row = view.rows[index];
      return nights.map((night, n) => [row.name, night, row.hoursPerNight[n], row.tooCloseToSunPerNight[n]]);
    }),
    provenance,
  };
}
