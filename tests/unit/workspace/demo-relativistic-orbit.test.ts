import { describe, expect, it } from "vitest";
import { demoProposal, orbitingStar } from "@/db/seed/demo-scenario";
import { demoCycle, demoInterferometer } from "@/db/seed/demo-sky-cycle";
import { deriveTargetColumns, targetSchedules, type FeasibilitySettings } from "@/lib/workspace/derived";
import { parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";
import { createTargetSchema, lensHypothesisErrors } from "@/lib/workspace/target-schema";
import { defaultPhotometrySettings } from "@/lib/workspace/photometry-schema";

/** The demo's invented orbiting star, as the seed stores it under the demo proposal and its cycle. */
describe("the demo's orbiting star (Larkspur-3 b)", () => {
  const settings: FeasibilitySettings = { site: demoProposal.site, instrument: instrumentSchema.parse({ ...demoProposal.instrument, ...demoInterferometer }), photometry: defaultPhotometrySettings, ...demoCycle };
  const row = { ...orbitingStar, raDeg: parseRightAscensionDeg(orbitingStar.ra), decDeg: parseDeclinationDeg(orbitingStar.dec) };
  const columns = deriveTargetColumns(row, settings, targetSchedules(settings, [row])[0]);
  const answer = (id: string) => columns.caseAnswers.find((a) => a.id === id)!;

  it("is a valid target whose elements the target schema accepts", () => {
    const { notes: _notes, status: _status, ...input } = orbitingStar;
    expect(createTargetSchema.safeParse({ ...input }).success).toBe(true);
    expect(lensHypothesisErrors(orbitingStar)).toEqual({});
  });

  it("answers the relativistic-orbit case with its periapsis in the cycle's season and a redshift a 15 km/s spectrograph detects in one epoch", () => {
    expect(columns.answeredCase).toBe("relativistic-orbit");
    expect(answer("periapsis-season").verdict).toBe("feasible");
    expect(answer("redshift-signal").verdict).toBe("feasible");
    expect(answer("precession-signal").verdict).not.toBe("unknown");
  });
});
