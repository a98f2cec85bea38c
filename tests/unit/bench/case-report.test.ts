import { describe, expect, it } from "vitest";
import { benchCaseReport, benchScheduleRequest, COMPUTING_SCHEDULE_SENTENCE, usesOtherCosmology } from "@/lib/bench/case-report";
import { parseSketch } from "@/lib/bench/parse-sketch";
import { demoSketch, type Sketch } from "@/lib/bench/sketch-state";
import { NO_SCHEDULE_SENTENCE } from "@/lib/lensing/science-case-words";

const inputsOf = (changes: Partial<Sketch>) => {
  const parsed = parseSketch({ ...demoSketch, ...changes });
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
  return parsed.inputs;
};

/** The demo event's questions that count visits in the schedule (photometric microlensing). */
const SAMPLING_QUESTIONS = ["event-visits", "peak-visits", "peak-window"];

describe("the bench's science case", () => {
  it("asks for the schedule only with cycle dates, and names what to set without them", () => {
    expect(benchScheduleRequest(inputsOf({}))).toMatchObject({ target: { raDeg: expect.closeTo(269.3017, 4) } });
    expect(benchScheduleRequest(inputsOf({ cycleStart: "", cycleEnd: "" }))).toBeNull();
    const answers = benchCaseReport(inputsOf({ cycleStart: "", cycleEnd: "" }), { status: "none" })!.answers;
    expect(answers.filter((a) => a.sentence === NO_SCHEDULE_SENTENCE).map((a) => a.id)).toEqual(SAMPLING_QUESTIONS);
  });

  it("says the schedule is computing, or why it failed, in the questions that need it, and answers the others", () => {
    const computing = benchCaseReport(inputsOf({}), { status: "computing" })!.answers;
    expect(computing.filter((a) => a.sentence === COMPUTING_SCHEDULE_SENTENCE).map((a) => [a.id, a.verdict])).toEqual(SAMPLING_QUESTIONS.map((id) => [id, "unknown"]));
    expect(computing.find((a) => a.id === "peak-magnification")?.verdict).toBe("feasible");
    const failed = benchCaseReport(inputsOf({}), { status: "failed", message: "The site is never dark." })!.answers;
    expect(failed.find((a) => a.id === "event-visits")?.sentence).toBe("The schedule could not be simulated: The site is never dark.");
  });

  it("uses the team's case when one is chosen, and states the inferred one's reason otherwise", () => {
    const inferred = benchCaseReport(inputsOf({}), { status: "none" })!;
    expect(inferred.scienceCase).toMatchObject({ caseId: "photometric-microlensing", isChosen: false });
    expect(inferred.scienceCase.reason).toMatch(/photometric microlensing event\.$/);
    const chosen = benchCaseReport(inputsOf({ case: "astrometric-microlensing" }), { status: "none" })!;
    expect(chosen.scienceCase).toEqual({ caseId: "astrometric-microlensing", isChosen: true, reason: null });
  });

  it("notes a redshift sketch whose cosmology is not the targets' (H0 = 70, Ωm = 0.3)", () => {
    expect(usesOtherCosmology({ ...demoSketch, geometry: "redshift" })).toBe(false);
    expect(usesOtherCosmology({ ...demoSketch, geometry: "redshift", h0: "67.4" })).toBe(true);
    expect(usesOtherCosmology({ ...demoSketch, geometry: "distance", h0: "67.4" })).toBe(false);
  });
});
