import { describe, expect, it } from "vitest";
import { importFieldKinds, importFields, proposeColumnMapping, proposeNoteColumn, unitChoices, unitChoicesFor, unmappedColumns } from "@/lib/imports/columns";
import { parseCsvTable } from "@/lib/imports/csv";
import { defaultImportFill } from "@/lib/imports/request";
import { validateImportRows } from "@/lib/imports/rows";

describe("unit choices of the mapping step", () => {
  it("every offered unit is read by the import for its field (a cell of 1 in that unit gives a positive finite value)", () => {
    const fields = importFields.filter((field) => unitChoices[importFieldKinds[field]] !== undefined && importFieldKinds[field] !== "epoch" && importFieldKinds[field] !== "magnitude");
    expect(fields.length).toBeGreaterThan(5);
    for (const field of fields) {
      for (const unit of unitChoicesFor(field, undefined)) {
        const table = parseCsvTable(`name,ra,dec,x\nA,10,-20,1`);
        const mapping = { ...proposeColumnMapping(table.columns), [field]: unit === "" ? { column: 3 } : { column: 3, unit } };
        const row = validateImportRows(table, mapping).rows[0];
        const value = row.target?.[field as "lensMassSolar"];
        // A row may still be refused by the physical range (1 kg is no lens); the cell itself must read.
        expect(row.errors.filter((e) => e.includes('(column "x")')), `${field} in ${unit}`).toEqual([]);
        if (value != null) expect(Number.isFinite(value) && value > 0).toBe(true);
      }
    }
  });

  it("a distance in kpc chosen for a unitless column is read as kpc (1 kpc = 1000 pc by definition)", () => {
    const table = parseCsvTable(`name,ra,dec,mass,D_L,D_S\nA,17:56:40,-29:30:00,0.5,4,8`);
    const proposed = proposeColumnMapping(table.columns);
    expect(proposed.lensDistancePc).toEqual({ column: 4, unit: "pc", isUnitAssumed: true });
    const chosen = { ...proposed, lensDistancePc: { column: 4, unit: "kpc" }, sourceDistancePc: { column: 5, unit: "kpc" } };
    const [row] = validateImportRows(table, chosen, defaultImportFill).rows;
    expect(row.errors).toEqual([]);
    expect(row.target).toMatchObject({ lensDistancePc: 4000, sourceDistancePc: 8000 });
  });

  it("the file's own unit is offered first when it is none of the listed ones", () => {
    expect(unitChoicesFor("velocityDispersionKmPerS", "km.s**-1")).toEqual(["km.s**-1", "km/s", "m/s"]);
    expect(unitChoicesFor("lensDistancePc", "kpc")).toEqual(unitChoices.distance);
    expect(unitChoicesFor("ra", "")).toEqual(["", "deg", "h"]);
  });
});

describe("columns the import leaves out are listed by name with what they could be", () => {
  it("names a second magnitude, a notes column, a computed column, a field taken twice and an unknown column", () => {
    const table = parseCsvTable(`name,ra,dec,mag,V_mag,notes,theta_E [mas],target,colour\nA,1,2,18,19,n,0.7,B,red`);
    const mapping = proposeColumnMapping(table.columns);
    const listed = unmappedColumns(table.columns, mapping).map(({ name, reason }) => [name, reason]);
    expect(listed).toEqual([
      ["V_mag", "a magnitude: a target keeps one source magnitude (with its band); not imported"],
      ["notes", "notes: choose it as the first note of each new target; not imported"],
      ...listed.filter(([name]) => name === "theta_E"),
      ["target", 'could be Name, which comes from column "name"; not imported'],
      ["colour", "not imported"],
    ]);
  });

  it("a field's column left unchosen by the user says it could be that field", () => {
    const table = parseCsvTable(`name,ra,dec,mass\nA,1,2,0.5`);
    const { lensMassSolar: _dropped, ...mapping } = proposeColumnMapping(table.columns);
    expect(unmappedColumns(table.columns, mapping)).toEqual([{ column: 3, name: "mass", reason: "could be Lens mass: choose it above; not imported" }]);
  });
});

describe("a notes column read as each new target's first note", () => {
  const table = parseCsvTable(`name,ra,dec,mass,D_L,D_S,Remarks\nA,17:56:40,-29:30:00,0.5,4000,8000,  seen twice  \nB,17:56:41,-29:30:00,0.5,4000,8000,\nC,17:56:42,-29:30:00,0.5,4000,8000,${"x".repeat(20_001)}`);
  const mapping = proposeColumnMapping(table.columns);

  it("is proposed from a notes header and then no longer listed as unmapped", () => {
    expect(proposeNoteColumn(table.columns, mapping)).toBe(6);
    expect(unmappedColumns(table.columns, mapping, 6)).toEqual([]);
  });

  it("gives a row its trimmed note, none for an empty cell, and refuses a note over the notes' 20,000-character limit naming the row and column", () => {
    const rows = validateImportRows(table, mapping, defaultImportFill, 6).rows;
    expect(rows[0]).toMatchObject({ note: "seen twice", errors: [] });
    expect(rows[1].note).toBeUndefined();
    expect(rows[1].errors).toEqual([]);
    expect(rows[2].errors).toEqual(['row 3: Note (column "Remarks") — A note is at most 20,000 characters.']);
  });
});
