import { describe, expect, it } from "vitest";
import { accountSchema } from "@/lib/auth/schemas";
import { accountListQuerySchema } from "@/lib/workspace/admin-schema";
import { createNoteSchema } from "@/lib/workspace/note-schema";
import { createProposalSchema } from "@/lib/workspace/proposal-schema";
import { createTargetSchema } from "@/lib/workspace/target-schema";
import { targetListQuerySchema } from "@/lib/workspace/target-query";

const nul = "\u0000";
const proposal = {
  title: "Arcs",
  cycle: "2033A",
  site: { name: "Mesa Lucerna Station", latitudeDeg: -31.27, longitudeDeg: -68.93, elevationM: 2480, horizonLimitDeg: 20 },
  instrument: { resolutionMas: 50, cadenceHours: 12, campaignLengthDays: 90 },
};
const target = { name: "Cinder Avocet", ra: "17 52 31.8", dec: "-29 41 07", lensModel: "point", lensMassSolar: 0.32, lensDistancePc: 5200, sourceDistancePc: 8100, sourceOffsetThetaE: 0.12, priority: 1 };

/** The path of every issue, joined with dots (the form's field names). */
function refusedFields(result: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }): string[] {
  return result.success ? [] : result.error!.issues.map((issue) => issue.path.join("."));
}

// PostgreSQL's text type cannot hold U+0000 (PostgreSQL manual, "Character Types"): the schema
// refuses it by field, so the database never sees it and the caller gets a 400, not a 500.
describe("text fields refuse the NUL character before it reaches the database", () => {
  it("in a proposal's title, cycle, abstract and site name", () => {
    expect(refusedFields(createProposalSchema.safeParse(proposal))).toEqual([]);
    const hostile = { ...proposal, title: `A${nul}`, cycle: `B${nul}`, abstract: `C${nul}`, site: { ...proposal.site, name: `D${nul}` } };
    expect(refusedFields(createProposalSchema.safeParse(hostile)).sort()).toEqual(["abstract", "cycle", "site.name", "title"]);
  });

  it("in a target's name, a note's body and an account's name", () => {
    expect(refusedFields(createTargetSchema.safeParse({ ...target, name: `x${nul}y` }))).toEqual(["name"]);
    expect(refusedFields(createNoteSchema.safeParse({ body: `x${nul}y` }))).toEqual(["body"]);
    expect(refusedFields(accountSchema.safeParse({ email: "a@example.org", name: `x${nul}`, password: "long-enough-password" }))).toEqual(["name"]);
  });

  it("in the searches of the target table and the accounts list", () => {
    expect(refusedFields(targetListQuerySchema.safeParse({ q: `x${nul}`, tag: `y${nul}` })).sort()).toEqual(["q", "tag"]);
    expect(refusedFields(accountListQuerySchema.safeParse({ q: `x${nul}` }))).toEqual(["q"]);
  });

  it("keeps every other character, SQL-looking text included", () => {
    // (Tabs and line breaks are refused in names: they are one line, see name-text.test.ts.)
    const name = "'); DROP TABLE targets; -- ٢٣ \u200F";
    expect(createTargetSchema.parse({ ...target, name }).name).toBe(name.trim());
  });
});

// Unicode Technical Report #36 (bidirectional text spoofing) and CVE-2021-42574 ("Trojan Source"):
// an override such as U+202E shows "TB-ML\u202E71-1" in another order than it is stored.
describe("names refuse Unicode direction controls; the implicit marks and free text keep them", () => {
  const controls = ["\u202A", "\u202B", "\u202C", "\u202D", "\u202E", "\u2066", "\u2067", "\u2068", "\u2069"];

  it("in a target's name, a proposal's title, cycle and site name, and an account's name", () => {
    for (const control of controls) {
      expect(refusedFields(createTargetSchema.safeParse({ ...target, name: `Cinder${control} Avocet` }))).toEqual(["name"]);
      const hostile = { ...proposal, title: `A${control}b`, cycle: `20${control}33A`, site: { ...proposal.site, name: `Mesa${control} Lucerna` } };
      expect(refusedFields(createProposalSchema.safeParse(hostile)).sort()).toEqual(["cycle", "site.name", "title"]);
      expect(refusedFields(accountSchema.safeParse({ email: "a@example.org", name: `Ilse${control}`, password: "long-enough-password" }))).toEqual(["name"]);
    }
  });

  it("keeps the left-to-right, right-to-left and Arabic letter marks in names, and every control in a note or an abstract", () => {
    const name = "\u05D0\u200E-17 \u200F \u061C";
    expect(createTargetSchema.parse({ ...target, name }).name).toBe(name);
    expect(createNoteSchema.parse({ body: "seeing \u202E0.8" }).body).toBe("seeing \u202E0.8");
    expect(createProposalSchema.parse({ ...proposal, abstract: "\u2067rtl\u2069" }).abstract).toBe("\u2067rtl\u2069");
  });
});
