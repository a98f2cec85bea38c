import { describe, expect, it } from "vitest";
import { compactObject, demoProposal, demoShadowProposal, demoTargets, faintCore, type DemoTarget } from "@/db/seed/demo-scenario";
import { demoCycle, demoInterferometer } from "@/db/seed/demo-sky-cycle";
import { deriveTargetColumns, targetSchedules, type FeasibilitySettings } from "@/lib/workspace/derived";
import { parseDeclinationDeg, parseRightAscensionDeg } from "@/lib/workspace/coordinates";
import { instrumentSchema } from "@/lib/workspace/proposal-schema";
import { defaultPhotometrySettings } from "@/lib/workspace/photometry-schema";

/**
 * The demo scenario's answers, as the seed stores them: every demo target has a case, and some fail
 * for a real reason a review panel would accept (issue 16 item 6).
 */
function answersOf(proposal: typeof demoProposal | typeof demoShadowProposal, list: DemoTarget[]) {
  const settings: FeasibilitySettings = { site: proposal.site, instrument: instrumentSchema.parse({ ...proposal.instrument, ...demoInterferometer }), photometry: defaultPhotometrySettings, ...demoCycle };
  const rows = list.map((t) => ({ ...t, raDeg: parseRightAscensionDeg(t.ra), decDeg: parseDeclinationDeg(t.dec) }));
  const schedules = targetSchedules(settings, rows);
  return new Map(rows.map((row, index) => [row.name, deriveTargetColumns(row, settings, schedules[index])]));
}

const main = answersOf(demoProposal, demoTargets);
const shadow = answersOf(demoShadowProposal, [compactObject, faintCore]);
const answer = (columns: ReturnType<typeof deriveTargetColumns> | undefined, id: string) => columns!.caseAnswers.find((a) => a.id === id)!;

describe("the demo proposal's science cases", () => {
  it("gives every demo target a case", () => {
    for (const columns of [...main.values(), ...shadow.values()]) expect(columns.answeredCase).not.toBeNull();
  });

  it("samples the June high-magnification event from the southern site", () => {
    expect(answer(main.get("Cinder Avocet"), "peak-window").verdict).toBe("feasible");
    expect(answer(main.get("Cinder Avocet"), "peak-visits").verdict).toBe("feasible");
  });

  it("fails an event whose peak falls in the bulge's season gap (early February, morning twilight)", () => {
    const gap = answer(main.get("Cinder Godwit"), "peak-window");
    expect(gap.verdict).not.toBe("feasible");
    expect(gap.sentence).toMatch(/season gap/);
    expect(answer(main.get("Cinder Godwit"), "peak-visits").verdict).toBe("infeasible");
  });

  it("fails a time delay longer than the lens's observing season", () => {
    const delay = answer(main.get("Quillfeather Lens"), "delay-season");
    expect(delay.verdict).toBe("infeasible");
    expect(delay.sentence).toMatch(/longer than the target's longest observing season/);
    expect(answer(main.get("Hollowmere Pair"), "delay-season").verdict).toBe("feasible");
  });

  it("grades the dark remnant as astrometric microlensing against 0.1 mas per epoch", () => {
    expect(main.get("Cinder Dunlin")!.answeredCase).toBe("astrometric-microlensing");
    expect(answer(main.get("Cinder Dunlin"), "astrometric-shift").verdict).toBe("feasible");
  });

  it("fails a shadow below λ/B and passes one above it", () => {
    expect(answer(shadow.get("Wick-4 core"), "shadow").verdict).toBe("infeasible");
    expect(answer(shadow.get("K-17 core"), "shadow").verdict).toBe("feasible");
  });
});
