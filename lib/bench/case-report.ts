/**
 * The bench's science case: the sketch is graded by the stored target's own code
 * (`targetCaseReport` of `lib/workspace/derived.ts`), on the hypothesis "Save as target" would store
 * (`hypothesisFromSketch`) and the proposal settings the sketch carries, with the schedule simulated
 * by the same `targetSchedules` the server runs (in a worker on the page). Nothing here grades.
 */

import { NO_SCHEDULE_SENTENCE } from "@/lib/lensing/science-case-words";
import { DEFAULT_COSMOLOGY } from "@/lib/physics";
import type { ObservingSchedule } from "@/lib/schedule";
import { hypothesisFromSketch } from "@/lib/workspace/bench-link";
import { scheduleConditionsOf, targetCaseReport, targetSchedules, type FeasibilitySettings, type TargetCaseReport } from "@/lib/workspace/derived";
import { parsePlainNumber, type SketchInputs } from "./parse-sketch";
import type { Sketch } from "./sketch-state";

/** What the schedule of a sketch needs: the proposal's settings and the target's position (ICRS degrees). */
export interface BenchScheduleRequest {
  settings: FeasibilitySettings;
  target: { raDeg: number; decDeg: number };
}

/** The sketch's schedule as the page has it. */
export type BenchSchedule =
  /** No cycle dates: the sampling questions name what to set. */
  | { status: "none" }
  | { status: "computing" }
  | { status: "done"; schedule: ObservingSchedule }
  | { status: "failed"; message: string };

/** What a sampling question says while the worker simulates the nights. */
export const COMPUTING_SCHEDULE_SENTENCE = "Computing the schedule…";

/** The schedule request of a parsed sketch; null when it has no cycle dates (nothing to simulate). */
export function benchScheduleRequest(inputs: SketchInputs): BenchScheduleRequest | null {
  if (scheduleConditionsOf(inputs.settings) === null) return null;
  return { settings: inputs.settings, target: { raDeg: inputs.event.raDeg, decDeg: inputs.event.decDeg } };
}

/** The schedule of one sketch: the server's `targetSchedules` for a list of one. Run in `workers/schedule.worker.ts`. */
export function benchSchedule({ settings, target }: BenchScheduleRequest): ObservingSchedule {
  const [schedule] = targetSchedules(settings, [target]);
  if (schedule === null) throw new Error("Set the first and last night of the cycle to simulate the schedule.");
  return schedule;
}

/**
 * The sketch's case and answers, exactly as a target with these inputs under a proposal with these
 * settings is graded. While the schedule computes (or when it failed), the questions that need it say
 * so instead of asking for a site and cycle the sketch already has.
 */
export function benchCaseReport(inputs: SketchInputs, schedule: BenchSchedule): TargetCaseReport | null {
  const report = targetCaseReport(hypothesisFromSketch(inputs), inputs.settings, schedule.status === "done" ? schedule.schedule : null);
  if (report === null || schedule.status === "done" || schedule.status === "none") return report;
  const sentence = schedule.status === "computing" ? COMPUTING_SCHEDULE_SENTENCE : `The schedule could not be simulated: ${schedule.message}`;
  return { ...report, answers: report.answers.map((answer) => (answer.sentence === NO_SCHEDULE_SENTENCE ? { ...answer, verdict: "unknown", figure: "—", sentence } : answer)) };
}

/**
 * A redshift sketch in another cosmology than the physics module's default, which a target (and so the
 * case, graded on the target's hypothesis) uses: the page says that the distances differ.
 */
export function usesOtherCosmology(sketch: Sketch): boolean {
  if (sketch.geometry !== "redshift") return false;
  try {
    return parsePlainNumber(sketch.h0) !== DEFAULT_COSMOLOGY.H0 || parsePlainNumber(sketch.om0) !== DEFAULT_COSMOLOGY.Om0;
  } catch {
    // An unreadable H0 or Ωm is its own field's error; the sketch is not graded then.
    return false;
  }
}

/** What the page says when `usesOtherCosmology`. */
export const TARGET_COSMOLOGY_TEXT = `Targets use H0 = ${DEFAULT_COSMOLOGY.H0} km/s/Mpc and Ωm = ${DEFAULT_COSMOLOGY.Om0}: the science case is graded, and a saved target keeps its redshifts, with those values, so its distances differ from this sketch's.`;
