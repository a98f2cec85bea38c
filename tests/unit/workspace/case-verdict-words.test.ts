import { describe, expect, it } from "vitest";
import type { CaseAnswer } from "@/lib/lensing/science-case-questions";
import { answerLine, answersLine, caseVerdictLine } from "@/lib/workspace/case-verdict-words";

const answer = (id: CaseAnswer["id"], question: string, verdict: CaseAnswer["verdict"], figure = "—"): CaseAnswer => ({ id, question, verdict, figure, sentence: `${question}.`, source: "our rule" });

describe("a case's verdict in one line names its questions (issue 16: no unlabeled badges matched to headers)", () => {
  it("names the questions that are not feasible, worst first, each under its verdict", () => {
    const answers = [
      answer("peak-magnification", "Peak magnification", "feasible", "A = 10.04"),
      answer("event-visits", "Visits over the event (t0 ± t_E)", "marginal", "6 visits"),
      answer("peak-window", "Peak in usable time", "infeasible"),
      answer("event-duration", "Event duration against the campaign", "unknown"),
      answer("peak-visits", "Visits over the peak (|t − t0| < t_eff)", "infeasible", "0 visits"),
    ];
    expect(caseVerdictLine("infeasible", answers)).toBe(
      "Not feasible: Peak in usable time, Visits over the peak (|t − t0| < t_eff); Marginal: Visits over the event (t0 ± t_E); Unknown: Event duration against the campaign",
    );
  });

  it("is the verdict alone when every answer is feasible, or when there are no answers", () => {
    expect(caseVerdictLine("feasible", [answer("shadow", "Shadow against λ/B", "feasible", "1.7 λ/B")])).toBe("Feasible");
    expect(caseVerdictLine("unknown", [])).toBe("Unknown");
  });

  it("writes each answer with its verdict and figure, leaving out a figure that is not there", () => {
    expect(answerLine(answer("shadow", "Shadow against λ/B", "marginal", "0.7 λ/B"))).toBe("Shadow against λ/B: Marginal (0.7 λ/B)");
    expect(answersLine([answer("peak-window", "Peak in usable time", "infeasible"), answer("shadow", "Shadow against λ/B", "feasible", "2 λ/B")])).toBe(
      "Peak in usable time: Not feasible; Shadow against λ/B: Feasible (2 λ/B)",
    );
  });
});
