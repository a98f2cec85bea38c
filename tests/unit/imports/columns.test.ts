import { describe, expect, it } from "vitest";
import { exportColumns } from "@/lib/exports/tables/columns";
import { proposeColumnMapping } from "@/lib/imports/columns";
import { columnFromHeader } from "@/lib/imports/csv";

const fromHeaders = (...headers: string[]) => proposeColumnMapping(headers.map(columnFromHeader));

describe("proposeColumnMapping", () => {
  it("maps common header spellings whatever their case and punctuation (common practice)", () => {
    const mapping = fromHeaders("Target Name", "RA_ICRS", "DEJ2000", "z_lens", "z_s", "Priority", "Tags");
    expect(mapping).toEqual({
      name: { column: 0 },
      ra: { column: 1 },
      dec: { column: 2 },
      lensRedshift: { column: 3 },
      sourceRedshift: { column: 4 },
      priority: { column: 5 },
      tags: { column: 6 },
    });
  });

  it("takes a unit from brackets or a trailing unit word, else assumes the field's unit and says so", () => {
    const mapping = fromHeaders("name", "ra", "dec", "mass [Msun]", "dist_lens_kpc", "D_S", "sigma", "mu_rel");
    expect(mapping.lensMassSolar).toEqual({ column: 3, unit: "Msun" });
    expect(mapping.lensDistancePc).toEqual({ column: 4, unit: "kpc" });
    expect(mapping.sourceDistancePc).toEqual({ column: 5, unit: "pc", isUnitAssumed: true });
    expect(mapping.velocityDispersionKmPerS).toEqual({ column: 6, unit: "km/s", isUnitAssumed: true });
    expect(mapping.properMotionMasPerYr).toEqual({ column: 7, unit: "mas/yr", isUnitAssumed: true });
  });

  it("reads an RA unit (hours) from the header for decimal-hour columns", () => {
    expect(fromHeaders("ra [h]").ra).toEqual({ column: 0, unit: "h" });
  });

  it("uses VOTable UCDs for columns whose names say nothing (IVOA UCD1+ 1.5: pos.eq.ra, pos.eq.dec, meta.id;meta.main)", () => {
    const mapping = proposeColumnMapping([
      { name: "col1", ucd: "meta.id;meta.main" },
      { name: "col2", ucd: "pos.eq.ra;meta.main", unit: "deg" },
      { name: "col3", ucd: "pos.eq.dec;meta.main", unit: "deg" },
      { name: "col4", ucd: "phys.veloc.dispersion", unit: "km.s-1" },
      { name: "col5", ucd: "src.redshift" },
    ]);
    expect(mapping).toEqual({
      name: { column: 0 },
      ra: { column: 1, unit: "deg" },
      dec: { column: 2 },
      velocityDispersionKmPerS: { column: 3, unit: "km.s-1" },
    });
  });

  it("gives a field to the first matching column only, and a column to one field only", () => {
    const mapping = fromHeaders("name", "object", "ra", "dec");
    expect(mapping.name).toEqual({ column: 0 });
    expect(Object.values(mapping).filter((assignment) => assignment?.column === 1)).toEqual([]);
  });

  it("proposes nothing for an ambiguous bare redshift or unknown headers", () => {
    expect(fromHeaders("z", "notes", "remarks")).toEqual({});
  });

  it("maps a lone magnitude column to the source magnitude (dropped silently before the photon budget read it)", () => {
    expect(fromHeaders("name", "magnitude", "notes")).toEqual({ name: { column: 0 }, sourceMagnitude: { column: 1, unit: "mag", isUnitAssumed: true } });
  });
});

describe("a light-curve fit's columns", () => {
  it("map back from this product's own export (VOTable/ECSV names and CSV headers) and from the usual symbols", () => {
    for (const key of ["einsteinTimeDays", "parallaxNorth", "parallaxEast"] as const) {
      const column = exportColumns.find((c) => c.key === key)!;
      expect(fromHeaders("name", "ra", "dec", column.key)[key], column.key).toEqual({ column: 3 });
      expect(fromHeaders("name", "ra", "dec", column.label)[key], column.label).toEqual({ column: 3 });
    }
    expect(fromHeaders("tE", "piEN", "piEE")).toEqual({ einsteinTimeDays: { column: 0 }, parallaxNorth: { column: 1 }, parallaxEast: { column: 2 } });
    // π_E alone is the parallax's length, neither component.
    expect(fromHeaders("piE")).toEqual({});
  });
});

describe("an orbiting star's columns", () => {
  const orbitKeys = ["orbitSemiMajorAxisAu", "orbitSemiMajorAxisMas", "orbitEccentricity", "orbitPeriodDays", "orbitPeriapsisJdUtc", "orbitInclinationDeg", "orbitNodeDeg", "orbitPeriapsisArgumentDeg"] as const;

  it("map back from this product's own export (VOTable/ECSV names and CSV headers)", () => {
    for (const key of orbitKeys) {
      const column = exportColumns.find((c) => c.key === key)!;
      expect(Object.keys(fromHeaders("name", "ra", "dec", column.key)), column.key).toContain(key);
      // The CSV header is the label with its unit in brackets, as the table export writes it.
      const header = column.unit === "" ? column.label : `${column.label} [${column.unit}]`;
      expect(Object.keys(fromHeaders("name", "ra", "dec", header)), header).toContain(key);
    }
  });

  it("read the orbit catalogues' one-letter symbols with their case: a, e, P, Tp, i, Omega, omega", () => {
    const mapping = fromHeaders("a", "e", "P", "Tp", "i", "Omega", "omega");
    expect(mapping).toMatchObject({
      orbitSemiMajorAxisAu: { column: 0 },
      orbitEccentricity: { column: 1 },
      orbitPeriodDays: { column: 2 },
      orbitPeriapsisJdUtc: { column: 3, unit: "JD", isUnitAssumed: true },
      orbitInclinationDeg: { column: 4 },
      orbitNodeDeg: { column: 5 },
      orbitPeriapsisArgumentDeg: { column: 6 },
    });
    expect(fromHeaders("Ω", "ω", "i_deg")).toEqual({ orbitNodeDeg: { column: 0 }, orbitPeriapsisArgumentDeg: { column: 1 }, orbitInclinationDeg: { column: 2 } });
  });

  it("regression: an I-band magnitude column 'I' is no inclination, 'OMEGA' says neither angle, and T0 stays the event peak", () => {
    expect(fromHeaders("I")).toEqual({});
    expect(fromHeaders("OMEGA")).toEqual({});
    expect(fromHeaders("T0")).toEqual({ eventPeakJdUtc: { column: 0, unit: "JD", isUnitAssumed: true } });
  });

  it("take 'a' in mas as the angle at the lens distance, and leave 'a' in arcsec or P in years unmapped rather than misread", () => {
    expect(fromHeaders("a [mas]")).toEqual({ orbitSemiMajorAxisMas: { column: 0 } });
    expect(fromHeaders("a [au]", "a_mas")).toEqual({ orbitSemiMajorAxisAu: { column: 0 }, orbitSemiMajorAxisMas: { column: 1 } });
    expect(fromHeaders("a [arcsec]", "P [yr]")).toEqual({});
    expect(fromHeaders("P [d]")).toEqual({ orbitPeriodDays: { column: 0 } });
  });
});
