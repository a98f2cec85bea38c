/**
 * Each exported figure's data builder, by figure kind: the table that holds what the figure draws.
 * Every figure kind has one (checked against the figure registries' kinds).
 */
import type { BenchFigureKind } from "@/lib/exports/figures/bench-figures";
import type { SkyFigureKind } from "@/lib/exports/figures/sky-figures";
import type { DataTable } from "@/lib/exports/tables/data-table";
import { astrometricTrackData, deflectionData, lensPlaneData, lightCurveData } from "./bench-data";
import { eventFitData } from "./event-fit-data";
import { nightData, nightSkyData, seasonData } from "./sky-data";

export const figureDataKinds = {
  "lens-plane": lensPlaneData,
  deflection: deflectionData,
  "light-curve": lightCurveData,
  "astrometric-track": astrometricTrackData,
  night: nightData,
  "night-sky": nightSkyData,
  season: seasonData,
  "event-fit": eventFitData,
} as const satisfies Record<BenchFigureKind | SkyFigureKind, (input: never) => DataTable>;

export type FigureDataKind = keyof typeof figureDataKinds;
/** What the builder of figure `K` takes. */
export type FigureDataInput<K extends FigureDataKind> = Parameters<(typeof figureDataKinds)[K]>[0];
