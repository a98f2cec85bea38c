/** Feasibility verdicts of a target against its proposal's instrument defaults. */
export const verdicts = ["feasible", "marginal", "infeasible", "unknown"] as const;
export type Verdict = (typeof verdicts)[number];
