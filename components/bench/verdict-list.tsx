import type { Verdict, VerdictOutlook } from "@/lib/bench/verdicts";

/** A word and a symbol for each outlook, so the verdict never depends on colour alone. */
const outlookStyle: Record<VerdictOutlook, { word: string; symbol: string; className: string }> = {
  feasible: { word: "Feasible", symbol: "●", className: "text-glint" },
  marginal: { word: "Marginal", symbol: "◐", className: "text-ember" },
  infeasible: { word: "Not feasible", symbol: "○", className: "text-alarm" },
};

export function VerdictList({ verdicts }: { verdicts: Verdict[] }) {
  return (
    <section aria-label="Feasibility" className="space-y-2 rounded-md border border-void-edge bg-void-raised p-4">
      <h2 className="text-base font-semibold text-dusk">Feasibility</h2>
      <ul className="space-y-1.5">
        {verdicts.map((verdict) => {
          const style = outlookStyle[verdict.outlook];
          return (
            <li key={verdict.id} data-testid={`verdict-${verdict.id}`} className="flex gap-2 text-sm">
              <span aria-hidden="true" className={style.className}>{style.symbol}</span>
              <span>
                <span className={`font-semibold ${style.className}`}>{style.word}:</span> {verdict.text}
              </span>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
